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

  @ManyToOne('RunEntity', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id' })
  run: RunEntity;
}
