import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { AssignmentVerdict } from '@provenote/shared';
import type { User } from '../accounts/user.entity';
import type { StudyEntity } from './study.entity';

/**
 * An analyst's final verdict for one unknown of one assign run, kept beside the computed verdict it
 * replaces; the computed one is copied here so the record reads on its own.
 */
@Entity('study_overrides')
@Unique('study_overrides_run_sample_key', ['studyId', 'runId', 'sampleId'])
export class StudyOverrideEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'study_id', type: 'uuid' })
  studyId: string;

  @Column({ name: 'run_id', type: 'uuid' })
  runId: string;

  @Column({ name: 'sample_id', type: 'text' })
  sampleId: string;

  @Column({ name: 'computed_verdict', type: 'text' })
  computedVerdict: AssignmentVerdict;

  @Column({ name: 'computed_group', type: 'text', nullable: true })
  computedGroup: string | null;

  @Column({ type: 'text' })
  verdict: AssignmentVerdict;

  @Column({ name: 'group_name', type: 'text', nullable: true })
  groupName: string | null;

  @Column({ type: 'text' })
  reason: string;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdById: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @ManyToOne('StudyEntity', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'study_id' })
  study: StudyEntity;

  @ManyToOne('User', { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by' })
  createdBy: User | null;
}
