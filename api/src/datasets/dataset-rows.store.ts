import { pipeline } from 'node:stream/promises';
import { Readable } from 'node:stream';
import type { PoolClient } from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { Problem } from '@provenote/shared';
import type { EntityManager } from 'typeorm';
import type { ImportedRow } from './parsing/import-rows';

const COPY_NULL = '\\N';
const COPY_ESCAPES: Record<string, string> = { '\\': '\\\\', '\t': '\\t', '\n': '\\n', '\r': '\\r' };

/** A field of COPY's text format: backslash, tab and line breaks would otherwise end the field or the row. */
function copyField(value: string | null): string {
  return value === null ? COPY_NULL : value.replace(/[\\\t\n\r]/g, (c) => COPY_ESCAPES[c]);
}

/** A PostgreSQL array literal ("{1.5,NULL}"); join formats the numbers in native code. */
function numberArray(values: (number | null)[]): string {
  return `{${values.map((value) => (value === null ? 'NULL' : value)).join(',')}}`;
}

function textArray(values: (string | null)[]): string {
  return `{${values.map((value) => (value === null ? 'NULL' : `"${value.replace(/["\\]/g, '\\$&')}"`)).join(',')}}`;
}

function sameValues(a: (number | null)[], b: (number | null)[]): boolean {
  return a.length === b.length && a.every((value, i) => Object.is(value, b[i]));
}

/** One dataset_rows line of COPY text, in the column order of ROW_COLUMNS. */
export function copyLine(versionId: string, row: ImportedRow): string {
  const ppm = numberArray(row.ppm);
  // Most files are in ppm already: the original values then format to the same text, done once.
  const original = sameValues(row.ppm, row.original) ? ppm : numberArray(row.original);
  return [
    versionId,
    String(row.position),
    String(row.sourceRow),
    copyField(row.sampleId),
    copyField(row.group),
    ppm,
    original,
    `{${row.flags.join(',')}}`,
    copyField(textArray(row.raw)),
    copyField(row.attributes ? JSON.stringify(row.attributes) : null),
  ].join('\t');
}

const ROW_COLUMNS = 'version_id, position, source_row, sample_id, group_name, ppm, original, flags, raw, attributes';

/** The pg connection behind the import's transaction: COPY must run on it to be part of that transaction. */
async function transactionClient(manager: EntityManager): Promise<PoolClient> {
  const runner = manager.queryRunner;
  if (!runner?.isTransactionActive) throw new Error('dataset rows are written only inside the import transaction');
  return (await runner.connect()) as PoolClient;
}

/**
 * Writes a batch of rows with one COPY in text format: PostgreSQL reads the rows as a stream, with
 * none of the per-statement parameter handling and unnest() of a batched INSERT, which profiled as
 * the import's largest cost.
 */
export async function insertRows(manager: EntityManager, versionId: string, rows: ImportedRow[]): Promise<void> {
  if (rows.length === 0) return;
  const client = await transactionClient(manager);
  const text = rows.map((row) => `${copyLine(versionId, row)}\n`).join('');
  await pipeline(Readable.from([text]), client.query(copyFrom(`COPY dataset_rows (${ROW_COLUMNS}) FROM STDIN`)));
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
