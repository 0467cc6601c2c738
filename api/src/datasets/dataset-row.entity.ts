import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { DatasetVersion } from './dataset-version.entity';

/**
 * One sample of a version. Measurements are parallel arrays in the order of the version's `columns`:
 * ppm (null where there is no number), the value as the file gave it, the cell flag (position in the
 * shared `cellFlags` list) and the cell's text wherever it was not a plain number.
 * Written only in bulk (see dataset-rows.store.ts), never row by row.
 */
@Entity('dataset_rows')
export class DatasetRow {
  @PrimaryColumn({ name: 'version_id', type: 'uuid' })
  versionId: string;

  /** 1, 2, … in file order among the imported rows. */
  @PrimaryColumn({ type: 'integer' })
  position: number;

  @Column({ name: 'source_row', type: 'integer' })
  sourceRow: number;

  @Column({ name: 'sample_id', type: 'text' })
  sampleId: string;

  @Column({ name: 'group_name', type: 'text', nullable: true })
  groupName: string | null;

  @Column({ type: 'double precision', array: true })
  ppm: (number | null)[];

  @Column({ type: 'double precision', array: true })
  original: (number | null)[];

  @Column({ type: 'smallint', array: true })
  flags: number[];

  @Column({ type: 'text', array: true })
  raw: (string | null)[];

  @Column({ type: 'jsonb', nullable: true })
  attributes: Record<string, string> | null;

  /**
   * No foreign key: triggers check the version once per statement and delete a version's rows with it
   * (migration DatasetRowsStatementKey, which says why).
   */
  @ManyToOne('DatasetVersion', { createForeignKeyConstraints: false })
  @JoinColumn({ name: 'version_id' })
  version: DatasetVersion;
}
