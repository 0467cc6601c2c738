import { type ChildProcess, execFileSync, spawn } from 'node:child_process';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import { createApp } from '../../src/app.factory';
import { loadConfig } from '../../src/config/config';
import { queuePrefix } from '../../src/queue/queue-prefix';
import { RunsService } from '../../src/runs/runs.service';
import { createLabWithMembers } from '../auth-helpers';
import { classifyRequest } from '../run-fixtures';
import { waitForRun } from '../run-waits';
import { createTestApp, type TestApp } from '../test-app';

const repoRoot = join(__dirname, '..', '..', '..');
const ended = (run: { status: string }) => run.status === 'succeeded' || run.status === 'failed';

function startWorker(testApp: TestApp): ChildProcess {
  return spawn('node', [join(repoRoot, 'api/dist/queue/worker-main.js')], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: testApp.config.DATABASE_URL,
      REDIS_URL: testApp.config.REDIS_URL,
      QUEUE_PREFIX: queuePrefix(testApp.config),
      WORKER_CONCURRENCY: '2',
    },
    stdio: 'ignore',
  });
}

const exitOf = (child: ChildProcess) =>
  new Promise<{ code: number | null; signal: string | null }>((resolve) =>
    child.exitCode !== null || child.signalCode !== null
      ? resolve({ code: child.exitCode, signal: child.signalCode })
      : child.once('exit', (code, signal) => resolve({ code, signal })),
  );

async function resultCounts(testApp: TestApp, runId: string) {
  const [counts] = await testApp.app
    .get(DataSource)
    .query(
      `SELECT count(*)::int AS rows, count(DISTINCT ordinal)::int AS samples FROM run_assignments WHERE run_id = $1`,
      [runId],
    );
  return counts as { rows: number; samples: number };
}

describe('restarts with runs queued or in progress', () => {
  let testApp: TestApp;
  const workers: ChildProcess[] = [];

  beforeAll(async () => {
    // The worker processes run the compiled code: bring it up to date first.
    execFileSync('npx', ['tsc', '-b', 'shared', 'workers', 'api'], { cwd: repoRoot, stdio: 'ignore' });
    // This api only enqueues, like an api whose workers are separate processes.
    testApp = await createTestApp({ WORKERS: 'external' });
  }, 180_000);
  /** Closes the api and starts another on the same database and queue, which does or does not run workers. */
  async function restartApi(workersMode: 'embedded' | 'external') {
    await testApp.app.close();
    const config = loadConfig({
      NODE_ENV: 'test',
      DATABASE_URL: testApp.config.DATABASE_URL,
      REDIS_URL: testApp.config.REDIS_URL,
      PORT: '0',
      WORKERS: workersMode,
    });
    testApp.app = await createApp(config, { logger: false });
    await testApp.app.init();
  }

  afterAll(async () => {
    for (const worker of workers) worker.kill('SIGKILL');
    await Promise.all(workers.map(exitOf));
    // testApp.close() would close the first api, already closed by the restart, and leave the current one (and
    // its queue's Redis connections) open.
    await testApp.app.close();
    await testApp.database.drop();
  });

  it('computes the runs queued before an api restart, each once', async () => {
    const { labId, members } = await createLabWithMembers(testApp, ['analyst']);
    const runs = await Promise.all(
      [300, 400, 500].map((n) =>
        testApp.app.get(RunsService).create(labId, members.analyst.user.id, 'analyst', classifyRequest(n)),
      ),
    );
    // The api goes away with the three runs queued; a new one (with embedded workers) starts on the same data.
    await restartApi('embedded');
    for (const [i, run] of runs.entries()) {
      const done = await waitForRun(testApp, run.id, ended, 60_000);
      expect(done).toMatchObject({ status: 'succeeded', attempt: 1 });
      const n = [300, 400, 500][i];
      expect(await resultCounts(testApp, run.id)).toEqual({ rows: n, samples: n });
    }
    await restartApi('external');
  }, 90_000);

  it('on SIGTERM a worker finishes its active run (or leaves it to the next worker) and exits cleanly', async () => {
    const { labId, members } = await createLabWithMembers(testApp, ['analyst']);
    const unknowns = 60_000;
    const run = await testApp.app
      .get(RunsService)
      .create(labId, members.analyst.user.id, 'analyst', classifyRequest(unknowns));
    const waiting = await testApp.app
      .get(RunsService)
      .create(labId, members.analyst.user.id, 'analyst', classifyRequest(200));
    const worker = startWorker(testApp);
    workers.push(worker);
    await waitForRun(testApp, run.id, (r) => r.status === 'running' && r.progress >= 0.1, 60_000);
    const sentAt = Date.now();
    worker.kill('SIGTERM');
    const exit = await exitOf(worker);
    // Nest runs its shutdown hooks on SIGTERM, then raises the signal again to end the process.
    expect([exit.code, exit.signal]).toEqual([null, 'SIGTERM']);
    expect(Date.now() - sentAt).toBeLessThan(60_000);

    // Finished before exiting, or handed back to the queue; never left behind as running.
    const afterShutdown = await waitForRun(testApp, run.id, () => true);
    expect(['succeeded', 'queued']).toContain(afterShutdown.status);
    // Another worker picks up whatever is left; every run ends, once.
    workers.push(startWorker(testApp));
    for (const [id, n] of [
      [run.id, unknowns],
      [waiting.id, 200],
    ] as const) {
      const done = await waitForRun(testApp, id, ended, 90_000);
      expect(done.status).toBe('succeeded');
      expect(await resultCounts(testApp, id)).toEqual({ rows: n, samples: n });
    }
  }, 180_000);
});
