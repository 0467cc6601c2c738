import { assignmentVerdicts, type BundleManifest } from '@provenote/shared';
import {
  ASSIGNMENTS_COLUMNS,
  ASSIGNMENTS_PATH,
  CONTRIBUTIONS_COLUMNS,
  CONTRIBUTIONS_PATH,
  DISTANCES_COLUMNS,
  DISTANCES_PATH,
  MEMBERS_COLUMNS,
  MEMBERS_PATH,
  PREPARED_PATH,
  SEPARATION_COLUMNS,
  SEPARATION_PATH,
} from './bundle-layout';
import { parseCsv, type CsvTable } from './csv';
import { compareGroups } from './compare-groups';
import type { MismatchLog } from './mismatch-log';
import { readPrepared } from './read-prepared';
import { recomputeRun, type RecomputedRun } from './recompute';

type Check = (table: CsvTable, row: number, where: string) => void;

/**
 * Matches a results table to the recomputed rows by key (sample and group, say), so row order does
 * not matter, then checks each matched row; missing and extra rows are differences too.
 */
function compareKeyed<T>(
  log: MismatchLog,
  path: string,
  table: CsvTable,
  keyColumns: string[],
  expected: readonly T[],
  keyOf: (row: T) => string[],
  check: (row: T) => Check,
): void {
  const keyIndex = keyColumns.map((column) => table.header.indexOf(column));
  const lineOf = new Map<string, number>();
  table.rows.forEach((cells, r) => {
    const key = JSON.stringify(keyIndex.map((j) => cells[j]));
    if (lineOf.has(key)) log.add(path, `line ${r + 2}: ${keyColumns.join(', ')} ${key} appears twice`);
    lineOf.set(key, r);
  });
  for (const row of expected) {
    const key = JSON.stringify(keyOf(row));
    const r = lineOf.get(key);
    if (r === undefined) {
      log.add(path, `no row for ${keyColumns.join(', ')} ${key}`);
      continue;
    }
    lineOf.delete(key);
    check(row)(table, r, `line ${r + 2}`);
  }
  for (const [key, r] of lineOf)
    log.add(path, `line ${r + 2}: ${keyColumns.join(', ')} ${key} is not in the recomputation`);
}

