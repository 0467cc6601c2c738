#!/usr/bin/env node
/**
 * `npm run bench [-- section …]`: builds what changed, then runs the compiled benchmark runner; figures go
 * to .data/bench/results.json (merged with existing keys).
 */
const { loadBuilt, root } = require('./load-built.cjs');

loadBuilt('bench/run-bench.js')
  .runBench(root, process.argv.slice(2))
  .catch((error) => {
    process.stderr.write(`${error.stack ?? error}\n`);
    process.exitCode = 1;
  });
