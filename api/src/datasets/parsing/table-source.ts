import { Readable } from 'node:stream';
import { parse } from 'csv-parse';
import ExcelJS from 'exceljs';
import { type TextEncoding, decodeText } from './decode-text';
import { FileRejectedError } from './import-errors';
import { type Delimiter, sniffDelimiter } from './sniff-delimiter';
import { assertSafeZip } from './zip-guard';

export type RawCell = string | number | null;

export interface RawRow {
  /** As a spreadsheet numbers it: the first record of the file is row 1. */
  row: number;
  cells: RawCell[];
  /** Spreadsheet cells holding a formula, by position; the stored result is in `cells`. */
  formulas?: Map<number, string>;
}

export interface TableSource {
  format: 'csv' | 'xlsx';
  delimiter: Delimiter | null;
  encoding: TextEncoding | null;
  sheets: string[];
  sheet: string | null;
  rows(): AsyncIterable<RawRow>;
}

export interface OpenOptions {
  delimiter?: Delimiter | null;
  encoding?: TextEncoding | null;
  sheet?: string | null;
}

const ZIP_MAGIC = 0x04034b50;
const OLE_MAGIC = 0xe011cfd0;
const TEXT_CHUNK = 1 << 20;

export function detectFormat(bytes: Buffer, filename: string): 'csv' | 'xlsx' {
  if (bytes.length >= 4 && bytes.readUInt32LE(0) === OLE_MAGIC) {
    throw new FileRejectedError(
      'legacy-excel',
      'Old-style .xls workbooks are not read; save the sheet as .xlsx or CSV',
    );
  }
  if (/\.xlsx$/i.test(filename) || (bytes.length >= 4 && bytes.readUInt32LE(0) === ZIP_MAGIC)) return 'xlsx';
  return 'csv';
}

/** Opens an uploaded file as rows of cells, whatever its format. */
export async function openTable(bytes: Buffer, filename: string, options: OpenOptions = {}): Promise<TableSource> {
  return detectFormat(bytes, filename) === 'xlsx'
    ? openWorkbook(bytes, options.sheet ?? null)
    : openText(bytes, options);
}

function openText(bytes: Buffer, options: OpenOptions): TableSource {
  const { text, encoding } = decodeText(bytes, options.encoding ?? null);
  if (text.trim() === '') throw new FileRejectedError('empty-file', 'The file holds no text');
  const delimiter = options.delimiter ?? sniffDelimiter(text);
  return {
    format: 'csv',
    delimiter,
    encoding,
    sheets: [],
    sheet: null,
    rows: () => csvRows(text, delimiter),
  };
}

function csvRows(text: string, delimiter: Delimiter): AsyncIterable<RawRow> {
  return text.includes('"') ? quotedCsvRows(text, delimiter) : unquotedCsvRows(text, delimiter);
}

/**
 * Without a quote character anywhere, CSV has no escapes: each line is a record and each delimiter ends a
 * field. Splitting natively is several times faster than the general parser on large instrument exports.
 */
async function* unquotedCsvRows(text: string, delimiter: Delimiter): AsyncIterable<RawRow> {
  let row = 0;
  for (let start = 0; start < text.length;) {
    const newline = text.indexOf('\n', start);
    const end = newline < 0 ? text.length : newline;
    const line = text.slice(start, end > start && text[end - 1] === '\r' ? end - 1 : end);
    start = end + 1;
    yield { row: ++row, cells: line.split(delimiter) };
  }
}

async function* quotedCsvRows(text: string, delimiter: Delimiter): AsyncIterable<RawRow> {
  // Chunks keep the parser streaming: records reach the store while later ones are still being split.
  const chunks = function* () {
    for (let i = 0; i < text.length; i += TEXT_CHUNK) yield text.slice(i, i + TEXT_CHUNK);
  };
  const parser = Readable.from(chunks()).pipe(
    parse({ delimiter, relax_column_count: true, skip_empty_lines: false, trim: false }),
  );
  let row = 0;
  try {
    for await (const record of parser as AsyncIterable<string[]>) {
      row++;
      yield { row, cells: record };
    }
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    throw new FileRejectedError('malformed-csv', `The file cannot be split into cells after row ${row}: ${message}`);
  }
}

async function openWorkbook(bytes: Buffer, sheetName: string | null): Promise<TableSource> {
  assertSafeZip(bytes);
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch {
    throw new FileRejectedError('not-a-workbook', 'This .xlsx file is not a readable Excel workbook');
  }
  const sheets = workbook.worksheets.map((worksheet) => worksheet.name);
  const worksheet = sheetName ? workbook.getWorksheet(sheetName) : workbook.worksheets[0];
  if (!worksheet) {
    throw new FileRejectedError(
      'no-sheet',
      sheetName ? `The workbook has no sheet "${sheetName}"` : 'The workbook has no sheets',
    );
  }
  return {
    format: 'xlsx',
    delimiter: null,
    encoding: null,
    sheets,
    sheet: worksheet.name,
    rows: () => sheetRows(worksheet),
  };
}

async function* sheetRows(worksheet: ExcelJS.Worksheet): AsyncIterable<RawRow> {
  for (let r = 1; r <= worksheet.rowCount; r++) {
    const row = worksheet.getRow(r);
    const cells: RawCell[] = [];
    const formulas = new Map<number, string>();
    for (let c = 1; c <= row.cellCount; c++) {
      const { value, formula } = cellValue(row.getCell(c).value);
      cells.push(value);
      if (formula !== null) formulas.set(c - 1, formula);
    }
    yield formulas.size > 0 ? { row: r, cells, formulas } : { row: r, cells };
  }
}

function cellValue(value: ExcelJS.CellValue): { value: RawCell; formula: string | null } {
  if (value === null || value === undefined) return { value: null, formula: null };
  if (typeof value === 'number' || typeof value === 'string') return { value, formula: null };
  if (typeof value === 'boolean') return { value: String(value), formula: null };
  if (value instanceof Date) return { value: value.toISOString(), formula: null };
  if ('richText' in value) return { value: value.richText.map((part) => part.text).join(''), formula: null };
  if ('formula' in value || 'sharedFormula' in value) {
    const formula = 'formula' in value ? value.formula : value.sharedFormula;
    const result = value.result;
    const stored = result === undefined || result === null || typeof result === 'object' ? null : result;
    return { value: typeof stored === 'boolean' ? String(stored) : stored, formula: `=${formula}` };
  }
  if ('error' in value) return { value: value.error, formula: null };
  if ('text' in value) return { value: value.text, formula: null };
  return { value: null, formula: null };
}
