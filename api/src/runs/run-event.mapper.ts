import type { RunEvent, RunStatus } from '@provenote/shared';

/** Columns every status-changing statement returns, so each can hand back the new state in one trip. */
export const RUN_EVENT_COLUMNS = 'id, lab_id, status, progress, phase, error, attempt';

export interface RunEventRow {
  id: string;
  lab_id: string;
  status: RunStatus;
  progress: number;
  phase: string;
  error: string | null;
  attempt: number;
}

export function toRunEvent(row: RunEventRow): RunEvent {
  return {
    runId: row.id,
    labId: row.lab_id,
    status: row.status,
    progress: row.progress,
    phase: row.phase,
    error: row.error,
    attempt: row.attempt,
  };
}
