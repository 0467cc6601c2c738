import { randomBytes } from 'node:crypto';
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DataSource } from 'typeorm';
import { createApp } from '../../src/app.factory';
import { type AppConfig, loadConfig } from '../../src/config/config';
import { runMigrations } from '../../src/database/migrate';
import { RunsService } from '../../src/runs/runs.service';
import { createLabWithMembers } from '../auth-helpers';
import { classifyRequest } from '../run-fixtures';
import { waitForRun } from '../run-waits';
import type { TestApp } from '../test-app';

// Plain Node.js module shared with the start and test scripts.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { freePort, startPostgres } = require('../../scripts/local-services.cjs') as {
  freePort(): Promise<number>;
  startPostgres(options: {
    dataDir: string;
    port: number;
    database: string;
    durable: boolean;
    logFile: string;
  }): Promise<{
    url: string;
    stop(): Promise<void>;
  }>;
};

const UNKNOWNS = 80_000;
const ended = (run: { status: string }) => run.status === 'succeeded' || run.status === 'failed';

/**
 * A PostgreSQL cluster of this file's own (the shared test cluster serves other files at the same time),
 * stopped and started again while a run is being computed and written.
 */
describe('PostgreSQL restarted during a run', () => {
  const dir = mkdtempSync(join(tmpdir(), 'provenote-faults-pg-'));
  let options: { dataDir: string; port: number; database: string; durable: boolean; logFile: string };
  let postgres: { url: string; stop(): Promise<void> };
  let app: NestExpressApplication;
  let config: AppConfig;

  beforeAll(async () => {
    // As root the cluster runs as the postgres user, which must be able to enter the folder.
    chmodSync(dir, 0o755);
    options = {
      dataDir: join(dir, 'pg'),
      port: await freePort(),
      database: `faults_${randomBytes(4).toString('hex')}`,
      durable: false,
      logFile: join(dir, 'postgres.log'),
    };
    postgres = await startPostgres(options);
    await runMigrations(postgres.url);
    config = loadConfig({
      NODE_ENV: 'test',
      DATABASE_URL: postgres.url,
      REDIS_URL: process.env.REDIS_URL,
      PORT: '0',
      WORKER_CONCURRENCY: '1',
    });
    app = await createApp(config, { logger: false });
    await app.init();
  }, 60_000);
  afterAll(async () => {
    await app?.close();
    await postgres?.stop();
    rmSync(dir, { recursive: true, force: true });
  });

  it('retries the run once the database is back, ending with exactly one result set', async () => {
    // The helpers only need the app; the database handle is this file's own cluster.
    const testApp = { app, config } as unknown as TestApp;
    const { labId, members } = await createLabWithMembers(testApp, ['analyst']);
    const run = await app.get(RunsService).create(labId, members.analyst.user.id, 'analyst', classifyRequest(UNKNOWNS));
    await waitForRun(testApp, run.id, (r) => r.status === 'running' && r.progress >= 0.1, 60_000);

    await postgres.stop();
    await new Promise((resolve) => setTimeout(resolve, 500));
    postgres = await startPostgres(options);

    const done = await waitForRun(testApp, run.id, ended, 90_000);
    expect(done).toMatchObject({ status: 'succeeded' });
    // A later attempt did the work: the restart did land in the middle of the run.
    expect(done.attempt).toBeGreaterThanOrEqual(2);
    const [counts] = await app
      .get(DataSource)
      .query(
        `SELECT count(*)::int AS rows, count(DISTINCT ordinal)::int AS samples FROM run_assignments WHERE run_id = $1`,
        [run.id],
      );
    expect(counts).toEqual({ rows: UNKNOWNS, samples: UNKNOWNS });
    // The API answers again on the restarted database.
    await members.analyst.agent.get(`/api/labs/${labId}/runs/${run.id}`).expect(200);
  }, 180_000);
});
