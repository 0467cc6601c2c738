import { type CellFlag, type ImportSummary, type Problem, cellFlags, cellFlagLabels } from '@provenote/shared';
import { type Layout, cellText, isBlankRow } from './layout';
import { isPlainNumber, readCell } from './read-cell';
import type { ResolvedMapping } from './resolve-columns';
import type { RawRow, TableSource } from './table-source';

/** One imported sample, in the shape dataset_rows stores it; arrays run parallel to the measurement columns. */
export interface ImportedRow {
  position: number;
  sourceRow: number;
  sampleId: string;
  group: string | null;
  ppm: (number | null)[];
  original: (number | null)[];
  /** Positions in `cellFlags`. */
  flags: number[];
  /** The cell's text wherever it was not a plain number. */
  raw: (string | null)[];
  attributes: Record<string, string> | null;
}

export interface ImportSink {
  rows(batch: ImportedRow[]): Promise<void>;
  problems(batch: Problem[]): Promise<void>;
}

const BATCH = 5000;
const FLAG_CODE = new Map<CellFlag, number>(cellFlags.map((flag, i) => [flag, i]));
const MEASURED = FLAG_CODE.get('measured')!;

const CELL_ACTIONS: Partial<Record<CellFlag, { code: string; action: string }>> = {
  negative: { code: 'negative-value', action: 'kept as measured (e.g. after blank correction) and flagged' },
  below_dl: { code: 'below-detection-limit', action: 'flagged; the stated limit is kept as the value' },
  below_dl_unstated: { code: 'below-detection-limit', action: 'flagged; no value stored (no limit given)' },
  not_determined: { code: 'not-determined', action: 'flagged; no value stored' },
  empty: { code: 'empty-cell', action: 'flagged as empty; no value stored' },
  unreadable: { code: 'unreadable-value', action: 'text kept; no value stored' },
};

/**
 * Reads every data row of a file under a confirmed mapping and hands rows and problems to the sink in
 * batches. Nothing is dropped silently: each rejected row and each cell that is not a plain number comes
 * with a problem saying what was done; blank rows are only counted.
 */
export async function importRows(
  source: TableSource,
  layout: Layout,
  mapping: ResolvedMapping,
  sink: ImportSink,
): Promise<ImportSummary> {
  const summary: ImportSummary = { rowsRead: 0, imported: 0, flagged: 0, rejected: 0, blankRowsSkipped: 0 };
  const firstRowOf = new Map<string, number>();
  const rows: ImportedRow[] = [];
  const problems: Problem[] = [];
  const flush = async (force: boolean) => {
    if (rows.length > 0 && (force || rows.length >= BATCH)) await sink.rows(rows.splice(0));
    if (problems.length > 0 && (force || problems.length >= BATCH)) await sink.problems(problems.splice(0));
  };
  const headerOf = (index: number) => layout.headers[index] ?? `Column ${index + 1}`;

  for (const duplicate of layout.duplicateHeaders) {
    problems.push({
      row: null,
      column: duplicate,
      raw: duplicate,
      code: 'duplicate-column-name',
      message: `More than one column is called "${duplicate}"`,
      action: 'columns told apart by position; check the mapping',
    });
  }

  for await (const rawRow of source.rows()) {
    if (rawRow.row < layout.firstDataRow) continue;
    if (isBlankRow(rawRow)) {
      summary.blankRowsSkipped++;
      continue;
    }
    summary.rowsRead++;
    const rowProblems: Problem[] = [];
    const problem = (column: string | null, raw: string | null, code: string, message: string, action: string) =>
      rowProblems.push({ row: rawRow.row, column, raw, code, message, action });

    const extra = rawRow.cells
      .slice(layout.width)
      .map(cellText)
      .filter((text) => text !== '');
    const sampleId = cellText(rawRow.cells[mapping.sampleIdIndex]);
    if (extra.length > 0 || sampleId === '') {
      summary.rejected++;
      if (extra.length > 0) {
        problem(
          null,
          extra.join(' | '),
          'ragged-row',
          `The row has ${rawRow.cells.length} cells, the header ${layout.width}`,
          'row left out: its values cannot be matched to columns',
        );
      } else {
        problem(headerOf(mapping.sampleIdIndex), null, 'missing-sample-id', 'The row has no sample id', 'row left out');
      }
      problems.push(...rowProblems);
      await flush(false);
      continue;
    }
    if (rawRow.cells.length < layout.width) {
      problem(
        null,
        null,
        'short-row',
        `The row has ${rawRow.cells.length} cells, the header ${layout.width}`,
        'missing cells read as empty',
      );
    }
    const earlier = firstRowOf.get(sampleId);
    if (earlier === undefined) firstRowOf.set(sampleId, rawRow.row);
    else
      problem(
        headerOf(mapping.sampleIdIndex),
        sampleId,
        'duplicate-sample-id',
        `Sample id "${sampleId}" is also in row ${earlier}`,
        'both rows kept; tell them apart before using them',
      );
    const group = mapping.groupIndex === null ? null : cellText(rawRow.cells[mapping.groupIndex]) || null;
    if (mapping.groupIndex !== null && group === null) {
      problem(
        headerOf(mapping.groupIndex),
        null,
        'missing-group',
        'The row names no reference group',
        'row kept without a group',
      );
    }
    const row = readMeasurements(rawRow, mapping, layout, problem, summary.imported + 1);
    row.sampleId = sampleId;
    row.group = group;
    summary.imported++;
    if (rowProblems.length > 0) summary.flagged++;
    rows.push(row);
    problems.push(...rowProblems);
    await flush(false);
  }
  await flush(true);
  return summary;
}

