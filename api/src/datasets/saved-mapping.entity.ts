import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique, UpdateDateColumn } from 'typeorm';
import type { DatasetMapping } from '@provenote/shared';
import type { Lab } from '../accounts/lab.entity';

/** The last mapping a lab confirmed for a file layout (its header fingerprint), offered for the next such file. */
@Entity('dataset_saved_mappings')
@Unique('dataset_saved_mappings_lab_fingerprint_key', ['labId', 'fingerprint'])
export class SavedMapping {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'lab_id', type: 'uuid' })
  labId: string;

  @Column({ type: 'text' })
  fingerprint: string;

  @Column({ type: 'jsonb' })
  mapping: DatasetMapping;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

  @ManyToOne('Lab', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'lab_id' })
  lab: Lab;
}
