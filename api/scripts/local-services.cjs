'use strict';
/**
 * Local services for development, the start command and the tests: a project-owned PostgreSQL cluster
 * and a Redis server, both on 127.0.0.1, plus the system packages they come from.
 *
 * Plain Node.js with no dependencies, so it runs before `npm ci` has finished and from Jest's global setup.
 */
const { spawn, spawnSync, execFileSync } = require('node:child_process');
const fs = require('node:fs');
const net = require('node:net');
const os = require('node:os');
const path = require('node:path');

const PG_BIN = process.env.PG_BIN || '/usr/lib/postgresql/15/bin';
const DB_USER = 'provenote';

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/** Debian packages the services need, keyed by the binary that shows they are installed. */
const SYSTEM_PACKAGES = {
  postgres: { bin: path.join(PG_BIN, 'postgres'), pkg: 'postgresql-15' },
  redis: { bin: '/usr/bin/redis-server', pkg: 'redis-server' },
  chromium: { bin: '/usr/bin/chromium', pkg: 'chromium' },
};

let aptUpdated = false;

/**
 * Makes sure the named services' Debian packages are installed: installs them with apt-get when running
 * as root, otherwise throws with the exact command to run.
 */
function ensureSystemPackages(names, log = console.log) {
  const missing = names
    .map((name) => SYSTEM_PACKAGES[name])
    .filter((entry) => !fs.existsSync(entry.bin))
    .map((entry) => entry.pkg);
  if (missing.length === 0) return;
  if (!isRoot()) {
    throw new Error(
      `Missing system packages: ${missing.join(', ')}.\n` +
        `Install them with: sudo apt-get update && sudo apt-get install -y ${missing.join(' ')}`,
    );
  }
  log(`Installing ${missing.join(', ')} with apt-get (first run only)…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
    aptUpdated = true;
  }
  execFileSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...missing], {
    stdio: 'inherit',
    env,
  });
  // Debian's redis-server package may start a system instance on 6379; ours runs on its own port.
}

/** Resolves to a TCP port that is free on 127.0.0.1 right now. */
function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

function portIsOpen(port) {
  return new Promise((resolve) => {
    const socket = net.connect({ port, host: '127.0.0.1' });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * PostgreSQL refuses to run as root: as root, its programs run as the `postgres` system user (spawned
 * with that uid directly, so signals reach the server itself).
 */
function serviceUserOptions() {
  if (!isRoot()) return {};
  const uid = Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim());
  const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim());
  return { uid, gid };
}

function chownToServiceUser(dir) {
  if (isRoot()) execFileSync('chown', ['-R', 'postgres:postgres', dir]);
}

function runPg(tool, args) {
  const result = spawnSync(path.join(PG_BIN, tool), args, { encoding: 'utf8', cwd: '/', ...serviceUserOptions() });
  if (result.status !== 0) {
    throw new Error(`${tool} ${args.join(' ')} failed:\n${result.stderr || result.stdout}`);
  }
  return result.stdout;
}

function waitForExit(child, timeoutMs) {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => {
      child.kill('SIGKILL');
      resolve();
    }, timeoutMs);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
  });
}

/**
 * Starts a PostgreSQL cluster in `dataDir` (created with initdb on first use) on 127.0.0.1:`port`, and
 * makes sure `database` exists. Loopback only, trust authentication: the cluster is the project's own
 * and never listens beyond this machine. Returns { url, stop }.
 */
async function startPostgres({ dataDir, port, database = 'provenote', logFile, durable = true }) {
  fs.mkdirSync(dataDir, { recursive: true });
  if (!fs.existsSync(path.join(dataDir, 'PG_VERSION'))) {
    chownToServiceUser(dataDir);
    runPg('initdb', ['-D', dataDir, '-U', DB_USER, '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8']);
  }
  chownToServiceUser(dataDir);
  if (await portIsOpen(port)) {
    throw new Error(`Port ${port} on 127.0.0.1 is already in use: is another Provenote already running?`);
  }
  const args = [
    '-D',
    dataDir,
    '-p',
    String(port),
    '-c',
    'listen_addresses=127.0.0.1',
    '-c',
    'unix_socket_directories=',
    // A throwaway test cluster need not survive a power cut; skipping fsync makes the suites faster.
    '-c',
    `fsync=${durable ? 'on' : 'off'}`,
  ];
  const out = logFile ? fs.openSync(logFile, 'a') : 'ignore';
  const child = spawn(path.join(PG_BIN, 'postgres'), args, {
    stdio: ['ignore', out, out],
    cwd: '/',
    ...serviceUserOptions(),
  });
  let exited = false;
  child.once('exit', () => {
    exited = true;
  });
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (exited) throw new Error(`PostgreSQL exited during start-up${logFile ? `; see ${logFile}` : ''}`);
    const ready = spawnSync(path.join(PG_BIN, 'pg_isready'), ['-h', '127.0.0.1', '-p', String(port), '-q']);
    if (ready.status === 0) break;
    if (Date.now() > deadline) throw new Error('PostgreSQL did not become ready within 30 s');
    await sleep(150);
  }
  const psql = (sql, db = 'postgres') =>
    execFileSync('psql', ['-h', '127.0.0.1', '-p', String(port), '-U', DB_USER, '-d', db, '-tAc', sql], {
      encoding: 'utf8',
    }).trim();
  if (psql(`SELECT 1 FROM pg_database WHERE datname = '${database}'`) !== '1') {
    psql(`CREATE DATABASE "${database}"`);
  }
  const stop = async () => {
    if (exited) return;
    child.kill('SIGINT'); // fast shutdown: roll back open transactions, checkpoint, exit
    await waitForExit(child, 20_000);
  };
  return { url: `postgres://${DB_USER}@127.0.0.1:${port}/${database}`, port, stop, child };
}

/**
 * Starts redis-server on 127.0.0.1:`port` with its data in `dataDir`. `persistent` turns the append-only
 * file on, so queued jobs survive a restart. Returns { url, stop }.
 */
async function startRedis({ dataDir, port, persistent = true, logFile }) {
  fs.mkdirSync(dataDir, { recursive: true });
  if (await portIsOpen(port)) {
    throw new Error(`Port ${port} on 127.0.0.1 is already in use: is another Provenote already running?`);
  }
  const args = [
    '--bind',
    '127.0.0.1',
    '--port',
    String(port),
    '--dir',
    dataDir,
    '--daemonize',
    'no',
    '--save',
    '',
    '--appendonly',
    persistent ? 'yes' : 'no',
    '--protected-mode',
    'yes',
  ];
  if (logFile) args.push('--logfile', logFile);
  const child = spawn(SYSTEM_PACKAGES.redis.bin, args, { stdio: 'ignore' });
  let exited = false;
  let spawnError = null;
  child.once('exit', () => {
    exited = true;
  });
  // A missing binary is an 'error' event: unhandled, it would end the process before the caller cleans up.
  child.once('error', (error) => {
    spawnError = error;
    exited = true;
  });
  const deadline = Date.now() + 15_000;
  while (!(await portIsOpen(port))) {
    if (spawnError) throw new Error(`redis-server could not be started: ${spawnError.message}`);
    if (exited) throw new Error(`redis-server exited during start-up${logFile ? `; see ${logFile}` : ''}`);
    if (Date.now() > deadline) throw new Error('Redis did not become ready within 15 s');
    await sleep(100);
  }
  const stop = async () => {
    if (exited) return;
    child.kill('SIGTERM'); // redis flushes the append-only file and exits
    await waitForExit(child, 10_000);
  };
  return { url: `redis://127.0.0.1:${port}`, port, stop, child };
}

/**
 * A throwaway PostgreSQL cluster and Redis in a fresh temporary folder on free ports, for the tests.
 * `stop()` ends both and removes the folder.
 */
async function startThrowawayServices({ redis = true } = {}) {
  const base = fs.mkdtempSync(path.join(os.tmpdir(), 'provenote-test-'));
  fs.chmodSync(base, 0o755);
  const started = [];
  const cleanup = async () => {
    for (const service of started.reverse()) await service.stop().catch(() => undefined);
    fs.rmSync(base, { recursive: true, force: true });
  };
  try {
    const pg = await startPostgres({
      dataDir: path.join(base, 'pg'),
      port: await freePort(),
      database: 'provenote_test',
      logFile: path.join(base, 'postgres.log'),
      durable: false,
    });
    started.push(pg);
    let redisService;
    if (redis) {
      redisService = await startRedis({ dataDir: path.join(base, 'redis'), port: await freePort(), persistent: false });
      started.push(redisService);
    }
    return { databaseUrl: pg.url, redisUrl: redisService?.url, dir: base, stop: cleanup };
  } catch (error) {
    await cleanup();
    throw error;
  }
}

module.exports = {
  ensureSystemPackages,
  freePort,
  startPostgres,
  startRedis,
  startThrowawayServices,
  isRoot,
};
