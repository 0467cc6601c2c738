import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { RunKind, RunStatus } from '@provenote/shared';
import type { Lab } from '../accounts/lab.entity';
import type { User } from '../accounts/user.entity';

/** One computation on the queue: what, with which parameters, and where it stands. */
@Entity('runs')
@Index('runs_lab_created_idx', ['labId', 'createdAt'])
export class RunEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'lab_id', type: 'uuid' })
  labId: string;

  /** The study card that started the run; nullable until studies exist. */
  @Column({ name: 'study_id', type: 'uuid', nullable: true })
  studyId: string | null;

  @Column({ type: 'text' })
  kind: RunKind;

  @Column({ type: 'text', default: 'queued' })
  status: RunStatus;

  /** Fraction done, 0–1. */
  @Column({ type: 'float8', default: 0 })
  progress: number;

  @Column({ type: 'text', default: 'waiting for a worker' })
  phase: string;

  /** Why the run failed (or why the last attempt did, while it waits for a retry). */
  @Column({ type: 'text', nullable: true })
  error: string | null;

  @Column({ type: 'jsonb' })
  parameters: Record<string, unknown>;

  /** Seed of every random step (the robust fit's subsets), recorded so the run can be repeated. */
  @Column({ type: 'int', nullable: true })
  seed: number | null;

  /** Attempts started so far; a retry or a takeover after a worker died adds one. */
  @Column({ type: 'int', default: 0 })
  attempt: number;

  /** Small result tables that belong to the run as a whole (confusion counts, screening). */
  @Column({ type: 'jsonb', nullable: true })
  summary: Record<string, unknown> | null;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

  @Column({ name: 'started_at', type: 'timestamptz', nullable: true })
  startedAt: Date | null;

  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true })
  finishedAt: Date | null;

  @ManyToOne('Lab', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'lab_id' })
  lab: Lab;

  @ManyToOne('User', { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by' })
  creator: User | null;
}
