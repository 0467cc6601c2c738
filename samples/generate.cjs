'use strict';
/**
 * Writes the synthetic Lake Tarn demo files into samples/data/ (or --out DIR) from one seed.
 * Usage: node generate.cjs [--seed N] [--out DIR]. The same seed always gives byte-identical files.
 */
const fs = require('node:fs');
const path = require('node:path');
const { buildScenario } = require('./lib/build.cjs');
const { SOURCES } = require('./lib/scenario.cjs');

const DEFAULT_SEED = 20250917;

function parseArguments(argv) {
  const options = { seed: DEFAULT_SEED, out: path.join(__dirname, 'data') };
  for (let i = 0; i < argv.length; i += 2) {
    const [flag, value] = [argv[i], argv[i + 1]];
    if (value === undefined) throw new Error(`${flag} needs a value`);
    if (flag === '--seed') options.seed = Number(value);
    else if (flag === '--out') options.out = path.resolve(value);
    else throw new Error(`unknown option ${flag} (expected --seed N or --out DIR)`);
  }
  return options;
}

function summary(scenario) {
  const lines = SOURCES.filter((s) => s.size !== null).map((s) => `  ${s.name}: n = ${s.size}`);
  const count = (origin) => scenario.core.filter((row) => row.origin === origin).length;
  lines.push(
    `  core: ${scenario.core.length} slices (${count('single')} single source, ${count('mixture')} mixtures, ${count('unmapped')} unmapped)`,
  );
  return lines.join('\n');
}

function main() {
  const options = parseArguments(process.argv.slice(2));
  const scenario = buildScenario(options.seed);
  fs.mkdirSync(options.out, { recursive: true });
  for (const [name, text] of Object.entries(scenario.files)) fs.writeFileSync(path.join(options.out, name), text);
  console.log(`Lake Tarn synthetic scenario, seed ${options.seed}, written to ${options.out}\n${summary(scenario)}`);
}

try {
  main();
} catch (error) {
  console.error(`generate: ${error.message}`);
  process.exitCode = 1;
}
