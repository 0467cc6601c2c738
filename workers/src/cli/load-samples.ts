import type { Measurement } from '@provenote/shared';
import { InputFileError } from './cli-errors';
import type { Table } from './read-table';

export interface LoadedSamples {
  readonly file: string;
  readonly ids: string[];
  /** Group of each row; null when the file has no group column (unknowns). */
  readonly groups: string[] | null;
  readonly elements: string[];
  readonly measurements: Measurement[][];
  /** Line of each row in the file (header = line 1), for messages. */
  readonly lines: number[];
}

const BELOW_LIMIT = /^<\s*(.+)$/;

function isNumberText(text: string): boolean {
  return text.trim() !== '' && Number.isFinite(Number(text));
}

/** A cell as a measurement: a number, or "<DL" for a value below the detection limit DL. */
function parseCell(text: string, file: string, line: number, column: string): Measurement {
  if (text === '')
    throw new InputFileError(
      file,
      'is empty (missing values are not accepted; write values below the detection limit as <DL)',
      line,
      column,
    );
  const below = BELOW_LIMIT.exec(text);
  if (below) {
    const limit = Number(below[1]);
    if (!isNumberText(below[1]) || !(limit > 0))
      throw new InputFileError(file, `"${text}" is not a detection limit of the form <DL with DL > 0`, line, column);
    return { belowDetectionLimit: limit };
  }
  if (!isNumberText(text)) throw new InputFileError(file, `"${text}" is not a number`, line, column);
  return Number(text);
}

/**
 * The element columns: those named by --elements, or by default every column except the id and group
 * columns in which at least half the cells read as numbers or "<DL" (a text column such as a site
 * name is left out; a numeric column with a stray bad cell is kept, so the bad cell is reported).
 */
export function resolveElements(
  table: Table,
  requested: readonly string[] | null,
  excluded: readonly string[],
): string[] {
  if (requested !== null) {
    for (const element of requested) {
      if (!table.header.includes(element))
        throw new InputFileError(table.file, `has no column "${element}" (named in --elements)`, 1);
      if (excluded.includes(element))
        throw new InputFileError(table.file, `"${element}" is the id or group column and cannot be an element`, 1);
    }
    return [...requested];
  }
  const elements = table.header.filter((name, j) => {
    if (excluded.includes(name)) return false;
    const numeric = table.rows.filter((row) => isNumberText(row[j]) || BELOW_LIMIT.test(row[j])).length;
    return table.rows.length > 0 && numeric * 2 >= table.rows.length;
  });
  if (elements.length === 0) throw new InputFileError(table.file, 'has no numeric element column', 1);
  return elements;
}

export function loadSamples(
  table: Table,
  elements: readonly string[],
  idColumn: string,
  groupColumn: string | null,
): LoadedSamples {
  const column = (name: string): number => {
    const j = table.header.indexOf(name);
    if (j < 0) throw new InputFileError(table.file, `has no column "${name}"`, 1);
    return j;
  };
  const idIndex = column(idColumn);
  const groupIndex = groupColumn === null ? -1 : column(groupColumn);
  const elementIndex = elements.map(column);
  if (table.rows.length === 0) throw new InputFileError(table.file, 'has no data rows');
  const seen = new Map<string, number>();
  const lines = table.rows.map((_, i) => i + 2);
  const ids = table.rows.map((row, i) => {
    const id = row[idIndex];
    if (id === '') throw new InputFileError(table.file, 'sample id is empty', lines[i], idColumn);
    const first = seen.get(id);
    if (first !== undefined)
      throw new InputFileError(table.file, `sample id "${id}" repeats the one on line ${first}`, lines[i], idColumn);
    seen.set(id, lines[i]);
    return id;
  });
  const groups =
    groupIndex < 0
      ? null
      : table.rows.map((row, i) => {
          if (row[groupIndex] === '')
            throw new InputFileError(table.file, 'group is empty', lines[i], groupColumn ?? undefined);
          return row[groupIndex];
        });
  const measurements = table.rows.map((row, i) =>
    elementIndex.map((j, k) => parseCell(row[j], table.file, lines[i], elements[k])),
  );
  return { file: table.file, ids, groups, elements: [...elements], measurements, lines };
}
