import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { RunEntity } from './run.entity';

/** A reference member left out of its own group in a group check. */
@Entity('run_check_members')
export class RunCheckMemberEntity {
  @PrimaryColumn({ name: 'run_id', type: 'uuid' })
  runId: string;

  /** Position in the reference input. */
  @PrimaryColumn({ type: 'int' })
  ordinal: number;

  @Column({ name: 'sample_id', type: 'text' })
  sampleId: string;

  @Column({ name: 'group_name', type: 'text' })
  groupName: string;

  @Column({ type: 'float8' })
  d2: number;

  @Column({ name: 'd2_loo', type: 'float8' })
  d2LeaveOneOut: number;

  @Column({ name: 'p_chi2_loo', type: 'float8' })
  pChi2LeaveOneOut: number;

  @Column({ name: 'p_hotelling_loo', type: 'float8' })
  pHotellingLeaveOneOut: number;

  /** own_group, other_group, ambiguous or unassigned. */
  @Column({ type: 'text' })
  outcome: string;

  @Column({ name: 'best_group', type: 'text' })
  bestGroup: string;

  /** Robust D² against the group's FAST-MCD fit; null when the group was too small for one. */
  @Column({ name: 'robust_d2', type: 'float8', nullable: true })
  robustD2: number | null;

  /** Robust D² above χ²_p(0.975); null when the group has no robust fit. */
  @Column({ name: 'robust_outlier', type: 'boolean', nullable: true })
  robustOutlier: boolean | null;

  @ManyToOne('RunEntity', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id' })
  run: RunEntity;
}
