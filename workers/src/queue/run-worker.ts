import type Bull from 'bull';
import type Redis from 'ioredis';
import { EngineError, type RunEvent, type RunJobPayload, type RunKind } from '@provenote/shared';
import { createJobContext, RunCancelledError, type RunEventListener, type RunJobContext } from './job-context';
import { publishRunEvent } from './run-events';
import type { RunQueue } from './run-queue';
import type { RunStore } from './run-store';

/** A processor computes one kind of run and saves its results through the store; it returns their state. */
export type RunProcessor = (context: RunJobContext) => Promise<RunEvent | null>;

export interface RunWorkerOptions {
  readonly queue: RunQueue;
  readonly store: RunStore;
  /** A connection for publishing events and reading cancel flags (not one of Bull's). */
  readonly redis: Redis;
  readonly prefix: string;
  readonly concurrency: number;
  readonly processors: Partial<Record<RunKind, RunProcessor>>;
  /** Called once when a run ends (succeeded, failed or cancelled): the "your run ended" mail. */
  readonly onRunFinished?: RunEventListener;
  readonly progressIntervalMs?: number;
  readonly log?: (message: string) => void;
}

/** Errors a retry cannot fix: the data or the parameters are what they are. */
const isPermanent = (error: unknown) => error instanceof EngineError || error instanceof UnknownRunKindError;

class UnknownRunKindError extends Error {
  constructor(kind: string) {
    super(`runs of kind "${kind}" cannot be computed yet`);
  }
}

const reasonOf = (error: unknown) => (error instanceof Error ? error.message : String(error));

/**
 * Starts processing the run queue with `concurrency` jobs at a time in this process. The lifecycle a
 * run goes through is kept here, so every processor gets it the same way: claim (running), work with
 * checkpoints, then succeeded (written by the processor with its results), cancelled, queued again for
 * a retry, or failed with a readable reason.
 */
export function startRunWorker(options: RunWorkerOptions): void {
  const { queue, store, redis, prefix } = options;
  const log = options.log ?? (() => undefined);
  const publish = async (event: RunEvent | null) => {
    if (!event) return;
    await publishRunEvent(redis, prefix, event);
    if (event.status === 'succeeded' || event.status === 'failed' || event.status === 'cancelled') {
      await Promise.resolve(options.onRunFinished?.(event)).catch((error: unknown) =>
        log(`run ${event.runId}: the end-of-run notice failed: ${reasonOf(error)}`),
      );
    }
  };

  const handle = async (job: Bull.Job<RunJobPayload>) => {
    const { runId } = job.data;
    const run = await store.claim(runId);
    if (!run) return { skipped: true };
    await publish({
      runId,
      labId: run.labId,
      status: 'running',
      progress: 0,
      phase: 'starting',
      error: null,
      attempt: run.attempt,
    });
    const processor = options.processors[job.name as RunKind];
    try {
      if (!processor) throw new UnknownRunKindError(job.name);
      const context = createJobContext(run, store, options);
      await publish(await processor(context));
      return { skipped: false };
    } catch (error) {
      if (error instanceof RunCancelledError) {
        await publish(await store.markCancelled(runId));
        return { cancelled: true };
      }
      const final = isPermanent(error) || job.attemptsMade + 1 >= (job.opts.attempts ?? 1);
      log(`run ${runId} attempt ${run.attempt} failed${final ? '' : ' (will retry)'}: ${reasonOf(error)}`);
      if (final) {
        await job.discard();
        await publish(await store.markFailed(runId, reasonOf(error)));
      } else {
        await publish(await store.requeue(runId, `attempt ${run.attempt} failed: ${reasonOf(error)}; retrying`));
      }
      throw error;
    }
  };

  // A worker that died mid-job: Bull's stalled-job check hands the job to another worker, whose claim
  // starts the next attempt; a job that stalls a second time is failed here.
  queue.on('failed', (job: Bull.Job<RunJobPayload> | null, error: Error) => {
    if (!job || !/stalled more than allowable limit/.test(error.message)) return;
    store
      .markFailed(job.data.runId, 'the workers running it stopped twice; start the run again')
      .then(publish)
      .catch((failure: unknown) => log(`run ${job.data.runId}: could not record the failure: ${reasonOf(failure)}`));
  });

  void queue
    .process('*', options.concurrency, handle)
    .catch((error: unknown) => log(`run worker stopped: ${reasonOf(error)}`));
}
