import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  OneToMany,
  PrimaryGeneratedColumn,
} from 'typeorm';
import type { DatasetKind } from '@provenote/shared';
import type { Lab } from '../accounts/lab.entity';
import type { DatasetVersion } from './dataset-version.entity';

/** A named body of data in a lab; its contents live in immutable versions. */
@Entity('datasets')
@Index('datasets_lab_idx', ['labId', 'createdAt'])
export class Dataset {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'lab_id', type: 'uuid' })
  labId: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  kind: DatasetKind;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @ManyToOne('Lab', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'lab_id' })
  lab: Lab;

  @OneToMany('DatasetVersion', (version: DatasetVersion) => version.dataset)
  versions: DatasetVersion[];
}
