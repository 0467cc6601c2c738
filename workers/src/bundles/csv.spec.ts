import { CsvValueError, escapeFormula, parseCsv, parseNumberCell, toCsv, unescapeFormula } from './csv';

describe('CSV cells', () => {
  it.each(['=SUM(A1:A9)', '+1+1', '-2+3', '@cmd', '\tx', '\rx', "'=x", "''=x"])(
    'escapes formula-like text %j and reads it back',
    (text) => {
      const escaped = escapeFormula(text);
      expect(escaped).toBe(`'${text}`);
      expect(unescapeFormula(escaped)).toBe(text);
    },
  );

  it.each(['iris-7', "O'Brien", "'quoted", '-1.5', '+2', '1e-9', 'Cu'])('leaves %j as it is', (text) => {
    expect(escapeFormula(text)).toBe(text);
    expect(unescapeFormula(text)).toBe(text);
  });

  it('writes numbers at full precision, negative numbers unchanged, and quotes only where needed', () => {
    const csv = toCsv(
      ['id', 'value', 'note'],
      [
        ['a', -1.5, null],
        ['b', 0.1 + 0.2, 'x, "y"'],
        ['=c', 1e-300, '-z'],
      ],
    );
    expect(csv).toBe('id,value,note\r\na,-1.5,\r\nb,0.30000000000000004,"x, ""y"""\r\n\'=c,1e-300,\'-z\r\n');
    expect(parseCsv(csv, 't.csv').rows).toEqual([
      ['a', '-1.5', ''],
      ['b', '0.30000000000000004', 'x, "y"'],
      ['=c', '1e-300', '-z'],
    ]);
  });

  it('refuses a value no reader could trust', () => {
    expect(() => toCsv(['d2'], [[Number.NaN]])).toThrow(
      new CsvValueError('column "d2" holds NaN, which a bundle cannot record'),
    );
    expect(() => toCsv(['a', 'b'], [['x']])).toThrow(CsvValueError);
    expect(() => parseNumberCell('', 'line 2, d2')).toThrow('line 2, d2: "" is not a number');
    expect(() => parseCsv('a,b\r\n1\r\n', 't.csv')).toThrow(CsvValueError);
    expect(() => parseCsv('a,b\r\n1,2\r\n', 't.csv', ['a', 'c'])).toThrow('t.csv has columns a,b; expected a,c');
  });
});
