#!/usr/bin/env node
/** `npm run cli -- …`: builds what changed, then runs the compiled command-line tool. */
const { loadBuilt } = require('./load-built.cjs');

const { main } = loadBuilt('cli/main.js');
Promise.resolve(main(process.argv.slice(2))).then((code) => {
  process.exitCode = code;
});
