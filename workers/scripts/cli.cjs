#!/usr/bin/env node
/**
 * `npm run cli -- …`: builds the engine and the workers incrementally (fast when nothing changed),
 * then runs the compiled command-line tool.
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
const entry = path.join(root, 'workers', 'dist', 'cli', 'main.js');

if (!existsSync(entry)) {
  process.stderr.write(`error: ${entry} was not built\n`);
  process.exit(1);
}
const { main } = require(entry);
Promise.resolve(main(process.argv.slice(2))).then((code) => {
  process.exitCode = code;
});
