import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Client } from 'pg';
import { createApp } from '../../src/app.factory';
import { loadConfig } from '../../src/config/config';
import { createLabWithMembers, signIn, type SignedInMember } from '../auth-helpers';
import { createTestDatabase, type TestDatabase } from '../test-database';
import { createTestApp, type TestApp } from '../test-app';

const PG_BIN = process.env.PG_BIN || '/usr/lib/postgresql/15/bin';

/** The commands the README gives, against a database URL (pg_dump and pg_restore take libpq URLs). */
function backup(url: string, file: string) {
  execFileSync(join(PG_BIN, 'pg_dump'), ['--format=custom', `--file=${file}`, `--dbname=${url}`], { stdio: 'pipe' });
}
function restore(url: string, file: string) {
  execFileSync(join(PG_BIN, 'pg_restore'), ['--clean', '--if-exists', '--no-owner', `--dbname=${url}`, file], {
    stdio: 'pipe',
  });
}

/** Row count and a digest of every row of every table. */
async function contents(url: string): Promise<Record<string, string>> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    const { rows: tables } = await client.query<{ table_name: string }>(
      `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' ORDER BY 1`,
    );
    const result: Record<string, string> = {};
    for (const { table_name: table } of tables) {
      const { rows } = await client.query<{ n: number; d: string }>(
        `SELECT count(*)::int AS n, md5(coalesce(string_agg(t::text, '|' ORDER BY t::text), '')) AS d FROM "${table}" t`,
      );
      result[table] = `${rows[0].n}:${rows[0].d}`;
    }
    return result;
  } finally {
    await client.end();
  }
}

describe('backup with pg_dump and restore with pg_restore', () => {
  let testApp: TestApp;
  let target: TestDatabase;
  let analyst: SignedInMember;
  let labId: string;
  const folder = mkdtempSync(join(tmpdir(), 'provenote-backup-'));

  beforeAll(async () => {
    testApp = await createTestApp({ WORKERS: 'external' });
    target = await createTestDatabase({ empty: true });
    const lab = await createLabWithMembers(testApp, ['analyst']);
    labId = lab.labId;
    analyst = lab.members.analyst;
  });
  afterAll(async () => {
    await testApp.close();
    await target.drop();
    rmSync(folder, { recursive: true, force: true });
  });

  it('restores every row of every table, and the restored database serves the same data and sign-ins', async () => {
    const base = `/api/labs/${labId}`;
    const csv = 'Sample,Group,Zr ppm,Rb ppm\nB-1,East,210,45\nB-2,East,<5,n.d.\nB-3,West,95,"1,5"\n';
    const layout = (await analyst.agent.post(`${base}/dataset-files`).attach('file', Buffer.from(csv), 'b.csv')).body;
    const dataset = (
      await analyst.agent
        .post(`${base}/datasets`)
        .send({ name: 'Backed up', kind: 'reference', fileId: layout.file.id, mapping: layout.mapping })
        .expect(201)
    ).body;
    await analyst.agent.post(`${base}/studies`).send({ name: 'Before the backup' }).expect(201);
    const rowsBefore = (await analyst.agent.get(`${base}/datasets/${dataset.id}/versions/1/rows`).expect(200)).body;

    const file = join(folder, 'provenote.dump');
    backup(testApp.config.DATABASE_URL, file);
    expect(statSync(file).size).toBeGreaterThan(1000);
    restore(target.url, file);
    expect(await contents(target.url)).toEqual(await contents(testApp.config.DATABASE_URL));

    // Restoring again over the restored copy (--clean) leaves it the same: the command is safe to repeat.
    restore(target.url, file);
    expect(await contents(target.url)).toEqual(await contents(testApp.config.DATABASE_URL));

    const restoredApp = await createApp(
      loadConfig({
        NODE_ENV: 'test',
        DATABASE_URL: target.url,
        REDIS_URL: process.env.REDIS_URL,
        PORT: '0',
        WORKERS: 'external',
      }),
      { logger: false },
    );
    await restoredApp.init();
    try {
      const agent = await signIn({ ...testApp, app: restoredApp }, analyst.user.email);
      const rowsAfter = (await agent.get(`${base}/datasets/${dataset.id}/versions/1/rows`).expect(200)).body;
      expect(rowsAfter).toEqual(rowsBefore);
      const studies = (await agent.get(`${base}/studies`).expect(200)).body;
      expect(studies.studies.map((s: { name: string }) => s.name)).toEqual(['Before the backup']);
    } finally {
      await restoredApp.close();
    }
  }, 60_000);
});
