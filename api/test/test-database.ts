import { randomBytes } from 'node:crypto';
import { Client } from 'pg';
import { runMigrations } from '../src/database/migrate';

const TEMPLATE = 'provenote_template';

function withDatabase(url: string, database: string): string {
  const parsed = new URL(url);
  parsed.pathname = `/${database}`;
  return parsed.toString();
}

async function admin<T>(run: (client: Client) => Promise<T>): Promise<T> {
  const client = new Client({ connectionString: withDatabase(process.env.DATABASE_URL!, 'postgres') });
  await client.connect();
  try {
    return await run(client);
  } finally {
    await client.end();
  }
}

/**
 * A migrated template database, made once per test run by whichever test file gets there first (an
 * advisory lock keeps parallel Jest workers from racing).
 */
async function ensureTemplate(): Promise<void> {
  await admin(async (client) => {
    await client.query('SELECT pg_advisory_lock(724011)');
    try {
      const { rowCount } = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [TEMPLATE]);
      if (rowCount === 0) {
        await client.query(`CREATE DATABASE ${TEMPLATE}`);
        await runMigrations(withDatabase(process.env.DATABASE_URL!, TEMPLATE));
      }
    } finally {
      await client.query('SELECT pg_advisory_unlock(724011)');
    }
  });
}

export interface TestDatabase {
  url: string;
  drop(): Promise<void>;
}

/**
 * A database of its own for one test file: migrated (copied from the template) unless `empty` is set.
 */
export async function createTestDatabase({ empty = false } = {}): Promise<TestDatabase> {
  if (!empty) await ensureTemplate();
  const name = `t_${randomBytes(6).toString('hex')}`;
  await admin(async (client) => {
    // A template copy needs the template to have no other sessions; the lock above serialises creators.
    await client.query('SELECT pg_advisory_lock(724012)');
    try {
      await client.query(empty ? `CREATE DATABASE ${name}` : `CREATE DATABASE ${name} TEMPLATE ${TEMPLATE}`);
    } finally {
      await client.query('SELECT pg_advisory_unlock(724012)');
    }
  });
  return {
    url: withDatabase(process.env.DATABASE_URL!, name),
    drop: () => admin((client) => client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`).then(() => undefined)),
  };
}
