import { createHash } from 'node:crypto';
import { normaliseUnit } from './guess-column';
import { FileRejectedError } from './import-errors';
import { type DecimalSeparator, readNumber, sniffDecimalSeparator } from './read-cell';
import type { RawCell, RawRow, TableSource } from './table-source';

export interface Layout {
  headers: string[];
  duplicateHeaders: string[];
  unitsRow: string[] | null;
  /** Row number of the first data row: below the header, and below the units row when there is one. */
  firstDataRow: number;
  width: number;
  decimalSeparator: DecimalSeparator;
  fingerprint: string;
  notes: string[];
}

const SAMPLE_ROWS = 200;

export const cellText = (cell: RawCell | undefined): string =>
  cell === null || cell === undefined ? '' : String(cell).trim();
export const isBlankRow = (row: RawRow): boolean => row.cells.every((cell) => cellText(cell) === '');

/** The normalised header list: a later file with the same columns in the same order gets the same value. */
export function layoutFingerprint(headers: string[]): string {
  const normalised = headers.map((header) => header.normalize('NFKC').toLowerCase().replace(/\s+/g, ' ').trim());
  return createHash('sha256').update(normalised.join('\u001f')).digest('hex').slice(0, 32);
}

function looksLikeUnitsRow(cells: RawCell[], decimal: DecimalSeparator): boolean {
  const texts = cells.map(cellText).filter((text) => text !== '');
  if (texts.length === 0 || texts.some((text) => readNumber(text, decimal) !== null)) return false;
  return texts.filter((text) => normaliseUnit(text) !== null).length >= Math.max(1, texts.length / 2);
}

/**
 * Finds the header (the first non-blank row), a units row under it, the width of the table (blank columns
 * at the right edge are left out), repeated column names and the decimal separator, from the first rows.
 */
export async function readLayout(source: TableSource, decimalOverride?: DecimalSeparator): Promise<Layout> {
  const sample: RawRow[] = [];
  let leadingBlank = 0;
  for await (const row of source.rows()) {
    if (sample.length === 0 && isBlankRow(row)) {
      leadingBlank++;
      continue;
    }
    sample.push(row);
    if (sample.length >= SAMPLE_ROWS) break;
  }
  if (sample.length === 0) throw new FileRejectedError('empty-file', 'The file holds only blank rows');
  const [headerRow, ...rest] = sample;
  const headerTexts = headerRow.cells.map(cellText);
  let width = headerTexts.length;
  while (width > 0 && headerTexts[width - 1] === '' && rest.every((row) => cellText(row.cells[width - 1]) === ''))
    width--;
  const notes: string[] = [];
  if (leadingBlank > 0) notes.push(`${leadingBlank} blank row(s) above the header were skipped`);
  if (width < headerTexts.length)
    notes.push(`${headerTexts.length - width} blank column(s) at the right were left out`);
  const headers = headerTexts.slice(0, width).map((text, i) => text || `Column ${i + 1}`);
  const counts = new Map<string, number>();
  headers.forEach((header) => counts.set(header, (counts.get(header) ?? 0) + 1));
  const duplicateHeaders = [...counts].filter(([, count]) => count > 1).map(([header]) => header);
  if (duplicateHeaders.length > 0) {
    notes.push(`Column names used more than once: ${duplicateHeaders.join(', ')}; they are told apart by position`);
  }
  const stringCells = function* () {
    for (const row of rest) for (const cell of row.cells) if (typeof cell === 'string') yield cell;
  };
  const decimalSeparator = decimalOverride ?? sniffDecimalSeparator(stringCells());
  const unitsRow =
    rest.length > 0 && looksLikeUnitsRow(rest[0].cells.slice(0, width), decimalSeparator)
      ? Array.from({ length: width }, (_, i) => cellText(rest[0].cells[i]))
      : null;
  return {
    headers,
    duplicateHeaders,
    unitsRow,
    firstDataRow: headerRow.row + (unitsRow ? 2 : 1),
    width,
    decimalSeparator,
    fingerprint: layoutFingerprint(headers),
    notes,
  };
}