type ProblemFn = (column: string | null, raw: string | null, code: string, message: string, action: string) => void;

function readMeasurements(
  rawRow: RawRow,
  mapping: ResolvedMapping,
  layout: Layout,
  problem: ProblemFn,
  position: number,
): ImportedRow {
  const count = mapping.measurements.length;
  const ppm: (number | null)[] = new Array(count);
  const original: (number | null)[] = new Array(count);
  const flags: number[] = new Array(count);
  const raw: (string | null)[] = new Array(count);
  const plainDecimals = layout.decimalSeparator === '.' && rawRow.formulas === undefined;
  mapping.measurements.forEach((column, j) => {
    const cell = rawRow.cells[column.index] ?? null;
    // Nearly every cell of a large file is a plain non-negative decimal, which needs no problem: read it
    // here, with no reading object and no second pattern test, exactly as readCell would.
    if (plainDecimals && typeof cell === 'string' && cell[0] !== '-' && isPlainNumber(cell)) {
      const value = Number(cell);
      original[j] = value;
      ppm[j] = value * column.factorToPpm;
      flags[j] = MEASURED;
      raw[j] = null;
      return;
    }
    const reading = readCell(cell, layout.decimalSeparator);
    original[j] = reading.value;
    ppm[j] = reading.value === null ? null : reading.value * column.factorToPpm;
    flags[j] = FLAG_CODE.get(reading.flag)!;
    raw[j] = typeof cell === 'string' && cell.trim() !== '' && !isPlainNumber(cell) ? cell : null;
    const formula = rawRow.formulas?.get(column.index);
    if (formula) {
      raw[j] = formula;
      problem(
        column.header,
        formula,
        'formula-cell',
        'The cell holds a formula',
        cell === null ? 'no stored result: read as empty' : 'the result stored in the workbook was used',
      );
    }
    const action = CELL_ACTIONS[reading.flag];
    if (action)
      problem(
        column.header,
        cell === null ? null : String(cell),
        action.code,
        cellFlagLabels[reading.flag],
        action.action,
      );
  });
  let attributes: Record<string, string> | null = null;
  for (const { index, key } of mapping.attributes) {
    const text = cellText(rawRow.cells[index]);
    if (text !== '') (attributes ??= {})[key] = text;
  }
  return { position, sourceRow: rawRow.row, sampleId: '', group: null, ppm, original, flags, raw, attributes };
}
