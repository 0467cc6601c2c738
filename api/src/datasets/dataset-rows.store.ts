import type { PoolClient } from 'pg';
import type { Problem } from '@provenote/shared';
import type { EntityManager } from 'typeorm';
import { BinaryCopyWriter, copyIn, uuidBytes } from './copy-binary';
import type { ImportedRow } from './parsing/import-rows';

const ROW_COLUMNS = 'version_id, position, source_row, sample_id, group_name, ppm, original, flags, raw, attributes';
const ROW_FIELDS = 10;

function sameValues(a: readonly (number | null)[], b: readonly (number | null)[]): boolean {
  return a === b || (a.length === b.length && a.every((value, i) => Object.is(value, b[i])));
}

/**
 * A batch of dataset_rows as one binary COPY stream, fields in the order of ROW_COLUMNS. Arrays that rows
 * share (the import's one all-measured flags array and one all-null text array) are encoded once per batch
 * and their bytes repeated.
 */
export function copyRows(versionId: string, rows: readonly ImportedRow[]): Buffer {
  const version = uuidBytes(versionId);
  const width = rows[0]?.ppm.length ?? 0;
  const writer = new BinaryCopyWriter(rows.length * (160 + 40 * width));
  const encoded = new Map<readonly unknown[], { start: number; end: number }>();
  const once = <T>(values: readonly T[], encode: (values: readonly T[]) => void) => {
    const earlier = encoded.get(values);
    if (earlier) return writer.repeat(earlier.start, earlier.end);
    const start = writer.position;
    encode(values);
    if (Object.isFrozen(values)) encoded.set(values, { start, end: writer.position });
  };
  for (const row of rows) {
    writer.tuple(ROW_FIELDS);
    writer.uuid(version);
    writer.int4(row.position);
    writer.int4(row.sourceRow);
    writer.text(row.sampleId);
    writer.text(row.group);
    const ppmStart = writer.position;
    writer.float8Array(row.ppm);
    // Most files are in ppm already: the original values are then the same bytes, encoded once.
    if (sameValues(row.ppm, row.original)) writer.repeat(ppmStart, writer.position);
    else writer.float8Array(row.original);
    once(row.flags, (flags) => writer.int2Array(flags));
    once(row.raw, (raw) => writer.textArray(raw));
    writer.jsonb(row.attributes);
  }
  return writer.finish();
}

/** The pg connection behind the import's transaction: COPY must run on it to be part of that transaction. */
async function transactionClient(manager: EntityManager): Promise<PoolClient> {
  const runner = manager.queryRunner;
  if (!runner?.isTransactionActive) throw new Error('dataset rows are written only inside the import transaction');
  return (await runner.connect()) as PoolClient;
}

/**
 * Writes a batch of rows with one COPY in binary format: PostgreSQL reads the rows as a stream, with none
 * of the per-statement parameter handling of a batched INSERT, and takes the numbers as IEEE doubles
 * instead of parsing decimal text (which, in COPY's text format, was most of the import's time).
 */
export async function insertRows(manager: EntityManager, versionId: string, rows: ImportedRow[]): Promise<void> {
  if (rows.length === 0) return;
  const client = await transactionClient(manager);
  await copyIn(client, `COPY dataset_rows (${ROW_COLUMNS}) FROM STDIN (FORMAT binary)`, [copyRows(versionId, rows)]);
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
