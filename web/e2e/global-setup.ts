import { type ChildProcess, spawn, spawnSync } from 'node:child_process';
import { once } from 'node:events';
import { existsSync } from 'node:fs';
import { createServer } from 'node:net';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';

const repoRoot = fileURLToPath(new URL('../../', import.meta.url));

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
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
 * Starts the built API (serving the built web app) on a free port against a database of its own in the
 * cluster `npm test` started, migrated and loaded with the demo lab.
 */
export default async function setup(project: TestProject) {
  const clusterUrl = process.env.DATABASE_URL;
  if (!clusterUrl || !process.env.REDIS_URL) {
    throw new Error('The browser journeys need DATABASE_URL and REDIS_URL: run them through `npm test -- e2e`.');
  }
  for (const built of ['api/dist/main.js', 'web/dist/index.html']) {
    if (!existsSync(repoRoot + built)) throw new Error(`${built} is missing: build first (npm test does).`);
  }
  const databaseUrl = new URL(clusterUrl);
  databaseUrl.pathname = '/provenote_e2e';
  const psql = (sql: string) => spawnSync('psql', [clusterUrl, '-qtAc', sql], { encoding: 'utf8' });
  psql('DROP DATABASE IF EXISTS provenote_e2e WITH (FORCE)');
  psql('CREATE DATABASE provenote_e2e');

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
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (api.exitCode !== null) throw new Error(`The API exited during start-up (code ${api.exitCode})`);
    const ok = await fetch(`${baseUrl}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) break;
    if (Date.now() > deadline) throw new Error('The API did not become healthy within 60 s');
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  project.provide('baseUrl', baseUrl);

  return async () => {
    api.kill('SIGTERM');
    if (api.exitCode === null) await once(api, 'exit');
    psql('DROP DATABASE IF EXISTS provenote_e2e WITH (FORCE)');
  };
}
