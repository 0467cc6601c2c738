'use strict';
/**
 * Checks the committed demo files: the generator, run again into a temporary folder, must reproduce them
 * byte for byte, and the files must still describe the scenario the README promises.
 * Run: node samples/check.cjs (node:test output; a non-zero exit code on failure).
 */
const test = require('node:test');
const assert = require('node:assert/strict');
const fs = require('node:fs');
const os = require('node:os');
const path = require('node:path');
const { execFileSync } = require('node:child_process');

const dataDir = path.join(__dirname, 'data');
const generated = ['reference-soils.csv', 'reservoir-core.csv', 'reservoir-core-eu.csv', 'truth.csv'];

/** A fresh run of the generator into a temporary folder that is removed when the test ends, pass or fail. */
function generateInto(t, seedArguments) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'provenote-samples-'));
  t.after(() => fs.rmSync(dir, { recursive: true, force: true }));
  execFileSync(process.execPath, [path.join(__dirname, 'generate.cjs'), ...seedArguments, '--out', dir]);
  return dir;
}

function readTable(name, delimiter = ',') {
  const lines = fs.readFileSync(path.join(dataDir, name), 'utf8').split(/\r?\n/);
  assert.equal(lines.pop(), '', `${name} ends with a line break`);
  return lines.map((line) => line.split(delimiter));
}

const reference = readTable('reference-soils.csv');
const core = readTable('reservoir-core.csv');
const truth = readTable('truth.csv');

test('the generator reproduces the committed files byte for byte', (t) => {
  const dir = generateInto(t, []);
  assert.deepEqual(fs.readdirSync(dir).sort(), [...generated].sort());
  for (const name of generated) {
    const fresh = fs.readFileSync(path.join(dir, name));
    assert.ok(fresh.equals(fs.readFileSync(path.join(dataDir, name))), `${name} differs from a fresh run`);
  }
});

test('another seed gives other data', (t) => {
  const dir = generateInto(t, ['--seed', '7']);
  const other = fs.readFileSync(path.join(dir, 'reference-soils.csv'));
  assert.ok(!other.equals(fs.readFileSync(path.join(dataDir, 'reference-soils.csv'))));
});

test('reference groups: five sources of 15–60 samples, one of them small', () => {
  const sizes = new Map();
  for (const row of reference.slice(1)) sizes.set(row[1], (sizes.get(row[1]) ?? 0) + 1);
  assert.equal(sizes.size, 5);
  for (const [group, n] of sizes) assert.ok(n >= 15 && n <= 60, `${group}: n = ${n}`);
  assert.ok(
    [...sizes.values()].some((n) => n <= 18),
    'one group is small enough for the small-group warning',
  );
});

test('columns: 24 elements and LOI, units in the header, rows as long as the header', () => {
  const header = reference[0];
  assert.deepEqual(header.slice(0, 2), ['sample_id', 'group']);
  assert.deepEqual(core[0].slice(0, 2), ['sample_id', 'depth_cm']);
  assert.deepEqual(core[0].slice(2), header.slice(2));
  const columns = header.slice(2);
  assert.equal(columns.length, 25);
  assert.equal(columns.filter((c) => /^\S+ \((wt%|ppm)\)$/.test(c)).length, 25);
  assert.ok(columns.includes('LOI (wt%)'));
  for (const row of [...reference, ...core]) assert.equal(row.length, header.length, row[0]);
});

test('cells are numbers, "<DL" or "n.d.", and the analyses add up to about 100 %', () => {
  const cells = [...reference.slice(1), ...core.slice(1)].flatMap((row) => row.slice(2));
  assert.ok(cells.every((c) => /^(\d+(\.\d+)?|<\d+(\.\d+)?|n\.d\.)$/.test(c)));
  assert.ok(cells.filter((c) => c.startsWith('<')).length >= 10, 'some values below detection limits');
  assert.equal(cells.filter((c) => c === 'n.d.').length, 2);
  for (const row of [...reference.slice(1), ...core.slice(1)]) {
    const majorsAndLoi = row.slice(2, 13).map(Number);
    const total = majorsAndLoi.reduce((sum, value) => sum + value, 0);
    assert.ok(total > 98.5 && total < 101.5, `${row[0]}: total ${total}`);
  }
});

test('core TR-2: 80–150 slices in depth order, every one in the truth table', () => {
  const rows = core.slice(1);
  assert.ok(rows.length >= 80 && rows.length <= 150);
  const depths = rows.map((row) => Number(row[1]));
  assert.ok(depths.every((d, i) => i === 0 || d > depths[i - 1]));
  assert.deepEqual(
    truth.slice(1).map((row) => row.slice(0, 2)),
    rows.map((row) => row.slice(0, 2)),
  );
});

test('truth table: mostly single sources, a few mixtures and a few from an unmapped source', () => {
  const groups = new Set(reference.slice(1).map((row) => row[1]));
  const count = (origin) => truth.filter((row) => row[2] === origin).length;
  assert.ok(count('single') > 0.7 * (truth.length - 1));
  assert.ok(count('mixture') >= 5 && count('mixture') <= 20);
  assert.ok(count('unmapped') >= 3 && count('unmapped') <= 12);
  for (const [, , origin, main, mainShare, second, secondShare] of truth.slice(1)) {
    assert.ok(Math.abs(Number(mainShare) + Number(secondShare) - 1) < 0.0015);
    assert.ok(groups.has(second));
    assert.equal(groups.has(main), origin !== 'unmapped');
    if (origin === 'single') assert.ok(Number(mainShare) >= 0.97);
    if (origin === 'mixture') assert.ok(Number(secondShare) >= 0.35);
  }
});

test('the European variant holds the same values: semicolons, decimal commas, a units row', () => {
  const european = readTable('reservoir-core-eu.csv', ';');
  const raw = fs.readFileSync(path.join(dataDir, 'reservoir-core-eu.csv'), 'utf8');
  assert.equal(raw.split('\r\n').length, raw.split('\n').length, 'CRLF line ends throughout');
  assert.deepEqual(european[0].slice(0, 3), ['Sample', 'Depth', 'SiO2']);
  assert.deepEqual(european[1].slice(0, 3), ['', 'cm', 'wt%']);
  assert.deepEqual(
    european[1].slice(2),
    core[0].slice(2).map((header) => header.replace(/^.* \((.*)\)$/, '$1')),
  );
  assert.deepEqual(
    european.slice(2).map((row) => row.map((cell) => cell.replace(',', '.'))),
    core.slice(1),
  );
});
