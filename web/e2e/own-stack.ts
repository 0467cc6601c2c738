import { type ChildProcess, spawn, spawnSync } from 'node:child_process';
import { once } from 'node:events';
import { existsSync } from 'node:fs';
import { createServer } from 'node:net';
import { fileURLToPath } from 'node:url';
import yauzl from 'yauzl';

const repoRoot = fileURLToPath(new URL('../../', import.meta.url));

export interface OwnStack {
  baseUrl: string;
  stop(): Promise<void>;
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

/**
 * The built API (serving the built web app, with its embedded worker) on a free port against a freshly
 * seeded database of its own in the cluster `npm test` started — and so a queue of its own, the queue
 * prefix following the database name. The journeys share one such stack (global-setup.ts); a journey that
 * signs the demo study off starts another, so it cannot take that step away from the PI journey.
 */
export async function startOwnStack(database: string): Promise<OwnStack> {
  const clusterUrl = process.env.DATABASE_URL;
  if (!clusterUrl || !process.env.REDIS_URL) {
    throw new Error('The browser journeys need DATABASE_URL and REDIS_URL: run them through `npm test -- e2e`.');
  }
  for (const built of ['api/dist/main.js', 'web/dist/index.html']) {
    if (!existsSync(repoRoot + built)) throw new Error(`${built} is missing: build first (npm test does).`);
  }
  const databaseUrl = new URL(clusterUrl);
  databaseUrl.pathname = `/${database}`;
  const psql = (sql: string) => {
    const result = spawnSync('psql', [clusterUrl, '-qtAc', sql], { encoding: 'utf8' });
    if (result.status !== 0) throw new Error(`psql failed on "${sql}": ${result.stderr}`);
  };
  psql(`DROP DATABASE IF EXISTS ${database} WITH (FORCE)`);
  psql(`CREATE DATABASE ${database}`);

  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const env = {
    ...process.env,
    DATABASE_URL: databaseUrl.toString(),
    PORT: String(port),
    HOST: '127.0.0.1',
    PUBLIC_URL: baseUrl,
    WEB_DIST: repoRoot + 'web/dist',
    MAIL_MODE: 'embedded',
    NODE_ENV: 'production',
  };
  const prepared = spawnSync('node', ['api/dist/cli/prepare-database.js'], { cwd: repoRoot, env, encoding: 'utf8' });
  if (prepared.status !== 0) throw new Error(`prepare-database failed: ${prepared.stderr}`);

  const api: ChildProcess = spawn('node', ['api/dist/main.js'], {
    cwd: repoRoot,
    env,
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  const stop = async () => {
    if (api.exitCode === null) {
      api.kill('SIGTERM');
      await once(api, 'exit');
    }
    psql(`DROP DATABASE IF EXISTS ${database} WITH (FORCE)`);
  };
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (api.exitCode !== null) {
      await stop();
      throw new Error(`The API exited during start-up (code ${api.exitCode})`);
    }
    const ok = await fetch(`${baseUrl}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) return { baseUrl, stop };
    if (Date.now() > deadline) {
      await stop();
      throw new Error('The API did not become healthy within 60 s');
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

/** One entry of a zip, inflated; an archive without it is an error that names it. */
export function readZipEntry(zip: Buffer, name: string): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(zip, { lazyEntries: true }, (openError, file) => {
      if (openError) return reject(openError);
      file.on('error', reject);
      file.on('end', () => reject(new Error(`The bundle has no ${name}`)));
      file.on('entry', (entry: yauzl.Entry) => {
        if (entry.fileName !== name) return file.readEntry();
        file.openReadStream(entry, (streamError, stream) => {
          if (streamError) return reject(streamError);
          const chunks: Buffer[] = [];
          stream.on('data', (chunk: Buffer) => chunks.push(chunk));
          stream.on('error', reject);
          stream.on('end', () => {
            file.close();
            resolve(Buffer.concat(chunks));
          });
        });
      });
      file.readEntry();
    });
  });
}
