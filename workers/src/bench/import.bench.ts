import { loadavg } from 'node:os';
import type { BenchFigure, BenchSection } from './bench-section';
import { benchStack } from './stack/bench-stack';
import { importDataset } from './stack/import-dataset';
import { round2 } from './stack/figures';
import { BENCH_ELEMENTS, unknownsCsv } from './stack/synthetic-csv';

const ROWS = 100_000;

/** Import through the HTTP routes the web app uses: upload, then parse, normalise and store in PostgreSQL. */
export const importBench: BenchSection = {
  name: 'import',
  async run(log) {
    const stack = await benchStack(log);
    const csv = unknownsCsv(ROWS, 7);
    const load = loadavg()[0];
    const imported = await importDataset(stack, 'bench-import.csv', 'unknowns', csv);
    const totalMs = imported.uploadMs + imported.storeMs;
    log(
      `${ROWS} rows × ${BENCH_ELEMENTS.length} elements (${(csv.byteLength / 1e6).toFixed(1)} MB): ` +
        `upload ${imported.uploadMs.toFixed(0)} ms, store ${imported.storeMs.toFixed(0)} ms`,
    );
    return [
      {
        key: 'import.100000x30.rows_per_s',
        label: `import ${ROWS} rows × ${BENCH_ELEMENTS.length} elements (upload + store), target ≥ 50,000`,
        value: Math.round(ROWS / (totalMs / 1000)),
        unit: 'rows/s',
      },
      {
        key: 'import.100000x30.upload_ms',
        label: 'import: upload and layout guess',
        value: Math.round(imported.uploadMs),
        unit: 'ms',
      },
      {
        key: 'import.100000x30.store_ms',
        label: 'import: parse, normalise, store',
        value: Math.round(imported.storeMs),
        unit: 'ms',
      },
      { key: 'import.100000x30.file_bytes', label: 'import: CSV size', value: csv.byteLength, unit: 'bytes' },
      { key: 'import.load_average_1m', label: 'import: load average at start', value: round2(load), unit: '' },
    ] satisfies BenchFigure[];
  },
};
