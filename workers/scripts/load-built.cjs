/**
 * Shared by the command-line tool and the benchmark: builds the engine and the workers incrementally (fast
 * when nothing changed), then requires a compiled module from workers/dist.
 */
const { execFileSync } = require('node:child_process');
const { existsSync } = require('node:fs');
const path = require('node:path');

const root = path.resolve(__dirname, '..', '..');

function loadBuilt(relativeEntry) {
  try {
    execFileSync(process.execPath, [require.resolve('typescript/bin/tsc', { paths: [root] }), '-b', 'workers'], {
      cwd: root,
      stdio: 'inherit',
    });
  } catch {
    // tsc still emits JavaScript when it reports type errors; run it only if the entry exists.
    process.stderr.write('warning: the TypeScript build of workers reported errors (see above)\n');
  }
  const entry = path.join(root, 'workers', 'dist', relativeEntry);
  if (!existsSync(entry)) {
    process.stderr.write(`error: ${entry} was not built\n`);
    process.exit(1);
  }
  return require(entry);
}

module.exports = { root, loadBuilt };
