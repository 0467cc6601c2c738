import { parse } from 'csv-parse/sync';

/** A CSV cell before writing: text, a number written at full precision, or empty (null). */
export type CsvCell = string | number | null;

/*
 * Spreadsheet formula injection (OWASP "CSV Injection"): a cell whose text begins with =, +, -, @, a tab
 * or a carriage return may be run as a formula when the file is opened. Such text is prefixed with an
 * apostrophe, which spreadsheets show as text. Numbers are written as numbers, so -1.5 stays -1.5, and
 * text that is itself a plain decimal number cannot be a formula and is left alone.
 */
const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

function needsEscape(text: string): boolean {
  if (PLAIN_NUMBER.test(text)) return false;
  // An apostrophe before text that needs escaping is escaped too, so reading back is never ambiguous.
  return FORMULA_START.test(text) || (text.startsWith("'") && needsEscape(text.slice(1)));
}

export function escapeFormula(text: string): string {
  return needsEscape(text) ? `'${text}` : text;
}

export function unescapeFormula(text: string): string {
  return text.startsWith("'") && needsEscape(text.slice(1)) ? text.slice(1) : text;
}

export class CsvValueError extends Error {
  override readonly name = 'CsvValueError';
}

function formatCell(cell: CsvCell, column: string): string {
  if (cell === null) return '';
  if (typeof cell === 'number') {
    if (!Number.isFinite(cell))
      throw new CsvValueError(`column "${column}" holds ${cell}, which a bundle cannot record`);
    // String() gives the shortest text that reads back as the same double.
    return String(cell);
  }
  const text = escapeFormula(cell);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** RFC 4180 CSV with a header line and CRLF line ends. */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  const lines = [header.map((name) => formatCell(name, name)).join(',')];
  for (const row of rows) {
    if (row.length !== header.length)
      throw new CsvValueError(`a row has ${row.length} cells for ${header.length} columns`);
    lines.push(row.map((cell, j) => formatCell(cell, header[j])).join(','));
  }
  return lines.join('\r\n') + '\r\n';
}

export interface CsvTable {
  readonly header: string[];
  readonly rows: string[][];
}

/** Parses a bundle CSV and undoes the formula escaping; rows shorter or longer than the header are refused. */
export function parseCsv(text: string, file: string, expectedHeader?: readonly string[]): CsvTable {
  let records: string[][];
  try {
    records = parse(text, { bom: true, relaxQuotes: false, skipEmptyLines: true });
  } catch (error) {
    throw new CsvValueError(`${file}: ${(error as Error).message}`);
  }
  if (records.length === 0) throw new CsvValueError(`${file} is empty`);
  const [header, ...rows] = records.map((record) => record.map(unescapeFormula));
  if (expectedHeader && header.join(',') !== expectedHeader.join(',')) {
    throw new CsvValueError(`${file} has columns ${header.join(',')}; expected ${expectedHeader.join(',')}`);
  }
  rows.forEach((row, i) => {
    if (row.length !== header.length) {
      throw new CsvValueError(`${file} line ${i + 2} has ${row.length} cells for ${header.length} columns`);
    }
  });
  return { header, rows };
}

/** A numeric cell read back; an empty or non-numeric cell is named rather than turned into NaN. */
export function parseNumberCell(text: string, where: string): number {
  const value = text.trim() === '' ? Number.NaN : Number(text);
  if (!Number.isFinite(value)) throw new CsvValueError(`${where}: "${text}" is not a number`);
  return value;
}
