import { cpus, loadavg, platform, release } from 'node:os';
import { join } from 'node:path';
import type { BenchFigure, BenchSection } from './bench-section';
import { apiBench } from './api.bench';
import { bundleBench } from './bundle.bench';
import { e2eBench } from './e2e.bench';
import { engineBench } from './engine.bench';
import { importBench } from './import.bench';
import { mergeResults, type BenchResults } from './results-file';
import { webBench } from './web.bench';
import { stopBenchStack } from './stack/bench-stack';

/** Sections run in this order; further sections (import, API, bundle) are appended here. */
export const SECTIONS: readonly BenchSection[] = [engineBench, bundleBench, importBench, e2eBench, apiBench, webBench];

export function formatTable(figures: readonly BenchFigure[]): string {
  const width = Math.max(...figures.map((f) => f.label.length));
  return figures
    .map((f) => `${f.label.padEnd(width)}  ${f.value.toLocaleString('en-US').padStart(14)} ${f.unit}`)
    .join('\n');
}

export function machineInfo(): BenchResults {
  return {
    'machine.cpu_model': cpus()[0]?.model ?? 'unknown',
    'machine.cores': cpus().length,
    'machine.node_version': process.version,
    'machine.os': `${platform()} ${release()}`,
    // Other work on the machine slows every figure: the load average at the start says how busy it was.
    'machine.load_average_1m': Math.round(loadavg()[0] * 100) / 100,
  };
}

/** Runs the named sections (all when none is named), prints the table and merges the results file. */
export async function runBench(
  root: string,
  only: readonly string[] = [],
  log: (line: string) => void = console.log,
): Promise<BenchResults> {
  const sections = SECTIONS.filter((s) => only.length === 0 || only.includes(s.name));
  // Taken before measuring, so the load average describes the machine the figures were measured on.
  const machine = { ...machineInfo(), 'machine.measured_at': new Date().toISOString() };
  const figures: BenchFigure[] = [];
  try {
    for (const section of sections) {
      log(`— ${section.name} —`);
      figures.push(...(await section.run(log)));
    }
  } finally {
    // PostgreSQL, Redis and the API that the import, end-to-end, API and web sections share.
    await stopBenchStack();
  }
  log('');
  log(formatTable(figures));
  const results: BenchResults = { ...machine };
  for (const figure of figures) results[figure.key] = figure.value;
  const file = join(root, '.data', 'bench', 'results.json');
  mergeResults(file, results);
  log(`\nwrote ${file}`);
  return results;
}
