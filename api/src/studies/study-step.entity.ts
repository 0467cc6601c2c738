import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique, UpdateDateColumn } from 'typeorm';
import type { StepKey, StepStatus } from '@provenote/shared';
import type { User } from '../accounts/user.entity';
import type { StudyEntity } from './study.entity';

/** One card of a study's notebook: its settings, where it stands, and the run holding its results. */
@Entity('study_steps')
@Unique('study_steps_study_key_key', ['studyId', 'key'])
export class StudyStepEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'study_id', type: 'uuid' })
  studyId: string;

  @Column({ type: 'text' })
  key: StepKey;

  /** 0 for the top card; the stale rule reads the cards in this order. */
  @Column({ type: 'smallint' })
  position: number;

  @Column({ type: 'text', default: 'not_run' })
  status: StepStatus;

  /** The card's settings as its zod schema checked them; null until first saved. */
  @Column({ type: 'jsonb', nullable: true })
  parameters: object | null;

  /** The run that computed (or is computing) this card's results; a run is never deleted under a study. */
  @Column({ name: 'run_id', type: 'uuid', nullable: true })
  runId: string | null;

  @Column({ type: 'text', nullable: true })
  error: string | null;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

  @Column({ name: 'updated_by', type: 'uuid', nullable: true })
  updatedById: string | null;

  @ManyToOne('StudyEntity', (study: StudyEntity) => study.steps, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'study_id' })
  study: StudyEntity;

  @ManyToOne('User', { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'updated_by' })
  updatedBy: User | null;
}
