import { randomUUID } from 'node:crypto';
import Redis from 'ioredis';
import type { RunEvent, RunStatus } from '@provenote/shared';
import {
  createRunQueue,
  enqueueRun,
  RUN_BACKOFF_MS,
  runEventsChannel,
  startRunWorker,
  type ClaimedRun,
  type RunProcessor,
  type RunQueue,
  type RunStore,
} from '@provenote/workers';

/** Runs kept in memory: the queue mechanics are under test here, not PostgreSQL. */
class MemoryRunStore implements RunStore {
  readonly runs = new Map<string, { status: RunStatus; attempt: number; error: string | null; progress: number }>();

  add(): string {
    const id = randomUUID();
    this.runs.set(id, { status: 'queued', attempt: 0, error: null, progress: 0 });
    return id;
  }

  private event(id: string): RunEvent {
    const run = this.runs.get(id)!;
    return {
      runId: id,
      labId: id,
      status: run.status,
      progress: run.progress,
      phase: '',
      error: run.error,
      attempt: run.attempt,
    };
  }

  private move(id: string, from: RunStatus[], to: RunStatus, error: string | null = null) {
    const run = this.runs.get(id);
    if (!run || !from.includes(run.status)) return null;
    Object.assign(run, { status: to, error, progress: to === 'succeeded' ? 1 : run.progress });
    return this.event(id);
  }

  async claim(id: string): Promise<ClaimedRun | null> {
    const run = this.runs.get(id);
    if (!run || !['queued', 'running'].includes(run.status)) return null;
    run.status = 'running';
    run.attempt++;
    const parameters = {
      elements: ['x'],
      transform: 'none',
      belowDetection: 'dl-half',
      covariance: 'classic',
      probability: 'chi2',
      alpha: 0.05,
    } as const;
    return { id, labId: id, kind: 'classify', parameters, seed: null, attempt: run.attempt };
  }
  loadSamples(): never {
    throw new Error('not used');
  }
  async saveProgress(id: string, progress: number) {
    const run = this.runs.get(id);
    if (run?.status !== 'running') return null;
    run.progress = progress;
    return this.event(id);
  }
  async saveClassifyResults(id: string) {
    return this.move(id, ['running'], 'succeeded');
  }
  saveGroupCheckResults = this.saveClassifyResults;
  async requeue(id: string, reason: string) {
    return this.move(id, ['running'], 'queued', reason);
  }
  async markFailed(id: string, reason: string) {
    return this.move(id, ['queued', 'running'], 'failed', reason);
  }
  async markCancelled(id: string) {
    return this.move(id, ['queued', 'running'], 'cancelled');
  }
}

const until = async (check: () => boolean, timeoutMs = 15_000) => {
  const deadline = Date.now() + timeoutMs;
  while (!check()) {
    if (Date.now() > deadline) throw new Error('timed out');
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
};

describe('the run worker on a real Redis', () => {
  const prefix = `test-run-worker-${randomUUID()}`;
  let queue: RunQueue;
  let redis: Redis;
  let listener: Redis;
  const events: RunEvent[] = [];
  const store = new MemoryRunStore();
  const behaviour = new Map<string, RunProcessor>();
  let active = 0;
  let mostActive = 0;

  beforeAll(async () => {
    redis = new Redis(process.env.REDIS_URL!);
    listener = new Redis(process.env.REDIS_URL!);
    listener.on('message', (_channel: string, message: string) => events.push(JSON.parse(message)));
    await listener.subscribe(runEventsChannel(prefix));
    queue = createRunQueue({ redisUrl: process.env.REDIS_URL!, prefix, lockDurationMs: 2000 });
    startRunWorker({
      queue,
      store,
      redis,
      prefix,
      concurrency: 2,
      progressIntervalMs: 0,
      processors: { classify: (context) => behaviour.get(context.run.id)!(context) },
    });
  });
  afterAll(async () => {
    await queue.close();
    await Promise.all([redis.quit(), listener.quit()]);
  });

  it('runs at most `concurrency` jobs at a time and relays their progress', async () => {
    const ids = [store.add(), store.add(), store.add(), store.add()];
    for (const id of ids) {
      behaviour.set(id, async ({ run, store: s, checkpoint }) => {
        active++;
        mostActive = Math.max(mostActive, active);
        for (let step = 1; step <= 3; step++) {
          await new Promise((resolve) => setTimeout(resolve, 60));
          await checkpoint(step / 4, `step ${step}`);
        }
        active--;
        return s.saveClassifyResults(run.id, undefined as never);
      });
      await enqueueRun(queue, 'classify', id);
    }
    await until(() => ids.every((id) => store.runs.get(id)!.status === 'succeeded'));
    expect(mostActive).toBe(2);
    const ofFirst = events.filter((e) => e.runId === ids[0]);
    expect(ofFirst.map((e) => e.progress)).toEqual([0, 0.25, 0.5, 0.75, 1]);
    expect(ofFirst.map((e) => e.status)).toEqual(['running', 'running', 'running', 'running', 'succeeded']);
  });

  it('enqueues a run once however often it is enqueued', async () => {
    const id = store.add();
    let calls = 0;
    behaviour.set(id, async ({ run, store: s }) => {
      calls++;
      return s.saveClassifyResults(run.id, undefined as never);
    });
    await Promise.all([enqueueRun(queue, 'classify', id), enqueueRun(queue, 'classify', id)]);
    await until(() => store.runs.get(id)!.status === 'succeeded');
    expect(calls).toBe(1);
  });

  it('retries a failed attempt after the backoff and keeps the reason until it succeeds', async () => {
    const id = store.add();
    const starts: number[] = [];
    behaviour.set(id, async ({ run, store: s }) => {
      starts.push(Date.now());
      if (starts.length === 1) throw new Error('database connection lost');
      return s.saveClassifyResults(run.id, undefined as never);
    });
    await enqueueRun(queue, 'classify', id);
    await until(() => store.runs.get(id)!.status === 'queued' && starts.length === 1);
    expect(store.runs.get(id)!.error).toBe('attempt 1 failed: database connection lost; retrying');
    await until(() => store.runs.get(id)!.status === 'succeeded');
    expect(store.runs.get(id)!.attempt).toBe(2);
    // Bull's exponential backoff: (2^1 − 1) · delay before the second attempt.
    expect(starts[1] - starts[0]).toBeGreaterThanOrEqual(RUN_BACKOFF_MS - 50);
  });

  it('fails after the last attempt with the reason of the last error', async () => {
    const id = store.add();
    behaviour.set(id, async ({ run }) => {
      throw new Error(`disk full on attempt ${run.attempt}`);
    });
    await enqueueRun(queue, 'classify', id);
    await until(() => store.runs.get(id)!.status === 'failed', 20_000);
    expect(store.runs.get(id)).toMatchObject({ attempt: 3, error: 'disk full on attempt 3' });
  }, 30_000);
});
