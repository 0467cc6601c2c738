import { readCell, readNumber, sniffDecimalSeparator } from './read-cell';

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
