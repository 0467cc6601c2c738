#!/usr/bin/env node
/**
 * `npm run bench [-- section …]`: builds the engine and the workers incrementally, then runs the
 * compiled benchmark runner; figures go to .data/bench/results.json (merged with existing keys).
 */
const { execFileSync } = require('node:child_process');
const { existsSync } = require('node:fs');
const path = require('node:path');

const root = path.resolve(__dirname, '..', '..');
try {
  execFileSync(process.execPath, [require.resolve('typescript/bin/tsc', { paths: [root] }), '-b', 'workers'], {
    cwd: root,
    stdio: 'inherit',
  });
} catch {
  // tsc still emits JavaScript when it reports type errors; run it only if the entry exists.
  process.stderr.write('warning: the TypeScript build of workers reported errors (see above)\n');
}
const entry = path.join(root, 'workers', 'dist', 'bench', 'run-bench.js');
if (!existsSync(entry)) {
  process.stderr.write(`error: ${entry} was not built\n`);
  process.exit(1);
}
require(entry)
  .runBench(root, process.argv.slice(2))
  .catch((error) => {
    process.stderr.write(`${error.stack ?? error}\n`);
    process.exitCode = 1;
  });
