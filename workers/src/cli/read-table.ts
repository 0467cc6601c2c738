import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { InputFileError } from './cli-errors';

export interface Table {
  readonly file: string;
  readonly header: string[];
  /** Data rows; line numbers are index + 2 (the header is line 1). */
  readonly rows: string[][];
  readonly sha256: string;
}

/** Reads a CSV file with a header row; every row must have the header's number of cells. */
export function readTable(file: string): Table {
  let bytes: Buffer;
  try {
    bytes = readFileSync(file);
  } catch (error) {
    throw new InputFileError(
      file,
      `cannot be read (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})`,
    );
  }
  let records: string[][];
  try {
    records = parse(bytes, { bom: true, skip_empty_lines: true, trim: true, relax_column_count: true });
  } catch (error) {
    throw new InputFileError(file, `is not valid CSV (${(error as Error).message})`);
  }
  if (records.length === 0) throw new InputFileError(file, 'is empty');
  const [header, ...rows] = records;
  const seen = new Set<string>();
  header.forEach((name, j) => {
    if (name === '') throw new InputFileError(file, `header cell ${j + 1} is empty`, 1);
    if (seen.has(name)) throw new InputFileError(file, 'appears twice in the header', 1, name);
    seen.add(name);
  });
  rows.forEach((row, i) => {
    if (row.length !== header.length)
      throw new InputFileError(file, `has ${row.length} cells, the header has ${header.length}`, i + 2);
  });
  return { file, header, rows, sha256: createHash('sha256').update(bytes).digest('hex') };
}
