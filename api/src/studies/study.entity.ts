import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  OneToMany,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { Lab } from '../accounts/lab.entity';
import type { User } from '../accounts/user.entity';
import type { StudyStepEntity } from './study-step.entity';

/** One provenance question worked through as a notebook of step cards; belongs to one lab. */
@Entity('studies')
@Index('studies_lab_updated_idx', ['labId', 'updatedAt'])
export class StudyEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'lab_id', type: 'uuid' })
  labId: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text', default: '' })
  description: string;

  @Column({ name: 'owner_id', type: 'uuid', nullable: true })
  ownerId: string | null;

  /** The study whose settings this one started from ("copy with new data"). */
  @Column({ name: 'copied_from_id', type: 'uuid', nullable: true })
  copiedFromId: string | null;

  /** Set once by the PI; from then on nothing in the study may change. */
  @Column({ name: 'signed_off_at', type: 'timestamptz', nullable: true })
  signedOffAt: Date | null;

  @Column({ name: 'signed_off_by', type: 'uuid', nullable: true })
  signedOffById: string | null;

  @Column({ name: 'sign_off_statement', type: 'text', nullable: true })
  signOffStatement: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

  @ManyToOne('Lab', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'lab_id' })
  lab: Lab;

  @ManyToOne('User', { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'owner_id' })
  owner: User | null;

  @ManyToOne('User', { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'signed_off_by' })
  signedOffBy: User | null;

  @OneToMany('StudyStepEntity', (step: StudyStepEntity) => step.study)
  steps: StudyStepEntity[];
}
