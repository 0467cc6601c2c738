import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Lab } from '../accounts/lab.entity';

/**
 * An uploaded file, byte for byte, with its SHA-256. Kept in PostgreSQL (bytea) so a backup of the
 * database holds everything a version was made from; `content` is never loaded unless asked for.
 */
@Entity('dataset_files')
@Index('dataset_files_lab_idx', ['labId', 'createdAt'])
export class DatasetFile {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'lab_id', type: 'uuid' })
  labId: string;

  @Column({ type: 'text' })
  filename: string;

  @Column({ type: 'text' })
  format: 'csv' | 'xlsx';

  @Column({ name: 'size_bytes', type: 'integer' })
  sizeBytes: number;

  @Column({ type: 'text' })
  sha256: string;

  @Column({ type: 'bytea', select: false })
  content: Buffer;

  @Column({ name: 'uploaded_by', type: 'uuid', nullable: true })
  uploadedBy: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @ManyToOne('Lab', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'lab_id' })
  lab: Lab;
}
