'use strict';
/**
 * Steps shared by the start and test commands: dependencies, builds, child processes. Plain Node.js
 * with no dependencies, because it runs before `npm ci`.
 */
const { spawn, spawnSync } = require('node:child_process');
const fs = require('node:fs');
const path = require('node:path');

const repoRoot = path.resolve(__dirname, '..', '..');

/** Runs a command to completion with inherited output; resolves to its exit code. */
function run(command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { cwd: repoRoot, stdio: 'inherit', ...options });
    child.once('error', reject);
    child.once('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
  });
}

async function runOrFail(command, args, options) {
  const code = await run(command, args, options);
  if (code !== 0) throw new Error(`${command} ${args.join(' ')} failed with exit code ${code}`);
}

/**
 * Installs the npm dependencies with `npm ci` when node_modules is missing or older than the lock file.
 */
async function ensureDependencies(log = console.log) {
  const marker = path.join(repoRoot, 'node_modules', '.package-lock.json');
  const lock = path.join(repoRoot, 'package-lock.json');
  const stale = !fs.existsSync(marker) || fs.statSync(lock).mtimeMs > fs.statSync(marker).mtimeMs + 1000;
  if (!stale) return;
  log('Installing npm dependencies (npm ci)…');
  await runOrFail('npm', ['ci', '--no-audit', '--no-fund']);
}

function newestMtime(paths) {
  let newest = 0;
  const visit = (entry) => {
    if (!fs.existsSync(entry)) return;
    const stat = fs.statSync(entry);
    if (stat.isDirectory()) {
      for (const child of fs.readdirSync(entry)) {
        if (child !== 'node_modules' && child !== 'dist') visit(path.join(entry, child));
      }
    } else {
      newest = Math.max(newest, stat.mtimeMs);
    }
  };
  paths.forEach(visit);
  return newest;
}

/** Compiles shared, workers and api (incremental, so quick when nothing changed). */
function buildServer() {
  return runOrFail('npx', ['tsc', '-b', 'shared', 'workers', 'api']);
}

/** Builds the web app when its sources are newer than the last build. */
async function buildWeb({ force = false } = {}) {
  const web = path.join(repoRoot, 'web');
  const built = path.join(web, 'dist', 'index.html');
  const sources = ['src', 'public', 'index.html', 'vite.config.ts', 'package.json'].map((p) => path.join(web, p));
  sources.push(path.join(repoRoot, 'shared', 'src', 'schemas'));
  if (!force && fs.existsSync(built) && fs.statSync(built).mtimeMs >= newestMtime(sources)) return;
  await runOrFail('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: web });
}

/** Synchronous, quiet command; returns trimmed stdout or throws with stderr. */
function capture(command, args, options = {}) {
  const result = spawnSync(command, args, { cwd: repoRoot, encoding: 'utf8', ...options });
  if (result.status !== 0) throw new Error(`${command} ${args.join(' ')}: ${result.stderr || result.stdout}`);
  return result.stdout.trim();
}

module.exports = { repoRoot, run, runOrFail, ensureDependencies, buildServer, buildWeb, capture };
