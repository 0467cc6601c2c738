import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';

/** Test helpers that read the open datasets; tests only, the engine itself does no I/O. */

export function loadHbk(): { x: number[][]; rowNames: number[] } {
  const lines = readFileSync(join(__dirname, 'hbk.csv'), 'utf8').trim().split('\n').slice(1);
  const cells = lines.map((line) => line.split(',').map(Number));
  return { x: cells.map((c) => c.slice(1, 4)), rowNames: cells.map((c) => c[0]) };
}

export interface Penguin {
  readonly species: string;
  readonly measurements: number[];
}

/**
 * Palmer penguins from vega-datasets (Gorman, Williams & Fraser 2014, PLoS ONE 9:e90081), read from the
 * package folder with fs: the package's exports map blocks deep requires and its default export
 * fetches over the network. Records with any measurement missing are dropped.
 */
export function loadPenguins(): { all: number; kept: Penguin[] } {
  const searchPaths = createRequire(__filename).resolve.paths('vega-datasets') ?? [];
  const file = searchPaths.map((folder) => join(folder, 'vega-datasets', 'data', 'penguins.json')).find(existsSync);
  if (!file) throw new Error('vega-datasets/data/penguins.json not found: run npm ci');
  const records = JSON.parse(readFileSync(file, 'utf8')) as Record<string, unknown>[];
  const fields = ['Beak Length (mm)', 'Beak Depth (mm)', 'Flipper Length (mm)', 'Body Mass (g)'];
  const kept = records.flatMap((record) => {
    const measurements = fields.map((field) => record[field]);
    return measurements.every((value) => typeof value === 'number')
      ? [{ species: String(record.Species), measurements: measurements as number[] }]
      : [];
  });
  return { all: records.length, kept };
}
