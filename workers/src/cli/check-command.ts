import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { kruskalWallisByVariable, leaveOneOutCheck, pairwiseHotelling, wilksLambda } from '@provenote/shared';
import { fitReference } from './fit-reference';
import { loadSamples, resolveElements } from './load-samples';
import type { DataOptions } from './parse-args';
import { prepareFeatures } from './prepare-features';
import { readTable, type Table } from './read-table';
import { runManifest, writeManifest } from './run-manifest';
import { writeCsv } from './write-csv';

export const MEMBER_COLUMNS = ['sample_id', 'group', 'd2', 'd2_loo', 'p_hotelling_loo', 'verdict_loo'] as const;
export const SEPARATION_COLUMNS = ['group_a', 'group_b', 't2', 'f', 'df1', 'df2', 'p'] as const;

type Row = (string | number | null)[];

export interface CheckResult {
  readonly members: Row[];
  readonly separation: Row[];
  readonly returnedToOwnGroup: number;
  readonly manifest: ReturnType<typeof runManifest>;
}

/**
 * Reference table → leave-one-out verdicts of every member, pairwise two-sample Hotelling T² and the
 * screening statistics. verdict_loo is own_group, other_group, ambiguous or unassigned. The pairwise
 * T² uses the classical pooled covariance whatever --covariance says (it is a test of means).
 */
export function checkTable(reference: Table, options: DataOptions): CheckResult {
  const elements = resolveElements(reference, options.elements, [options.idColumn, options.groupColumn]);
  const samples = loadSamples(reference, elements, options.idColumn, options.groupColumn);
  const features = prepareFeatures(samples, options);
  const fit = fitReference(samples, features, options);
  const groupRows = fit.memberRows.map((rows) => rows.map((i) => features.values[i]));
  const check = leaveOneOutCheck(fit.models, groupRows, options.probability, options.alpha);
  const members: Row[] = check.members.map((m) => {
    const row = fit.memberRows[fit.models.findIndex((model) => model.name === m.group)][m.index];
    return [samples.ids[row], m.group, m.d2, m.d2LeaveOneOut, m.pHotellingLeaveOneOut, m.outcome];
  });
  const named = fit.models.map((model, k) => ({ name: model.name, rows: groupRows[k] }));
  const separation: Row[] = pairwiseHotelling(named, features.variables).map((t) => [
    t.groupA,
    t.groupB,
    t.t2,
    t.f,
    t.df1,
    t.df2,
    t.p,
  ]);
  const screening =
    fit.models.length >= 2
      ? {
          kruskalWallis: kruskalWallisByVariable(groupRows, features.variables),
          wilksLambda: wilksLambda(groupRows, features.variables),
        }
      : {};
  const manifest = runManifest('check', options, { reference }, elements, features, fit, {
    leaveOneOut: {
      members: check.members.length,
      returnedToOwnGroup: check.returnedToOwnGroup,
      confusion: check.confusion,
    },
    ...screening,
  });
  return { members, separation, returnedToOwnGroup: check.returnedToOwnGroup, manifest };
}

/** The check command: writes members.csv, separation.csv and run.json. */
export function runCheck(options: DataOptions): CheckResult {
  const result = checkTable(readTable(options.reference), options);
  mkdirSync(options.out, { recursive: true });
  writeCsv(join(options.out, 'members.csv'), MEMBER_COLUMNS, result.members);
  writeCsv(join(options.out, 'separation.csv'), SEPARATION_COLUMNS, result.separation);
  writeManifest(options.out, result.manifest);
  return result;
}
