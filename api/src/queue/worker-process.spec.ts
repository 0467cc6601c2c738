import { type ChildProcess, execFileSync, spawn } from 'node:child_process';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import { createLabWithMembers } from '../../test/auth-helpers';
import { classifyRequest } from '../../test/run-fixtures';
import { waitForRun } from '../../test/run-waits';
import { createTestApp, type TestApp } from '../../test/test-app';
import { RunsService } from '../runs/runs.service';
import { queuePrefix } from './queue-prefix';

const repoRoot = join(__dirname, '..', '..', '..');
// Short enough for a quick takeover, long enough that a busy test machine does not look like a dead worker.
const LOCK_MS = 3000;

/** A real `npm run worker` process (the compiled entry), on the test's database and queue. */
function startWorker(testApp: TestApp): ChildProcess {
  return spawn('node', [join(repoRoot, 'api/dist/queue/worker-main.js')], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: testApp.config.DATABASE_URL,
      REDIS_URL: testApp.config.REDIS_URL,
      QUEUE_PREFIX: queuePrefix(testApp.config),
      QUEUE_LOCK_MS: String(LOCK_MS),
      WORKER_CONCURRENCY: '1',
    },
    stdio: 'ignore',
  });
}

const exited = (child: ChildProcess) =>
  new Promise<void>((resolve) =>
    child.exitCode !== null || child.signalCode !== null ? resolve() : child.once('exit', () => resolve()),
  );

describe('a worker process killed mid-run', () => {
  let testApp: TestApp;
  const workers: ChildProcess[] = [];

  beforeAll(async () => {
    // The worker processes run the compiled code: bring it up to date first.
    execFileSync('npx', ['tsc', '-b', 'shared', 'workers', 'api'], { cwd: repoRoot, stdio: 'ignore' });
    testApp = await createTestApp({ WORKERS: 'external', QUEUE_LOCK_MS: String(LOCK_MS) });
  }, 180_000);
  afterAll(async () => {
    for (const worker of workers) worker.kill('SIGKILL');
    await Promise.all(workers.map(exited));
    await testApp.close();
  });

  it('is taken over by another worker, and the run ends with exactly one result set', async () => {
    const { labId, members } = await createLabWithMembers(testApp, ['analyst']);
    const unknowns = 150_000;
    const run = await testApp.app
      .get(RunsService)
      .create(labId, members.analyst.user.id, 'analyst', classifyRequest(unknowns));

    const first = startWorker(testApp);
    workers.push(first);
    await waitForRun(testApp, run.id, (r) => r.status === 'running' && r.progress >= 0.15, 60_000);
    first.kill('SIGKILL');
    await exited(first);
    const afterKill = await waitForRun(testApp, run.id, () => true);
    expect(afterKill.status).toBe('running');

    workers.push(startWorker(testApp));
    const done = await waitForRun(testApp, run.id, (r) => r.status === 'succeeded' || r.status === 'failed', 90_000);
    expect(done).toMatchObject({ status: 'succeeded', attempt: 2 });
    const [counts] = await testApp.app
      .get(DataSource)
      .query(
        `SELECT count(*)::int AS rows, count(DISTINCT ordinal)::int AS samples FROM run_assignments WHERE run_id = $1`,
        [run.id],
      );
    expect(counts).toEqual({ rows: unknowns, samples: unknowns });
  }, 180_000);
});
