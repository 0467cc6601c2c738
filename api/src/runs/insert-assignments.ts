import type { PoolClient } from 'pg';
import type { EntityManager } from 'typeorm';
import type { ClassifyResults } from '@provenote/workers';
import { BinaryCopyWriter, copyIn, uuidBytes } from '../datasets/copy-binary';

/** Rows per COPY: keeps each stream's buffer to about ten megabytes. */
export const INSERT_SLICE_ROWS = 10_000;

export function rowSlices(total: number, size = INSERT_SLICE_ROWS): [number, number][] {
  const slices: [number, number][] = [];
  for (let from = 0; from < total; from += size) slices.push([from, Math.min(total, from + size)]);
  return slices;
}

const ASSIGNMENT_COLUMNS = `run_id, ordinal, sample_id, verdict, group_name, probability, runner_up,
  runner_up_probability, d2, p_chi2, p_hotelling, contributions`;
const ASSIGNMENT_FIELDS = 12;

/** What the assignment rows are made of; the projections are stored apart. */
export type AssignmentResults = Omit<ClassifyResults, 'projections'>;

/** Unknowns [from, to) of a run's results as one binary COPY stream, fields in ASSIGNMENT_COLUMNS order. */
export function assignmentsCopy(runId: string, results: AssignmentResults, from: number, to: number): Buffer {
  const g = results.groups.length;
  const p = results.variables.length;
  const run = uuidBytes(runId);
  const writer = new BinaryCopyWriter((to - from) * (200 + 36 * g + 12 * p));
  for (let i = from; i < to; i++) {
    writer.tuple(ASSIGNMENT_FIELDS);
    writer.uuid(run);
    writer.int4(i);
    writer.text(results.sampleIds[i]);
    writer.text(results.verdicts[i]);
    writer.text(results.bestGroups[i]);
    writer.float8(results.probabilities[i]);
    writer.text(results.runnerUps[i]);
    writer.float8(results.runnerUpProbabilities[i]);
    writer.float8Array(results.d2.subarray(i * g, (i + 1) * g));
    writer.float8Array(results.pChi2.subarray(i * g, (i + 1) * g));
    writer.float8Array(results.pHotelling.subarray(i * g, (i + 1) * g));
    writer.float8Array(results.contributions.subarray(i * p, (i + 1) * p));
  }
  return writer.finish();
}

/**
 * Unknowns [from, to) with one COPY in binary format, on the connection of the results transaction.
 * The numbers go as IEEE doubles: formatting 5 million of them as decimal text (and PostgreSQL parsing
 * them back) profiled as the worker's largest cost when storing 100,000 results.
 */
export async function insertAssignments(
  manager: EntityManager,
  runId: string,
  results: AssignmentResults,
  from: number,
  to: number,
): Promise<void> {
  const runner = manager.queryRunner;
  if (!runner?.isTransactionActive) throw new Error('assignments are written only inside the results transaction');
  const client = (await runner.connect()) as PoolClient;
  await copyIn(client, `COPY run_assignments (${ASSIGNMENT_COLUMNS}) FROM STDIN (FORMAT binary)`, [
    assignmentsCopy(runId, results, from, to),
  ]);
}
