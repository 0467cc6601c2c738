// Test helpers that read the open datasets. Plain JavaScript on purpose: the shared package compiles
// only TypeScript, so this file (which reads files) never reaches the engine's build output.
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));

/** @returns {{ x: number[][], rowNames: number[] }} Hawkins–Bradu–Kass X1–X3 (see README.md). */
export function loadHbk() {
  const lines = readFileSync(join(here, 'hbk.csv'), 'utf8').trim().split('\n').slice(1);
  const cells = lines.map((line) => line.split(',').map(Number));
  return { x: cells.map((c) => c.slice(1, 4)), rowNames: cells.map((c) => c[0]) };
}

/**
 * Palmer penguins from vega-datasets (Gorman, Williams & Fraser 2014, PLoS ONE 9:e90081), read from the
 * package folder with fs: the package's exports map blocks deep requires and its default export
 * fetches over the network. Records with any measurement missing are dropped.
 * @returns {{ all: number, kept: { species: string, measurements: number[] }[] }}
 */
export function loadPenguins() {
  const searchPaths = createRequire(import.meta.url).resolve.paths('vega-datasets') ?? [];
  const file = searchPaths.map((folder) => join(folder, 'vega-datasets', 'data', 'penguins.json')).find(existsSync);
  if (!file) throw new Error('vega-datasets/data/penguins.json not found: run npm ci');
  const records = JSON.parse(readFileSync(file, 'utf8'));
  const fields = ['Beak Length (mm)', 'Beak Depth (mm)', 'Flipper Length (mm)', 'Body Mass (g)'];
  const kept = records.flatMap((record) => {
    const measurements = fields.map((field) => record[field]);
    return measurements.every((value) => typeof value === 'number')
      ? [{ species: String(record.Species), measurements }]
      : [];
  });
  return { all: records.length, kept };
}