function compareResults(
  log: MismatchLog,
  read: (path: string, columns: string[]) => CsvTable | null,
  run: RecomputedRun,
): void {
  const distances = read(DISTANCES_PATH, DISTANCES_COLUMNS);
  if (distances) {
    compareKeyed(
      log,
      DISTANCES_PATH,
      distances,
      ['sample_id', 'group'],
      run.distances,
      (r) => [r.sampleId, r.group],
      (r) => (t, i) => {
        log.cell(DISTANCES_PATH, t, i, 'd2', r.d2, 'relative');
        log.cell(DISTANCES_PATH, t, i, 'p_chi2', r.pChi2, 'probability');
        log.cell(DISTANCES_PATH, t, i, 'p_hotelling', r.pHotelling, 'probability');
      },
    );
  }
  const assignments = read(ASSIGNMENTS_PATH, ASSIGNMENTS_COLUMNS);
  if (assignments) {
    compareKeyed(
      log,
      ASSIGNMENTS_PATH,
      assignments,
      ['sample_id'],
      run.assignments,
      (r) => [r.sampleId],
      (r) => (t, i, where) => {
        const [, verdict, group, , runnerUp, runnerUpProbability, finalVerdict, finalGroup, reason] = t.rows[i];
        log.text(ASSIGNMENTS_PATH, `${where}, verdict`, r.verdict, verdict);
        log.text(ASSIGNMENTS_PATH, `${where}, group`, r.group, group);
        log.cell(ASSIGNMENTS_PATH, t, i, 'probability', r.probability, 'probability');
        log.text(ASSIGNMENTS_PATH, `${where}, runner_up`, r.runnerUp ?? '', runnerUp);
        if (r.runnerUpProbability === null)
          log.text(ASSIGNMENTS_PATH, `${where}, runner_up_probability`, '', runnerUpProbability);
        else log.cell(ASSIGNMENTS_PATH, t, i, 'runner_up_probability', r.runnerUpProbability, 'probability');
        // The final verdict is a reviewer's decision, not a computation: it may differ only with a reason.
        if (!(assignmentVerdicts as readonly string[]).includes(finalVerdict)) {
          log.add(ASSIGNMENTS_PATH, `${where}, final_verdict: "${finalVerdict}" is not a verdict`);
        } else if (reason === '') {
          log.text(ASSIGNMENTS_PATH, `${where}, final_verdict (no override reason)`, verdict, finalVerdict);
          log.text(
            ASSIGNMENTS_PATH,
            `${where}, final_group (no override reason)`,
            verdict === 'assigned' ? group : '',
            finalGroup,
          );
        }
      },
    );
  }
  const contributions = read(CONTRIBUTIONS_PATH, CONTRIBUTIONS_COLUMNS);
  if (contributions) {
    compareKeyed(
      log,
      CONTRIBUTIONS_PATH,
      contributions,
      ['sample_id', 'variable'],
      run.contributions,
      (r) => [r.sampleId, r.variable],
      (r) => (t, i, where) => {
        log.text(CONTRIBUTIONS_PATH, `${where}, group`, r.group, t.rows[i][1]);
        log.cell(CONTRIBUTIONS_PATH, t, i, 'contribution', r.contribution, 'relative');
      },
    );
  }
  const members = read(MEMBERS_PATH, MEMBERS_COLUMNS);
  if (members) {
    compareKeyed(
      log,
      MEMBERS_PATH,
      members,
      ['sample_id', 'group'],
      run.members,
      (r) => [r.sampleId, r.group],
      (r) => (t, i, where) => {
        log.cell(MEMBERS_PATH, t, i, 'd2', r.d2, 'relative');
        log.cell(MEMBERS_PATH, t, i, 'd2_loo', r.d2Loo, 'relative');
        log.cell(MEMBERS_PATH, t, i, 'p_hotelling_loo', r.pHotellingLoo, 'probability');
        log.text(MEMBERS_PATH, `${where}, verdict_loo`, r.verdictLoo, t.rows[i][5]);
      },
    );
  }
  const separation = read(SEPARATION_PATH, SEPARATION_COLUMNS);
  if (separation) {
    compareKeyed(
      log,
      SEPARATION_PATH,
      separation,
      ['group_a', 'group_b'],
      run.separation,
      (r) => [r.groupA, r.groupB],
      (r) => (t, i) => {
        log.cell(SEPARATION_PATH, t, i, 't2', r.t2, 'relative');
        log.cell(SEPARATION_PATH, t, i, 'f', r.f, 'relative');
        log.cell(SEPARATION_PATH, t, i, 'df1', r.df1, 'exact');
        log.cell(SEPARATION_PATH, t, i, 'df2', r.df2, 'exact');
        log.cell(SEPARATION_PATH, t, i, 'p', r.p, 'probability');
      },
    );
  }
}

/**
 * Recomputes the run from inputs/prepared.csv and the manifest's parameters and seed, and logs every
 * difference from the bundle's transformed values, group files and results beyond the tolerance.
 */
export function compareWithRecomputation(
  files: ReadonlyMap<string, Buffer>,
  manifest: BundleManifest,
  log: MismatchLog,
): void {
  const read = (path: string, columns?: string[]): CsvTable | null => {
    const bytes = files.get(path);
    if (!bytes) return null;
    try {
      return parseCsv(bytes.toString('utf8'), path, columns);
    } catch (error) {
      log.add(path, (error as Error).message);
      return null;
    }
  };
  const preparedBytes = files.get(PREPARED_PATH);
  if (!preparedBytes) return log.add(PREPARED_PATH, 'missing, so the results cannot be recomputed');
  let run: RecomputedRun;
  let cells: ReturnType<typeof readPrepared>['cells'];
  try {
    const read = readPrepared(preparedBytes.toString('utf8'), manifest.parameters.elements);
    cells = read.cells;
    run = recomputeRun(read.prepared, manifest.parameters, manifest.seed);
  } catch (error) {
    return log.add(PREPARED_PATH, `the results cannot be recomputed: ${(error as Error).message}`);
  }
  for (const cell of cells) {
    const expected = run.transformed[cell.sample][cell.element];
    const where = `line ${cell.line}, transformed_value`;
    if (expected === null || cell.value === null)
      log.text(PREPARED_PATH, where, String(expected ?? ''), String(cell.value ?? ''));
    else log.number(PREPARED_PATH, where, expected, cell.value, 'relative');
  }
  compareGroups(log, files, manifest, run.groups);
  compareResults(log, read, run);
}
