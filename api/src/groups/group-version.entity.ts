import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { User } from '../accounts/user.entity';
import type { ReferenceGroupEntity } from './reference-group.entity';

/**
 * One membership of a reference group: sample ids of one dataset version. Versions are never edited,
 * only added, so a study that used version 3 can always say exactly which samples that was.
 */
@Entity('reference_group_versions')
@Unique('reference_group_versions_group_number_key', ['groupId', 'number'])
export class GroupVersionEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'group_id', type: 'uuid' })
  groupId: string;

  @Column({ type: 'int' })
  number: number;

  @Column({ name: 'dataset_version_id', type: 'uuid' })
  datasetVersionId: string;

  @Column({ type: 'text' })
  source: 'column' | 'manual';

  @Column({ name: 'member_ids', type: 'text', array: true })
  memberIds: string[];

  @Column({ type: 'text', default: '' })
  note: string;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdById: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'approved_at', type: 'timestamptz', nullable: true })
  approvedAt: Date | null;

  @Column({ name: 'approved_by', type: 'uuid', nullable: true })
  approvedById: string | null;

  @ManyToOne('ReferenceGroupEntity', (group: ReferenceGroupEntity) => group.versions, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'group_id' })
  group: ReferenceGroupEntity;

  @ManyToOne('User', { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by' })
  createdBy: User | null;

  @ManyToOne('User', { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'approved_by' })
  approvedBy: User | null;
}
