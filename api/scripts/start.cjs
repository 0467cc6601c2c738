'use strict';
/**
 * `npm start`: the whole product on this machine with demo data. Installs what is missing, starts
 * PostgreSQL and Redis on loopback with their data in .data/, migrates, seeds, builds, and serves the web
 * app and the API on one origin. Ctrl-C stops everything it started.
 *
 * `npm run dev` does the same but serves the web app from Vite's dev server with hot reload.
 *
 * DATABASE_URL, REDIS_URL and SMTP_URL point it at existing servers instead of starting its own.
 */
const { spawn } = require('node:child_process');
const fs = require('node:fs');
const path = require('node:path');
const services = require('./local-services.cjs');
const { repoRoot, ensureDependencies, buildServer, buildWeb, capture } = require('./workspace.cjs');

const dev = process.argv.includes('--dev');
const port = Number(process.env.PORT ?? 8080);
const host = process.env.HOST ?? '127.0.0.1';
const dataDir = path.join(repoRoot, '.data');
const log = (message) => console.log(`[provenote] ${message}`);

const stoppers = [];
let stopping = false;

async function stopAll(code) {
  if (stopping) return;
  stopping = true;
  log('Stopping…');
  for (const stop of stoppers.reverse()) await stop().catch((error) => console.error(error));
  process.exit(code);
}
process.on('SIGINT', () => stopAll(0));
process.on('SIGTERM', () => stopAll(0));

function startChild(name, command, args, options) {
  const child = spawn(command, args, { cwd: repoRoot, stdio: 'inherit', ...options });
  child.once('exit', (code, signal) => {
    if (!stopping) {
      console.error(`[provenote] ${name} exited unexpectedly (${signal ?? `code ${code}`}).`);
      stopAll(1);
    }
  });
  stoppers.push(
    () =>
      new Promise((resolve) => {
        if (child.exitCode !== null || child.signalCode !== null) return resolve();
        const timer = setTimeout(() => child.kill('SIGKILL'), 15_000);
        child.once('exit', () => {
          clearTimeout(timer);
          resolve();
        });
        child.kill('SIGTERM');
      }),
  );
  return child;
}

async function waitForHealth(url, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 300));
  }
  throw new Error(`The API did not answer ${url} within ${timeoutMs / 1000} s`);
}

async function main() {
  await ensureDependencies(log);
  const needed = [];
  if (!process.env.DATABASE_URL) needed.push('postgres');
  if (!process.env.REDIS_URL) needed.push('redis');
  services.ensureSystemPackages(needed, log);
  fs.mkdirSync(dataDir, { recursive: true });

  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const pg = await services.startPostgres({
      dataDir: path.join(dataDir, 'pg'),
      port: Number(process.env.PROVENOTE_PG_PORT ?? 54329),
      logFile: path.join(dataDir, 'postgres.log'),
    });
    stoppers.push(pg.stop);
    databaseUrl = pg.url;
    log(`PostgreSQL on ${databaseUrl} (data in .data/pg)`);
  }
  let redisUrl = process.env.REDIS_URL;
  if (!redisUrl) {
    const redis = await services.startRedis({
      dataDir: path.join(dataDir, 'redis'),
      port: Number(process.env.PROVENOTE_REDIS_PORT ?? 63790),
      logFile: path.join(dataDir, 'redis.log'),
    });
    stoppers.push(redis.stop);
    redisUrl = redis.url;
    log(`Redis on ${redisUrl} (append-only file in .data/redis)`);
  }

  log('Building…');
  await buildServer();
  if (!dev) await buildWeb();

  const env = {
    ...process.env,
    DATABASE_URL: databaseUrl,
    REDIS_URL: redisUrl,
    HOST: host,
    PORT: String(port),
    MAIL_MODE: process.env.SMTP_URL ? 'smtp' : 'embedded',
    NODE_ENV: process.env.NODE_ENV ?? 'production',
  };
  const publicUrl = process.env.PUBLIC_URL ?? (dev ? 'http://127.0.0.1:5173' : `http://${host}:${port}`);
  env.PUBLIC_URL = publicUrl;
  if (!dev) env.WEB_DIST = path.join(repoRoot, 'web', 'dist');

  const prepared = capture('node', ['api/dist/cli/prepare-database.js'], { env }).split('\n');
  const { demoAccounts, demoPassword } = JSON.parse(prepared.pop());
  prepared.forEach((line) => log(line));

  startChild('API', 'node', ['--enable-source-maps', 'api/dist/main.js'], { env });
  await waitForHealth(`http://${host}:${port}/api/health`);
  if (dev) {
    startChild('Vite', 'npx', ['vite'], {
      cwd: path.join(repoRoot, 'web'),
      env: { ...process.env, PROVENOTE_API_URL: `http://${host}:${port}` },
    });
  }

  const width = Math.max(...demoAccounts.map((a) => a.email.length));
  console.log(
    [
      '',
      `  Provenote is running at ${publicUrl}`,
      `  API: ${publicUrl}/api   OpenAPI: http://${host}:${port}/api/docs`,
      '',
      `  Demo sign-ins (password: ${demoPassword}):`,
      ...demoAccounts.map((a) => `    ${a.email.padEnd(width)}  ${a.role}`),
      '',
      '  Press Ctrl-C to stop everything.',
      '',
    ].join('\n'),
  );
}

main().catch((error) => {
  console.error(`[provenote] ${error instanceof Error ? error.message : error}`);
  stopAll(1);
});
