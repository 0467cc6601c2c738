import fc from 'fast-check';
import { cellFlags, type CellFlag, type Problem } from '@provenote/shared';
import type { ImportedRow } from './import-rows';
import { FileRejectedError, MappingError } from './import-errors';
import { analyseFile, importFile } from './parse-file';
import { readCell } from './read-cell';

/** A fixed seed: a failure prints its counterexample and reproduces on every machine. */
const SEED = 20261201;

const ELEMENTS = ['Zr', 'Nb', 'Rb', 'Sr', 'La', 'Th', 'Cs', 'Hf'];
/** Codes of the per-cell problems: every cell that is not a plain measured number gets one of these. */
const CELL_CODES = new Set([
  'negative-value',
  'below-detection-limit',
  'not-determined',
  'empty-cell',
  'unreadable-value',
]);
const REJECT_CODES = new Set(['ragged-row', 'missing-sample-id']);

const measuredText = fc.oneof(
  fc.double({ min: -1e6, max: 1e9, noNaN: true, noDefaultInfinity: true }).map(String),
  fc.integer({ min: 0, max: 99999 }).map(String),
);
const labText = fc.constantFrom('<0.5', '< 2', 'bdl', '<LOD', 'n.d.', 'n/a', '—', '-', 'NaN', 'Infinity', '1e400');
const cellText = fc.oneof(
  { weight: 6, arbitrary: measuredText },
  { weight: 2, arbitrary: labText },
  { weight: 1, arbitrary: fc.constant('') },
  { weight: 1, arbitrary: fc.string({ unit: 'grapheme', maxLength: 12 }) },
);
const sampleId = fc.oneof(
  { weight: 8, arbitrary: fc.stringMatching(/^[A-Z]{1,3}-\d{1,4}$/) },
  { weight: 1, arbitrary: fc.string({ unit: 'grapheme', minLength: 1, maxLength: 10 }) },
  { weight: 1, arbitrary: fc.constant('') },
);

interface Table {
  delimiter: ',' | ';' | '\t';
  lineEnd: '\n' | '\r\n';
  headers: string[];
  /** null: a blank line; otherwise the record's cells (possibly more or fewer than the header). */
  records: (string[] | null)[];
}

const table: fc.Arbitrary<Table> = fc
  .record({
    delimiter: fc.constantFrom(',' as const, ';' as const, '\t' as const),
    lineEnd: fc.constantFrom('\n' as const, '\r\n' as const),
    elements: fc.uniqueArray(fc.constantFrom(...ELEMENTS), { minLength: 1, maxLength: 6 }),
  })
  .chain(({ delimiter, lineEnd, elements }) => {
    const width = elements.length + 1;
    const record = fc.oneof(
      { weight: 12, arbitrary: fc.tuple(sampleId, fc.array(cellText, { minLength: width - 1, maxLength: width - 1 })) },
      { weight: 1, arbitrary: fc.tuple(sampleId, fc.array(cellText, { minLength: 0, maxLength: width + 2 })) },
    );
    return fc.record({
      delimiter: fc.constant(delimiter),
      lineEnd: fc.constant(lineEnd),
      headers: fc.constant(['Sample', ...elements.map((element) => `${element} ppm`)]),
      records: fc.array(
        fc.oneof(
          { weight: 12, arbitrary: record.map(([id, cells]) => [id, ...cells]) },
          { weight: 1, arbitrary: fc.constant(null) },
        ),
        { minLength: 1, maxLength: 40 },
      ),
    });
  });

const quote = (cell: string) => `"${cell.replace(/"/g, '""')}"`;

/** The table as a file; every cell quoted, so cells may hold the delimiter, quotes and line breaks. */
function writeQuoted({ delimiter, lineEnd, headers, records }: Table): string {
  const line = (cells: string[]) => cells.map(quote).join(delimiter);
  return [line(headers), ...records.map((cells) => (cells === null ? '' : line(cells)))].join(lineEnd) + lineEnd;
}

async function importText(text: string) {
  const bytes = Buffer.from(text, 'utf8');
  const analysis = await analyseFile(bytes, 'generated.csv');
  const rows: ImportedRow[] = [];
  const problems: Problem[] = [];
  const result = await importFile(bytes, 'generated.csv', analysis.guessedMapping, null, {
    rows: async (batch) => void rows.push(...batch),
    problems: async (batch) => void problems.push(...batch),
  });
  return { analysis, rows, problems, ...result };
}

const isExpectedRefusal = (error: unknown) => error instanceof FileRejectedError || error instanceof MappingError;

