import type { Problem } from '@provenote/shared';
import type { EntityManager } from 'typeorm';
import type { ImportedRow } from './parsing/import-rows';

/** A PostgreSQL array literal ("{1.5,NULL}"): one text parameter per row instead of one per cell. */
function numberArray(values: (number | null)[]): string {
  return `{${values.map((value) => (value === null ? 'NULL' : String(value))).join(',')}}`;
}

function textArray(values: (string | null)[]): string {
  return `{${values.map((value) => (value === null ? 'NULL' : `"${value.replace(/["\\]/g, '\\$&')}"`)).join(',')}}`;
}

/**
 * Writes a batch of rows with one statement: each column travels as one array parameter and unnest()
 * turns them back into rows, so the cost is a few round trips per thousand samples, never one per row.
 */
export async function insertRows(manager: EntityManager, versionId: string, rows: ImportedRow[]): Promise<void> {
  if (rows.length === 0) return;
  await manager.query(
    `INSERT INTO dataset_rows (version_id, position, source_row, sample_id, group_name, ppm, original, flags, raw, attributes)
     SELECT $1, t.position, t.source_row, t.sample_id, t.group_name, t.ppm::float8[], t.original::float8[],
            t.flags::smallint[], t.raw::text[], t.attributes
     FROM unnest($2::int[], $3::int[], $4::text[], $5::text[], $6::text[], $7::text[], $8::text[], $9::text[], $10::jsonb[])
       AS t(position, source_row, sample_id, group_name, ppm, original, flags, raw, attributes)`,
    [
      versionId,
      rows.map((row) => row.position),
      rows.map((row) => row.sourceRow),
      rows.map((row) => row.sampleId),
      rows.map((row) => row.group),
      rows.map((row) => numberArray(row.ppm)),
      rows.map((row) => numberArray(row.original)),
      rows.map((row) => `{${row.flags.join(',')}}`),
      rows.map((row) => textArray(row.raw)),
      rows.map((row) => (row.attributes ? JSON.stringify(row.attributes) : null)),
    ],
  );
}

export async function insertProblems(
  manager: EntityManager,
  versionId: string,
  firstPosition: number,
  problems: Problem[],
): Promise<void> {
  if (problems.length === 0) return;
  await manager.query(
    `INSERT INTO dataset_problems (version_id, position, source_row, column_name, raw, code, message, action)
     SELECT $1, * FROM unnest($2::int[], $3::int[], $4::text[], $5::text[], $6::text[], $7::text[], $8::text[])`,
    [
      versionId,
      problems.map((_, i) => firstPosition + i),
      problems.map((problem) => problem.row),
      problems.map((problem) => problem.column),
      problems.map((problem) => problem.raw),
      problems.map((problem) => problem.code),
      problems.map((problem) => problem.message),
      problems.map((problem) => problem.action),
    ],
  );
}
