import { collectImport } from '../../../test/fixtures/import/collect-import';
import { workbookWithFormulas, zipBomb } from '../../../test/fixtures/import/workbooks';
import { FileRejectedError } from './import-errors';
import { analyseFile } from './parse-file';
import { assertSafeZip } from './zip-guard';

describe('import corpus: .xlsx workbooks', () => {
  it('reads the first sheet, uses the stored results of formula cells and lists each formula', async () => {
    const bytes = await workbookWithFormulas();
    const { analysis, rows, flagsOf, problems, summary } = await collectImport(bytes, 'results.xlsx', 'reference');
    expect(analysis.options).toMatchObject({ delimiter: null, encoding: null, sheet: 'Results' });
    expect(analysis.layout.headers).toEqual(['Sample', 'Group', 'Zr (ppm)', 'Nb (ppm)', 'Zr/Nb']);
    expect(summary).toEqual({ rowsRead: 3, imported: 3, flagged: 2, rejected: 0, blankRowsSkipped: 0 });
    expect(rows.map((row) => row.original)).toEqual([
      [180, 9],
      [175.5, 0.5],
      [190, null],
    ]);
    expect(flagsOf(rows[1])).toEqual(['measured', 'below_dl']);
    expect(rows[2].raw).toEqual(['=100+90', 'n.d.']);
    expect(problems.filter((p) => p.code === 'formula-cell').map((p) => [p.row, p.raw, p.action])).toEqual([
      [4, '=100+90', 'the result stored in the workbook was used'],
    ]);
    // The Zr/Nb column is a note: its formula text is not a measurement and is not read as one.
    expect(rows[0].attributes).toEqual({ 'Zr/Nb': '20' });
    expect(rows[1].attributes).toBeNull();
  });

  it('reads another sheet when asked', async () => {
    const bytes = await workbookWithFormulas();
    const notes = await analyseFile(bytes, 'results.xlsx', {
      delimiter: null,
      decimalSeparator: '.',
      encoding: null,
      unitsRow: false,
      sheet: 'Notes',
    });
    expect(notes.source.sheets).toEqual(['Results', 'Notes']);
    expect(notes.layout.headers).toEqual(['Instrument log']);
  });

  it('refuses a zip bomb named .xlsx before unpacking it', async () => {
    const bomb = zipBomb();
    expect(bomb.length).toBeLessThan(100_000);
    await expect(collectImport(bomb, 'results.xlsx')).rejects.toMatchObject({
      name: FileRejectedError.name,
      code: 'zip-bomb',
    });
  });

  it('refuses workbooks with too many parts or too much data in all', async () => {
    const bytes = await workbookWithFormulas();
    expect(() => assertSafeZip(bytes)).not.toThrow();
    expect(() => assertSafeZip(bytes, { maxEntries: 3, maxUncompressedBytes: 1e9, maxRatio: 200 })).toThrow(
      /at most 3 are read/,
    );
    expect(() => assertSafeZip(bytes, { maxEntries: 100, maxUncompressedBytes: 1000, maxRatio: 200 })).toThrow(
      /far more data/,
    );
  });

  it('refuses text named .xlsx and old .xls workbooks', async () => {
    await expect(collectImport(Buffer.from('Sample,Zr\nA,1\n'), 'renamed.xlsx')).rejects.toMatchObject({
      code: 'not-a-workbook',
    });
    const ole = Buffer.alloc(512);
    ole.writeUInt32LE(0xe011cfd0, 0);
    await expect(collectImport(ole, 'old.xls')).rejects.toMatchObject({ code: 'legacy-excel' });
  });
});
