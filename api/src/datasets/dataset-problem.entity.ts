import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { DatasetVersion } from './dataset-version.entity';

/** Something the import of a version found and what it did about it, in file order. */
@Entity('dataset_problems')
export class DatasetProblem {
  @PrimaryColumn({ name: 'version_id', type: 'uuid' })
  versionId: string;

  @PrimaryColumn({ type: 'integer' })
  position: number;

  /** Null for the file as a whole. */
  @Column({ name: 'source_row', type: 'integer', nullable: true })
  sourceRow: number | null;

  @Column({ name: 'column_name', type: 'text', nullable: true })
  columnName: string | null;

  @Column({ type: 'text', nullable: true })
  raw: string | null;

  @Column({ type: 'text' })
  code: string;

  @Column({ type: 'text' })
  message: string;

  @Column({ type: 'text' })
  action: string;

  @ManyToOne('DatasetVersion', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'version_id' })
  version: DatasetVersion;
}
