import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { classifySamples } from '@provenote/shared';
import { fitReference } from './fit-reference';
import { loadSamples, resolveElements } from './load-samples';
import type { ClassifyOptions } from './parse-args';
import { prepareFeatures } from './prepare-features';
import { readTable, type Table } from './read-table';
import { runManifest, writeManifest } from './run-manifest';
import { writeCsv } from './write-csv';

export const DISTANCE_COLUMNS = ['sample_id', 'group', 'd2', 'p_chi2', 'p_hotelling'] as const;
export const ASSIGNMENT_COLUMNS = [
  'sample_id',
  'verdict',
  'group',
  'probability',
  'runner_up',
  'runner_up_probability',
] as const;

/** Quadratic-rule posteriors (equal priors): a second view beside the typicality probabilities. */
export const POSTERIOR_COLUMNS = ['sample_id', 'group', 'posterior'] as const;

type Row = (string | number | null)[];

export interface ClassifyResult {
  readonly distances: Row[];
  readonly assignments: Row[];
  readonly posteriors: Row[];
  readonly manifest: ReturnType<typeof runManifest>;
}

/** Reference and unknown tables → engine → output rows and the run record; no file is written. */
export function classifyTables(reference: Table, unknowns: Table, options: ClassifyOptions): ClassifyResult {
  const elements = resolveElements(reference, options.elements, [options.idColumn, options.groupColumn]);
  const referenceSamples = loadSamples(reference, elements, options.idColumn, options.groupColumn);
  const unknownSamples = loadSamples(unknowns, elements, options.idColumn, null);
  const referenceFeatures = prepareFeatures(referenceSamples, options);
  const unknownFeatures = prepareFeatures(unknownSamples, options);
  const fit = fitReference(referenceSamples, referenceFeatures, options);
  const results = classifySamples(fit.models, unknownFeatures.values, {
    basis: options.probability,
    alpha: options.alpha,
  });
  const names = fit.models.map((m) => m.name);
  const distances: Row[] = [];
  const assignments: Row[] = [];
  const posteriors: Row[] = [];
  results.forEach((result, i) => {
    const id = unknownSamples.ids[i];
    names.forEach((name, k) => {
      distances.push([id, name, result.d2[k], result.pChi2[k], result.pHotelling[k]]);
      posteriors.push([id, name, result.posterior[k]]);
    });
    const v = result.verdict;
    assignments.push([id, v.verdict, v.group, v.probability, v.runnerUp, v.runnerUpProbability]);
  });
  const counts = { assigned: 0, ambiguous: 0, unassigned: 0 };
  results.forEach((r) => counts[r.verdict.verdict]++);
  const manifest = runManifest('classify', options, { reference, unknowns }, elements, referenceFeatures, fit, {
    unknownImputedCells: unknownFeatures.imputedCells,
    verdictCounts: counts,
  });
  return { distances, assignments, posteriors, manifest };
}

/** The classify command: reads both CSV files, writes distances.csv, assignments.csv, posteriors.csv and run.json. */
export function runClassify(options: ClassifyOptions): ClassifyResult {
  const result = classifyTables(readTable(options.reference), readTable(options.unknowns), options);
  mkdirSync(options.out, { recursive: true });
  writeCsv(join(options.out, 'distances.csv'), DISTANCE_COLUMNS, result.distances);
  writeCsv(join(options.out, 'assignments.csv'), ASSIGNMENT_COLUMNS, result.assignments);
  writeCsv(join(options.out, 'posteriors.csv'), POSTERIOR_COLUMNS, result.posteriors);
  writeManifest(options.out, result.manifest);
  return result;
}
