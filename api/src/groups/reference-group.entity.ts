import {
  Column,
  CreateDateColumn,
  Entity,
  JoinColumn,
  ManyToOne,
  OneToMany,
  PrimaryGeneratedColumn,
  Unique,
} from 'typeorm';
import type { Lab } from '../accounts/lab.entity';
import type { GroupVersionEntity } from './group-version.entity';

/** A named source a lab assigns samples to; its membership lives in numbered versions. */
@Entity('reference_groups')
@Unique('reference_groups_lab_name_key', ['labId', 'name'])
export class ReferenceGroupEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'lab_id', type: 'uuid' })
  labId: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text', default: '' })
  description: string;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdById: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @ManyToOne('Lab', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'lab_id' })
  lab: Lab;

  @OneToMany('GroupVersionEntity', (version: GroupVersionEntity) => version.group)
  versions: GroupVersionEntity[];
}
