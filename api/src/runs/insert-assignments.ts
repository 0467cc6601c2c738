import type { EntityManager } from 'typeorm';
import type { ClassifyResults } from '@provenote/workers';

/** Rows per INSERT: keeps each statement's parameters to a few megabytes. */
export const INSERT_SLICE_ROWS = 10_000;

/**
 * A float8[] literal built with join, which formats numbers in native code: handing pg a JavaScript array
 * instead makes it escape and quote every element in JavaScript, which profiled as the worker's largest cost
 * when storing 100,000 results. NaN and ±Infinity come out as PostgreSQL's own spellings.
 */
export function float8Literal(values: Float64Array): string {
  return `{${values.join(',')}}`;
}

export function rowSlices(total: number, size = INSERT_SLICE_ROWS): [number, number][] {
  const slices: [number, number][] = [];
  for (let from = 0; from < total; from += size) slices.push([from, Math.min(total, from + size)]);
  return slices;
}

/**
 * Unknowns [from, to) in one statement: every column is sent as one array and unnested in the server;
 * the per-group arrays go flat (sample-major) and are cut per row by slicing, since unnest flattens a
 * two-dimensional array completely.
 */
export async function insertAssignments(
  manager: EntityManager,
  runId: string,
  results: ClassifyResults,
  from: number,
  to: number,
): Promise<void> {
  const g = results.groups.length;
  const p = results.variables.length;
  const flat = (values: Float64Array, width: number) => float8Literal(values.subarray(from * width, to * width));
  await manager.query(
    `INSERT INTO run_assignments (run_id, ordinal, sample_id, verdict, group_name, probability, runner_up,
       runner_up_probability, d2, p_chi2, p_hotelling, contributions)
     SELECT $1, $2::int + t.k - 1, t.sample_id, t.verdict, t.group_name, t.probability, t.runner_up, t.runner_up_p,
       ($9::float8[])[(t.k - 1) * $13::int + 1 : t.k * $13::int],
       ($10::float8[])[(t.k - 1) * $13::int + 1 : t.k * $13::int],
       ($11::float8[])[(t.k - 1) * $13::int + 1 : t.k * $13::int],
       ($12::float8[])[(t.k - 1) * $14::int + 1 : t.k * $14::int]
     FROM unnest($3::text[], $4::text[], $5::text[], $6::float8[], $7::text[], $8::float8[]) WITH ORDINALITY
       AS t(sample_id, verdict, group_name, probability, runner_up, runner_up_p, k)`,
    [
      runId,
      from,
      results.sampleIds.slice(from, to),
      results.verdicts.slice(from, to),
      results.bestGroups.slice(from, to),
      float8Literal(results.probabilities.subarray(from, to)),
      results.runnerUps.slice(from, to),
      results.runnerUpProbabilities.slice(from, to),
      flat(results.d2, g),
      flat(results.pChi2, g),
      flat(results.pHotelling, g),
      flat(results.contributions, p),
      g,
      p,
    ],
  );
}
