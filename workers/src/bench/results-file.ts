import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';

export type BenchResults = Record<string, number | string>;

/** Merges new figures into the results file (other sections' keys are kept), creating its folder. */
export function mergeResults(file: string, results: BenchResults): BenchResults {
  const existing: BenchResults = existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as BenchResults) : {};
  const merged = { ...existing, ...results };
  mkdirSync(dirname(file), { recursive: true });
  writeFileSync(file, JSON.stringify(merged, null, 2) + '\n');
  return merged;
}
