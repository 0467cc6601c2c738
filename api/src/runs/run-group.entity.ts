import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { RunEntity } from './run.entity';

/** The reference groups a run fitted, in the order of every per-group array of its results. */
@Entity('run_groups')
export class RunGroupEntity {
  @PrimaryColumn({ name: 'run_id', type: 'uuid' })
  runId: string;

  @PrimaryColumn({ name: 'group_index', type: 'int' })
  groupIndex: number;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'int' })
  n: number;

  @Column({ name: 'effective_n', type: 'int' })
  effectiveN: number;

  /** Coordinates D² was computed in; the same for every group of a run. */
  @Column({ type: 'text', array: true })
  variables: string[];

  @ManyToOne('RunEntity', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id' })
  run: RunEntity;
}
