import Bull from 'bull';
import { RUN_QUEUE_NAME, type RunJobPayload, type RunKind } from '@provenote/shared';

export type RunQueue = Bull.Queue<RunJobPayload>;

export interface RunQueueOptions {
  readonly redisUrl: string;
  /** Redis key prefix of this installation's queue. */
  readonly prefix: string;
  /**
   * How long a worker's hold on a job lasts without renewal. A worker that dies loses its jobs to
   * another worker after about this long (Bull's stalled-job check runs at the same interval).
   */
  readonly lockDurationMs?: number;
}

/** Attempts per run: a worker crash or a lost database connection gets two more tries. */
export const RUN_ATTEMPTS = 3;
export const RUN_BACKOFF_MS = 2000;

/** The run queue, for the API (to enqueue) and the workers (to process); one definition for both. */
export function createRunQueue({ redisUrl, prefix, lockDurationMs = 30_000 }: RunQueueOptions): RunQueue {
  return new Bull<RunJobPayload>(RUN_QUEUE_NAME, redisUrl, {
    prefix,
    settings: {
      lockDuration: lockDurationMs,
      lockRenewTime: Math.max(250, Math.floor(lockDurationMs / 3)),
      stalledInterval: lockDurationMs,
      // A job whose worker died once is retried; one that stalls twice is failed, not looped forever.
      maxStalledCount: 1,
    },
  });
}

/**
 * Enqueues a run. The job id is the run id, so enqueueing the same run twice (a retried request) adds
 * one job, not two.
 */
export async function enqueueRun(queue: RunQueue, kind: RunKind, runId: string): Promise<void> {
  await queue.add(
    kind,
    { runId },
    {
      jobId: runId,
      attempts: RUN_ATTEMPTS,
      backoff: { type: 'exponential', delay: RUN_BACKOFF_MS },
      removeOnComplete: true,
      removeOnFail: 1000,
    },
  );
}

/**
 * Takes a run that no worker has started off the queue. Returns false when a worker holds it already
 * (then only the cancel flag can stop it).
 */
export async function removeWaitingRun(queue: RunQueue, runId: string): Promise<boolean> {
  const job = await queue.getJob(runId);
  if (!job) return false;
  const state = await job.getState();
  if (state !== 'waiting' && state !== 'delayed' && state !== 'paused') return false;
  // A worker may take the job between the two calls; Bull then refuses to remove a locked job.
  return job.remove().then(
    () => true,
    () => false,
  );
}
