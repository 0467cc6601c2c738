import type Redis from 'ioredis';
import type { RunEvent } from '@provenote/shared';
import { isCancelRequested, publishRunEvent } from './run-events';
import type { ClaimedRun, RunStore } from './run-store';

/** Thrown inside a processor when the run's cancel flag is seen; ends the job without a retry. */
export class RunCancelledError extends Error {
  constructor(readonly runId: string) {
    super(`run ${runId} was cancelled`);
    this.name = 'RunCancelledError';
  }
}

/** What a processor gets besides its run: the store, and a checkpoint to call between chunks of work. */
export interface RunJobContext {
  readonly run: ClaimedRun;
  readonly store: RunStore;
  /**
   * Reports progress (fraction 0–1 and a short phase text), lets the event loop breathe (so Bull can
   * renew the job's lock) and throws RunCancelledError when the run was cancelled.
   */
  checkpoint(progress: number, phase: string): Promise<void>;
}

export interface CheckpointOptions {
  readonly redis: Redis;
  readonly prefix: string;
  /** Progress reaches the database and the browsers at most this often, phase changes always. */
  readonly progressIntervalMs?: number;
}

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

export function createJobContext(run: ClaimedRun, store: RunStore, options: CheckpointOptions): RunJobContext {
  const interval = options.progressIntervalMs ?? 250;
  let lastPhase = '';
  let lastReport = 0;
  return {
    run,
    store,
    async checkpoint(progress, phase) {
      await yieldToEventLoop();
      if (await isCancelRequested(options.redis, options.prefix, run.id)) throw new RunCancelledError(run.id);
      const now = Date.now();
      if (phase === lastPhase && now - lastReport < interval) return;
      lastPhase = phase;
      lastReport = now;
      const event = await store.saveProgress(run.id, Math.min(1, Math.max(0, progress)), phase);
      if (!event) throw new RunCancelledError(run.id);
      await publishRunEvent(options.redis, options.prefix, event);
    },
  };
}

export type RunEventListener = (event: RunEvent) => void | Promise<void>;
