import { collectImport, fixture } from '../../../test/fixtures/import/collect-import';
import { FileRejectedError } from './import-errors';

const load = (name: string, kind: 'reference' | 'unknowns' | null = null) => collectImport(fixture(name), name, kind);
const codes = (problems: { code: string }[]) => problems.map((problem) => problem.code);

describe('import corpus: each lab convention', () => {
  it('comma file with units in the headers: guesses roles, units and oxides, converts to ppm', async () => {
    const { analysis, rows, summary, columns } = await load('comma-basic.csv', 'reference');
    expect(analysis.options).toMatchObject({
      delimiter: ',',
      decimalSeparator: '.',
      encoding: 'utf-8',
      unitsRow: false,
    });
    expect(analysis.guessedMapping.columns.map((c) => [c.role, c.element, c.unit, c.oxide])).toEqual([
      ['sample_id', null, null, null],
      ['group', null, null, null],
      ['measurement', 'Si', 'wt% oxide', 'SiO2'],
      ['measurement', 'Al', 'wt% oxide', 'Al2O3'],
      ['measurement', 'Zr', 'ppm', null],
      ['measurement', 'La', 'ppb', null],
      ['measurement', 'Rb', 'ppm', null],
    ]);
    expect(summary).toEqual({ rowsRead: 3, imported: 3, flagged: 0, rejected: 0, blankRowsSkipped: 0 });
    expect(columns.map((c) => c.element)).toEqual(['Si', 'Al', 'Zr', 'La', 'Rb']);
    expect(rows[0]).toMatchObject({ sampleId: 'Q-001', group: 'North quarry', sourceRow: 2 });
    expect(rows[0].original).toEqual([52.31, 14.2, 182, 31200, 45.5]);
    // SiO₂ → Si 0.4674 (METHODS.md §7, from IUPAC/CIAAW 2021 atomic weights): 52.31 wt% ≈ 244 500 ppm.
    expect(rows[0].ppm[0]).toBeCloseTo(52.31 * 0.4674 * 1e4, -2);
    expect(rows[0].ppm.slice(2)).toEqual([182, 31.2, 45.5]);
    expect(rows[0].raw).toEqual([null, null, null, null, null]);
  });

  it('semicolon file with a decimal comma', async () => {
    const { analysis, rows, summary } = await load('semicolon-decimal-comma.csv');
    expect(analysis.options).toMatchObject({ delimiter: ';', decimalSeparator: ',' });
    expect(summary.imported).toBe(3);
    expect(rows.map((row) => row.original)).toEqual([
      [182.5, 12.25, 7.3],
      [176, 11.8, 6.95],
      [240.75, 9, 8.1],
    ]);
    expect(rows[0].raw).toEqual(['182,5', '12,25', '7,3']);
    expect(analysis.guessedMapping.columns[4]).toMatchObject({ element: 'Fe', unit: 'wt% oxide', oxide: 'Fe2O3' });
  });

  it('tab-separated file with a units row under the header', async () => {
    const { analysis, rows, summary } = await load('tab-units-row.tsv');
    expect(analysis.options).toMatchObject({ delimiter: '\t', unitsRow: true });
    expect(analysis.layout.unitsRow).toEqual(['units', '', 'wt%', 'wt%', 'ppm', 'ppb']);
    expect(analysis.guessedMapping.columns.map((c) => c.unit)).toEqual([
      null,
      null,
      'wt% oxide',
      'wt% oxide',
      'ppm',
      'ppb',
    ]);
    expect(summary).toMatchObject({ rowsRead: 2, imported: 2 });
    expect(rows[0]).toMatchObject({ sampleId: 'T-1', group: 'Kiln A', sourceRow: 3 });
  });

  it('UTF-8 with a byte-order mark: the mark does not stick to the first header', async () => {
    const { analysis, rows } = await load('bom-utf8.csv');
    expect(analysis.layout.headers[0]).toBe('Sample');
    expect(analysis.guessedMapping.columns.map((c) => c.unit)).toEqual([null, 'µg/g', 'mg/kg']);
    expect(rows[1].ppm).toEqual([295, 601.5]);
  });

  it('Latin-1 text is decoded as such', async () => {
    const { analysis, rows } = await load('latin1.csv');
    expect(analysis.options.encoding).toBe('windows-1252');
    expect(analysis.layout.headers).toEqual(['Probe', 'Fundort', 'Sr (µg/g)', 'Bemerkung']);
    expect(rows.map((row) => row.attributes)).toEqual([
      { Fundort: 'Höhle', Bemerkung: 'grün' },
      { Fundort: 'Straße', Bemerkung: 'über' },
    ]);
    expect(rows[0].original).toEqual([310.5]);
  });

  it('thousands separators with a decimal point (quoted) and with a decimal comma', async () => {
    const point = await load('thousands.csv');
    expect(point.analysis.options.decimalSeparator).toBe('.');
    expect(point.rows.map((row) => row.original)).toEqual([
      [1234.5, 310, 12345],
      [2001, 305.5, 999],
    ]);
    const comma = await load('thousands-decimal-comma.csv');
    expect(comma.analysis.options.decimalSeparator).toBe(',');
    expect(comma.rows.map((row) => row.original)).toEqual([
      [1234.5, 310.25],
      [2001.75, 305.5],
      [1500.5, 299],
    ]);
  });

  it('below detection, not determined, empty and negative cells stay distinct, with their text', async () => {
    const { rows, flagsOf, problems, summary } = await load('detection-limits.csv');
    expect(flagsOf(rows[0])).toEqual(['below_dl', 'below_dl_unstated', 'not_determined', 'empty', 'negative']);
    expect(flagsOf(rows[1])).toEqual(['below_dl', 'below_dl_unstated', 'not_determined', 'measured', 'measured']);
    expect(rows[0].raw).toEqual(['<0.5', 'bdl', 'n.d.', null, null]);
    expect(rows[1].raw).toEqual(['< 0.5', '<DL', '\u2014', null, null]);
    expect(rows[0].original).toEqual([0.5, null, null, null, -0.12]);
    expect(summary).toEqual({ rowsRead: 3, imported: 3, flagged: 2, rejected: 0, blankRowsSkipped: 0 });
    expect(problems.filter((p) => p.row === 2).map((p) => [p.column, p.code])).toEqual([
      ['Zr ppm', 'below-detection-limit'],
      ['Nb ppm', 'below-detection-limit'],
      ['Th ppm', 'not-determined'],
      ['U ppm', 'empty-cell'],
      ['Cs ppm', 'negative-value'],
    ]);
  });

  it('reports duplicated sample ids and duplicated column names, keeping both', async () => {
    const { analysis, rows, problems, summary } = await load('duplicates.csv');
    expect(analysis.layout.duplicateHeaders).toEqual(['Zr']);
    expect(summary).toMatchObject({ imported: 3, flagged: 1 });
    expect(rows.map((row) => row.sampleId)).toEqual(['X-1', 'X-2', 'X-1']);
    expect(analysis.guessedMapping.columns.map((c) => c.role)).toEqual([
      'sample_id',
      'group',
      'measurement',
      'attribute',
      'measurement',
    ]);
    expect(rows[0].attributes).toEqual({ 'Zr (column 4)': '181' });
    expect(problems).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ row: null, code: 'duplicate-column-name', column: 'Zr' }),
        expect.objectContaining({ row: 4, code: 'duplicate-sample-id', message: 'Sample id "X-1" is also in row 2' }),
      ]),
    );
  });

  it('two columns for one element are refused until one is left out', async () => {
    const { analysis } = await load('duplicates.csv');
    const columns = analysis.guessedMapping.columns.map((c) =>
      c.index === 3 ? { ...c, role: 'measurement' as const, element: 'Zr', unit: 'ppm' as const } : c,
    );
    await expect(
      collectImport(fixture('duplicates.csv'), 'duplicates.csv', null, { ...analysis.guessedMapping, columns }),
    ).rejects.toThrow('"Zr" and "Zr" both measure Zr; leave one out');
  });

  it('blank trailing rows and columns are left out and counted', async () => {
    const { analysis, summary } = await load('blank-trailing.csv');
    expect(analysis.layout.headers).toEqual(['Sample', 'Group', 'Zr ppm', 'Nb ppm']);
    expect(analysis.layout.notes).toContain('2 blank column(s) at the right were left out');
    expect(summary).toEqual({ rowsRead: 2, imported: 2, flagged: 0, rejected: 0, blankRowsSkipped: 4 });
  });

  it('text that is no value is kept as text and listed', async () => {
    const { rows, flagsOf, problems } = await load('unreadable.csv');
    expect(flagsOf(rows[0])).toEqual(['unreadable', 'measured']);
    expect(rows[0].raw[0]).toBe('approx. 180');
    expect(rows[1].raw[0]).toBe('>1000');
    expect(codes(problems)).toEqual(['unreadable-value', 'unreadable-value']);
  });
});

