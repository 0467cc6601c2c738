import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { RunEntity } from './run.entity';

/** Separation of two reference groups: two-sample Hotelling T². */
@Entity('run_check_pairs')
export class RunCheckPairEntity {
  @PrimaryColumn({ name: 'run_id', type: 'uuid' })
  runId: string;

  @PrimaryColumn({ name: 'group_a', type: 'text' })
  groupA: string;

  @PrimaryColumn({ name: 'group_b', type: 'text' })
  groupB: string;

  @Column({ type: 'float8' })
  t2: number;

  @Column({ type: 'float8' })
  f: number;

  @Column({ type: 'int' })
  df1: number;

  @Column({ type: 'int' })
  df2: number;

  @Column({ type: 'float8' })
  p: number;

  @ManyToOne('RunEntity', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id' })
  run: RunEntity;
}
