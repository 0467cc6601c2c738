import fc from 'fast-check';
import { isPlainNumber, readCell, readNumber, readPlainDecimal, sniffDecimalSeparator } from './read-cell';

describe('readCell', () => {
  it.each([
    ['12.5', '.', 'measured', 12.5],
    ['1,234.5', '.', 'measured', 1234.5],
    ['1 234.5', '.', 'measured', 1234.5],
    ["1'234", '.', 'measured', 1234],
    ['12,5', ',', 'measured', 12.5],
    ['1.234,5', ',', 'measured', 1234.5],
    ['1\u00a0234,5', ',', 'measured', 1234.5],
    ['.5', '.', 'measured', 0.5],
    ['1.5e3', '.', 'measured', 1500],
    ['-0.12', '.', 'negative', -0.12],
    ['\u22120,3', ',', 'negative', -0.3],
    ['<0.5', '.', 'below_dl', 0.5],
    ['< 0.5', '.', 'below_dl', 0.5],
    ['<0,5', ',', 'below_dl', 0.5],
    ['bdl', '.', 'below_dl_unstated', null],
    ['b.d.l.', '.', 'below_dl_unstated', null],
    ['<DL', '.', 'below_dl_unstated', null],
    ['< LOD', '.', 'below_dl_unstated', null],
    ['n.d.', '.', 'not_determined', null],
    ['nd', '.', 'not_determined', null],
    ['\u2014', '.', 'not_determined', null],
    ['-', '.', 'not_determined', null],
    ['', '.', 'empty', null],
    ['   ', '.', 'empty', null],
    ['approx. 5', '.', 'unreadable', null],
    ['>1000', '.', 'unreadable', null],
    ['<-1', '.', 'unreadable', null],
    ['12,5', '.', 'unreadable', null],
    ['1,2345', '.', 'unreadable', null],
  ] as const)('%j with decimal %j is %s %p', (text, decimal, flag, value) => {
    expect(readCell(text, decimal)).toEqual({ flag, value });
  });

  it('takes spreadsheet numbers as they are and refuses non-finite ones', () => {
    expect(readCell(3.25, '.')).toEqual({ flag: 'measured', value: 3.25 });
    expect(readCell(-1, ',')).toEqual({ flag: 'negative', value: -1 });
    expect(readCell(Number.NaN, '.')).toEqual({ flag: 'unreadable', value: null });
    expect(readCell(null, '.')).toEqual({ flag: 'empty', value: null });
  });

  it('reads the same number whatever the grouping, and never mixes two kinds of grouping', () => {
    expect(readNumber('1,234,567.25', '.')).toBe(1234567.25);
    expect(readNumber('1,234 567', '.')).toBeNull();
    expect(readNumber('12,34', '.')).toBeNull();
  });
});

describe('sniffDecimalSeparator', () => {
  it('sees a decimal comma or point from cells that can only be one', () => {
    expect(sniffDecimalSeparator(['12,5', '7,25', 'S1'])).toBe(',');
    expect(sniffDecimalSeparator(['12.5', '0.52'])).toBe('.');
    expect(sniffDecimalSeparator(['0,523', '<0,5'])).toBe(',');
  });

  it('reads files of "1,234"-style cells only with a decimal comma and plain integers with a point', () => {
    expect(sniffDecimalSeparator(['1,234', '2,500'])).toBe(',');
    expect(sniffDecimalSeparator(['12', '340'])).toBe('.');
  });
});

describe('readPlainDecimal', () => {
  // The reference is JavaScript's own Number(text), which ECMAScript requires to round correctly.
  const decimal = fc
    .tuple(fc.stringMatching(/^\d{1,20}$/), fc.option(fc.stringMatching(/^\d{1,20}$/)))
    .map(([whole, fraction]) => (fraction === null ? whole : `${whole}.${fraction}`));

  it('reads every plain non-negative decimal to the same double as Number', () => {
    fc.assert(
      fc.property(decimal, (text) => Object.is(readPlainDecimal(text), Number(text))),
      { numRuns: 20_000 },
    );
  });

  it('reads the values where a shortcut would round differently exactly as Number does', () => {
    // 0.1 + 0.2-style cases and 15/16-digit boundaries, from the shortest round-trip forms of doubles.
    for (const text of ['0.1', '0.3', '9007199254740993', '999999999999999', '1.000000000000001', '123456.7890123'])
      expect(readPlainDecimal(text)).toBe(Number(text));
  });

  it('leaves every other text to the full reader', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 12 }), (text) => {
        const read = readPlainDecimal(text);
        return read === null ? !(isPlainNumber(text) && text[0] !== '-') : isPlainNumber(text) && read === Number(text);
      }),
      { numRuns: 20_000 },
    );
    for (const text of ['', '-1', '12.', '.5', '1e3', '1,5', ' 1', '1 ', '+1', '1.2.3'])
      expect(readPlainDecimal(text)).toBeNull();
  });
});
