import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { type DatasetKind, type DatasetMapping, type Problem, cellFlags } from '@provenote/shared';
import type { ImportedRow } from '../parsing/import-rows';
import { analyseFile, importFile } from '../parsing/parse-file';

export const FIXTURES = join(__dirname, '..', '..', '..', 'test', 'fixtures', 'import');
export const fixture = (name: string) => readFileSync(join(FIXTURES, name));

/** Imports a file into memory with the guessed (or a given) mapping, as the tests read it. */
export async function collectImport(
  bytes: Buffer,
  filename: string,
  kind: DatasetKind | null = null,
  mapping?: DatasetMapping,
) {
  const analysis = await analyseFile(bytes, filename);
  const rows: ImportedRow[] = [];
  const problems: Problem[] = [];
  const result = await importFile(bytes, filename, mapping ?? analysis.guessedMapping, kind, {
    rows: async (batch) => void rows.push(...batch),
    problems: async (batch) => void problems.push(...batch),
  });
  const flagsOf = (row: ImportedRow) => row.flags.map((flag) => cellFlags[flag]);
  return { analysis, rows, problems, flagsOf, ...result };
}
