import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { BundleManifest } from '@provenote/shared';
import type { Lab } from '../accounts/lab.entity';
import type { User } from '../accounts/user.entity';
import type { RunEntity } from '../runs/run.entity';
import type { StudyEntity } from '../studies/study.entity';

/**
 * A result bundle of a study: built by the bundle job (its run fills `content`), or uploaded, verified
 * and restored as a read-only study. The zip is kept in PostgreSQL, byte for byte, with its SHA-256;
 * `content` is never loaded unless asked for.
 */
@Entity('bundles')
@Index('bundles_study_created_idx', ['studyId', 'createdAt'])
export class BundleEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'lab_id', type: 'uuid' })
  labId: string;

  @Column({ name: 'study_id', type: 'uuid' })
  studyId: string;

  @Column({ type: 'text' })
  origin: 'built' | 'uploaded';

  /** The bundle job's run; null for an uploaded bundle. */
  @Index('bundles_run_key', { unique: true })
  @Column({ name: 'run_id', type: 'uuid', nullable: true })
  runId: string | null;

  /** The assign run whose results the bundle carries (built bundles). */
  @Column({ name: 'source_run_id', type: 'uuid', nullable: true })
  sourceRunId: string | null;

  @Column({ type: 'text' })
  filename: string;

  @Column({ type: 'bytea', nullable: true, select: false })
  content: Buffer | null;

  @Column({ name: 'size_bytes', type: 'integer', nullable: true })
  sizeBytes: number | null;

  @Column({ type: 'text', nullable: true })
  sha256: string | null;

  @Column({ type: 'jsonb', nullable: true })
  manifest: BundleManifest | null;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdById: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @ManyToOne('Lab', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'lab_id' })
  lab: Lab;

  @ManyToOne('StudyEntity', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'study_id' })
  study: StudyEntity;

  @ManyToOne('RunEntity', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id' })
  run: RunEntity | null;

  @ManyToOne('User', { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by' })
  createdBy: User | null;
}
