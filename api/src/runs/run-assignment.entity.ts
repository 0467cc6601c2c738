import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { RunEntity } from './run.entity';

/** A classified unknown: one row per sample, with D² and both probabilities per group as arrays. */
@Entity('run_assignments')
@Index('run_assignments_probability_idx', ['runId', 'probability', 'ordinal'])
@Index('run_assignments_runner_up_idx', ['runId', 'runnerUpProbability', 'ordinal'])
@Index('run_assignments_verdict_idx', ['runId', 'verdict', 'probability', 'ordinal'])
@Index('run_assignments_group_idx', ['runId', 'groupName', 'probability', 'ordinal'])
@Index('run_assignments_verdict_group_idx', ['runId', 'verdict', 'groupName', 'probability', 'ordinal'])
@Index('run_assignments_sample_idx', ['runId', 'sampleId'])
export class RunAssignmentEntity {
  @PrimaryColumn({ name: 'run_id', type: 'uuid' })
  runId: string;

  @PrimaryColumn({ type: 'int' })
  ordinal: number;

  @Column({ name: 'sample_id', type: 'text' })
  sampleId: string;

  @Column({ type: 'text' })
  verdict: string;

  /** The best group, whatever the verdict. */
  @Column({ name: 'group_name', type: 'text' })
  groupName: string;

  @Column({ type: 'float8' })
  probability: number;

  @Column({ name: 'runner_up', type: 'text', nullable: true })
  runnerUp: string | null;

  @Column({ name: 'runner_up_probability', type: 'float8', nullable: true })
  runnerUpProbability: number | null;

  @Column({ type: 'float8', array: true })
  d2: number[];

  @Column({ name: 'p_chi2', type: 'float8', array: true })
  pChi2: number[];

  @Column({ name: 'p_hotelling', type: 'float8', array: true })
  pHotelling: number[];

  /** Per variable, the share of D² to the best group. */
  @Column({ type: 'float8', array: true })
  contributions: number[];

  @ManyToOne('RunEntity', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id' })
  run: RunEntity;
}
