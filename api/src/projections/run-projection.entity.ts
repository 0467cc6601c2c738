import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { ProjectionMethod, StoredProjection } from '@provenote/shared';
import type { RunEntity } from '../runs/run.entity';

/**
 * One projection of a classify run (principal components or canonical variates), written by the worker
 * with the run's other results. Kept whole as jsonb: it is read whole, by one plot, and never filtered.
 */
@Entity('run_projections')
export class RunProjectionEntity {
  @PrimaryColumn({ name: 'run_id', type: 'uuid', primaryKeyConstraintName: 'PK_run_projections' })
  runId: string;

  @PrimaryColumn({ type: 'text', primaryKeyConstraintName: 'PK_run_projections' })
  method: ProjectionMethod;

  @Column({ type: 'jsonb' })
  data: StoredProjection;

  @ManyToOne('RunEntity', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id', foreignKeyConstraintName: 'FK_run_projections_run' })
  run: RunEntity;
}
