import { type CellFlag, type ImportSummary, type Problem, cellFlags, cellFlagLabels } from '@provenote/shared';
import { type Layout, cellText, isBlankRow } from './layout';
import { isPlainNumber, readCell, readPlainDecimal } from './read-cell';
import type { ResolvedMapping } from './resolve-columns';
import type { RawRow, TableSource } from './table-source';

/** One imported sample, in the shape dataset_rows stores it; arrays run parallel to the measurement columns. */
export interface ImportedRow {
  position: number;
  sourceRow: number;
  sampleId: string;
  group: string | null;
  ppm: (number | null)[];
  /** The same array as `ppm` when every measurement column is in ppm already. */
  original: (number | null)[];
  /** Positions in `cellFlags`. Rows with every cell measured share one frozen array. */
  flags: readonly number[];
  /** The cell's text wherever it was not a plain number. Rows of plain numbers share one frozen array. */
  raw: readonly (string | null)[];
  attributes: Record<string, string> | null;
}

export interface ImportSink {
  rows(batch: ImportedRow[]): Promise<void>;
  problems(batch: Problem[]): Promise<void>;
}

/** Rows per COPY: small enough that a batch fits the socket's buffer while the next one is read. */
const BATCH = 1000;

const FLAG_CODE = new Map<CellFlag, number>(cellFlags.map((flag, i) => [flag, i]));
const MEASURED = FLAG_CODE.get('measured')!;

/** For rows whose cells are all measured plain numbers, one frozen flags array and one raw array per width. */
const SHARED = new Map<number, { measured: readonly number[]; noText: readonly null[] }>();
function sharedArrays(width: number) {
  let arrays = SHARED.get(width);
  if (!arrays) {
    arrays = {
      measured: Object.freeze(new Array<number>(width).fill(MEASURED)),
      noText: Object.freeze(new Array<null>(width).fill(null)),
    };
    SHARED.set(width, arrays);
  }
  return arrays;
}

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
    const full = rows.length >= BATCH || problems.length >= BATCH;
    if (rows.length > 0 && (force || rows.length >= BATCH)) await sink.rows(rows.splice(0));
    if (problems.length > 0 && (force || problems.length >= BATCH)) await sink.problems(problems.splice(0));
    // Reading a file never waits on I/O, so without a turn of the event loop the batch just handed over
    // would sit in the socket's queue until the whole file was read: the database would idle while rows
    // are read, and the other way round.
    if (full) await new Promise((resolve) => setImmediate(resolve));
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

    const extra =
      rawRow.cells.length > layout.width
        ? rawRow.cells
            .slice(layout.width)
            .map(cellText)
            .filter((text) => text !== '')
        : [];
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
  const { measurements } = mapping;
  const count = measurements.length;
  const shared = sharedArrays(count);
  const ppm: (number | null)[] = new Array(count);
  // Most files are in ppm already: their original values are the ppm values, one array for both.
  const original: (number | null)[] = mapping.allInPpm ? ppm : new Array(count);
  let flags: readonly number[] = shared.measured;
  let raw: readonly (string | null)[] = shared.noText;
  const plainDecimals = layout.decimalSeparator === '.' && rawRow.formulas === undefined;
  for (let j = 0; j < count; j++) {
    const column = measurements[j];
    const cell = rawRow.cells[column.index] ?? null;
    // Nearly every cell of a large file is a plain non-negative decimal, which needs no problem: read it
    // here, with no reading object and no pattern test, exactly as readCell would.
    const plain = plainDecimals && typeof cell === 'string' ? readPlainDecimal(cell) : null;
    if (plain !== null) {
      original[j] = plain;
      ppm[j] = plain * column.factorToPpm;
      continue;
    }
    const reading = readCell(cell, layout.decimalSeparator);
    original[j] = reading.value;
    ppm[j] = reading.value === null ? null : reading.value * column.factorToPpm;
    const flag = FLAG_CODE.get(reading.flag)!;
    if (flag !== MEASURED) {
      if (flags === shared.measured) flags = shared.measured.slice();
      (flags as number[])[j] = flag;
    }
    let text = typeof cell === 'string' && cell.trim() !== '' && !isPlainNumber(cell) ? cell : null;
    const formula = rawRow.formulas?.get(column.index);
    if (formula) {
      text = formula;
      problem(
        column.header,
        formula,
        'formula-cell',
        'The cell holds a formula',
        cell === null ? 'no stored result: read as empty' : 'the result stored in the workbook was used',
      );
    }
    if (text !== null) {
      if (raw === shared.noText) raw = shared.noText.slice();
      (raw as (string | null)[])[j] = text;
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
  }
  let attributes: Record<string, string> | null = null;
  for (const { index, key } of mapping.attributes) {
    const text = cellText(rawRow.cells[index]);
    if (text !== '') (attributes ??= {})[key] = text;
  }
  return { position, sourceRow: rawRow.row, sampleId: '', group: null, ppm, original, flags, raw, attributes };
}