describe('import corpus: malformed files', () => {
  it('ragged rows: short rows are read with empty cells, long ones are rejected with their reason', async () => {
    const { rows, problems, summary } = await load('ragged.csv');
    expect(summary).toEqual({ rowsRead: 5, imported: 3, flagged: 1, rejected: 2, blankRowsSkipped: 0 });
    expect(rows.map((row) => row.sampleId)).toEqual(['R-1', 'R-2', 'R-4']);
    expect(problems.map((p) => [p.row, p.code, p.action])).toEqual([
      [3, 'short-row', 'missing cells read as empty'],
      [3, 'empty-cell', 'flagged as empty; no value stored'],
      [4, 'ragged-row', 'row left out: its values cannot be matched to columns'],
      [6, 'missing-sample-id', 'row left out'],
    ]);
    expect(problems[2].raw).toBe('99 | extra');
  });

  it.each([
    ['empty.csv', 'empty-file'],
    ['binary-junk.csv', 'binary-file'],
    ['unclosed-quote.csv', 'malformed-csv'],
  ])('%s is refused as a whole (%s)', async (name, code) => {
    await expect(load(name)).rejects.toMatchObject({ name: FileRejectedError.name, code });
  });

  it('a file with a header only imports nothing and says so', async () => {
    const { summary, rows } = await load('header-only.csv');
    expect(summary).toEqual({ rowsRead: 0, imported: 0, flagged: 0, rejected: 0, blankRowsSkipped: 0 });
    expect(rows).toEqual([]);
  });
});
