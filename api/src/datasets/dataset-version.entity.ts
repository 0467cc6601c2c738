import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { DatasetMapping, ImportSummary, StoredColumn } from '@provenote/shared';
import type { DatasetFile } from './dataset-file.entity';
import type { Dataset } from './dataset.entity';

/**
 * One immutable import of a file under a confirmed mapping. Studies pin a version by its id; a corrected
 * file becomes the next number, and no row of an existing version is ever changed.
 */
@Entity('dataset_versions')
@Unique('dataset_versions_dataset_number_key', ['datasetId', 'number'])
export class DatasetVersion {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'dataset_id', type: 'uuid' })
  datasetId: string;

  @Column({ name: 'lab_id', type: 'uuid' })
  labId: string;

  @Column({ type: 'integer' })
  number: number;

  @Column({ type: 'text', default: '' })
  note: string;

  @Column({ name: 'file_id', type: 'uuid' })
  fileId: string;

  @Column({ type: 'jsonb' })
  mapping: DatasetMapping;

  /** The measurement columns in the order of dataset_rows' arrays. */
  @Column({ type: 'jsonb' })
  columns: StoredColumn[];

  @Column({ type: 'jsonb' })
  summary: ImportSummary;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @ManyToOne('Dataset', (dataset: Dataset) => dataset.versions, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'dataset_id' })
  dataset: Dataset;

  // NO ACTION (checked at the end of the statement), so deleting a lab can cascade to both tables.
  @ManyToOne('DatasetFile')
  @JoinColumn({ name: 'file_id' })
  file: DatasetFile;
}
