import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { mergeResults } from './results-file';
import { formatTable, machineInfo } from './run-bench';

describe('mergeResults', () => {
  it('creates the folder and keeps keys written by other sections', () => {
    const file = join(mkdtempSync(join(tmpdir(), 'provenote-bench-')), '.data', 'bench', 'results.json');
    mergeResults(file, { 'api.requests_per_s': 900, 'engine.mcd.5000x20.ms': 1 });
    mergeResults(file, { 'engine.mcd.5000x20.ms': 250 });
    expect(JSON.parse(readFileSync(file, 'utf8'))).toEqual({ 'api.requests_per_s': 900, 'engine.mcd.5000x20.ms': 250 });
  });

  it('reads an existing file written by hand', () => {
    const file = join(mkdtempSync(join(tmpdir(), 'provenote-bench-')), 'results.json');
    writeFileSync(file, '{"bundle.ms": 3}');
    expect(mergeResults(file, { x: 1 })).toEqual({ 'bundle.ms': 3, x: 1 });
  });
});

describe('the printed table and machine info', () => {
  it('aligns labels and values', () => {
    const table = formatTable([
      { key: 'a', label: 'short', value: 1234567, unit: 'pairs/s' },
      { key: 'b', label: 'a longer label', value: 5, unit: 'ms' },
    ]);
    expect(table.split('\n')).toEqual([
      `short           ${'1,234,567'.padStart(14)} pairs/s`,
      `a longer label  ${'5'.padStart(14)} ms`,
    ]);
  });

  it('names the processor, the core count and the Node.js version', () => {
    const info = machineInfo();
    expect(info['machine.cores']).toBeGreaterThan(0);
    expect(info['machine.node_version']).toBe(process.version);
    expect(typeof info['machine.cpu_model']).toBe('string');
  });
});
