import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { RunEntity } from './run.entity';

/**
 * The run's input snapshot, one row per sample: what the job reads by run id, whatever later happens
 * to the datasets it came from. Values follow the run's element order.
 */
@Entity('run_inputs')
export class RunInputEntity {
  @PrimaryColumn({ name: 'run_id', type: 'uuid' })
  runId: string;

  /** reference or unknown. */
  @PrimaryColumn({ type: 'text' })
  role: string;

  /** Position in the input, from 0. */
  @PrimaryColumn({ type: 'int' })
  ordinal: number;

  @Column({ name: 'sample_id', type: 'text' })
  sampleId: string;

  @Column({ name: 'group_label', type: 'text', nullable: true })
  groupLabel: string | null;

  @Column({ type: 'float8', array: true })
  values: number[];

  /** true where the value is a detection limit, not a measurement. */
  @Column({ name: 'below_detection', type: 'boolean', array: true })
  belowDetection: boolean[];

  @ManyToOne('RunEntity', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id' })
  run: RunEntity;
}
