import type { Run, RunEvent } from '@provenote/shared';
import type { RunEntity } from './run.entity';

export function toRun(entity: RunEntity): Run {
  return {
    id: entity.id,
    labId: entity.labId,
    studyId: entity.studyId,
    kind: entity.kind,
    status: entity.status,
    progress: entity.progress,
    phase: entity.phase,
    error: entity.error,
    parameters: entity.parameters,
    seed: entity.seed,
    attempt: entity.attempt,
    createdBy: entity.createdBy,
    createdAt: entity.createdAt.toISOString(),
    startedAt: entity.startedAt?.toISOString() ?? null,
    finishedAt: entity.finishedAt?.toISOString() ?? null,
  };
}

export function runToEvent(run: Run): RunEvent {
  return {
    runId: run.id,
    labId: run.labId,
    status: run.status,
    progress: run.progress,
    phase: run.phase,
    error: run.error,
    attempt: run.attempt,
  };
}
