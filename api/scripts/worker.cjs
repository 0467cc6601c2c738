'use strict';
/**
 * `npm run worker`: builds the server code if needed and starts one worker process (api/dist/queue/
 * worker-main.js). It reads DATABASE_URL, REDIS_URL and WORKER_CONCURRENCY (and QUEUE_PREFIX when the
 * API sets one) from the environment; start the API with WORKERS=external to leave all runs to workers.
 */
const { spawn } = require('node:child_process');
const path = require('node:path');
const { repoRoot, buildServer } = require('./workspace.cjs');

async function main() {
  await buildServer();
  const child = spawn('node', ['--enable-source-maps', path.join(repoRoot, 'api/dist/queue/worker-main.js')], {
    cwd: repoRoot,
    stdio: 'inherit',
  });
  for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal));
  child.once('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
}

main().catch((error) => {
  console.error(`[provenote worker] ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