describe('file and value parser, property-based', () => {
  it('accounts for every generated record and classifies every cell of every imported row', async () => {
    let tablesImported = 0;
    await fc.assert(
      fc.asyncProperty(table, async (generated) => {
        let imported: Awaited<ReturnType<typeof importText>>;
        try {
          imported = await importText(writeQuoted(generated));
        } catch (error) {
          if (isExpectedRefusal(error)) return;
          throw error;
        }
        tablesImported++;
        const { summary, rows, problems, analysis, columns } = imported;
        const unitsRows = analysis.layout.unitsRow === null ? 0 : 1;
        // No row is lost silently: each record is imported, rejected with a reason, or a counted blank.
        expect(summary.rowsRead + summary.blankRowsSkipped + unitsRows).toBe(generated.records.length);
        expect(summary.rowsRead).toBe(summary.imported + summary.rejected);
        expect(rows).toHaveLength(summary.imported);
        expect(problems.filter((p) => REJECT_CODES.has(p.code))).toHaveLength(summary.rejected);

        let unusualCells = 0;
        for (const row of rows) {
          expect(row.sampleId).not.toBe('');
          for (const array of [row.ppm, row.original, row.flags, row.raw]) expect(array).toHaveLength(columns.length);
          row.flags.forEach((flag, j) => {
            const name: CellFlag | undefined = cellFlags[flag];
            expect(name).toBeDefined();
            if (name !== 'measured') unusualCells++;
            const value = row.ppm[j];
            if (value !== null) expect(Number.isFinite(value)).toBe(true);
          });
        }
        // Every cell that is not a plain measured number is named in a problem saying what was done.
        expect(problems.filter((p) => CELL_CODES.has(p.code))).toHaveLength(unusualCells);
      }),
      { numRuns: 1000, seed: SEED },
    );
    // Most generated tables are imported, so the checks above did run.
    expect(tablesImported).toBeGreaterThan(800);
  }, 120_000);

  it('reads a table alike whether its cells are quoted or not (the native split and the CSV parser agree)', async () => {
    const plainCell = (delimiter: string) => (cell: string) => !/["\r\n]/.test(cell) && !cell.includes(delimiter);
    await fc.assert(
      fc.asyncProperty(
        table.filter((t) => t.records.every((r) => r === null || r.every(plainCell(t.delimiter)))),
        async (generated) => {
          const unquoted =
            [generated.headers, ...generated.records]
              .map((cells) => (cells === null ? '' : cells.join(generated.delimiter)))
              .join(generated.lineEnd) + generated.lineEnd;
          const outcome = (text: string) =>
            importText(text).then(
              ({ summary, rows }) => ({ summary, rows }),
              (error: unknown) => {
                if (!isExpectedRefusal(error)) throw error;
                return { refused: (error as Error).constructor.name };
              },
            );
          expect(await outcome(unquoted)).toEqual(await outcome(writeQuoted(generated)));
        },
      ),
      { numRuns: 800, seed: SEED },
    );
  }, 120_000);

  it('opens any text at all as a table or refuses it with a file error, never anything else', async () => {
    const anyText = fc.oneof(
      fc.string({ unit: 'binary', maxLength: 300 }),
      fc
        .array(fc.constantFrom('a', '1', '"', ',', ';', '\t', '\n', '\r', ' ', '<', '.', 'é'), { maxLength: 200 })
        .map((chars) => chars.join('')),
    );
    await fc.assert(
      fc.asyncProperty(anyText, async (text) => {
        try {
          await importText(text);
        } catch (error) {
          if (!isExpectedRefusal(error)) throw error;
        }
      }),
      { numRuns: 1500, seed: SEED },
    );
  }, 120_000);

  it('reads back every finite number exactly as written, in either decimal convention', () => {
    fc.assert(
      fc.property(
        fc.double({ noNaN: true, noDefaultInfinity: true }),
        fc.constantFrom('.' as const, ',' as const),
        (x, decimal) => {
          const text = decimal === '.' ? String(x) : String(x).replace('.', ',');
          const reading = readCell(text, decimal);
          expect(reading.value).toBe(x === 0 ? 0 : x);
          expect(reading.flag).toBe(x < 0 ? 'negative' : 'measured');
        },
      ),
      { numRuns: 3000, seed: SEED },
    );
  });

  it('classifies any cell text with a known flag and a finite value or none', () => {
    fc.assert(
      fc.property(
        fc.string({ unit: 'grapheme', maxLength: 30 }),
        fc.constantFrom('.' as const, ',' as const),
        (text, decimal) => {
          const reading = readCell(text, decimal);
          expect(cellFlags).toContain(reading.flag);
          if (reading.value !== null) expect(Number.isFinite(reading.value)).toBe(true);
          if (reading.flag === 'empty' || reading.flag === 'unreadable') expect(reading.value).toBeNull();
        },
      ),
      { numRuns: 3000, seed: SEED },
    );
  });
});
