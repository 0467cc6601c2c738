import type { CellFlag } from '@provenote/shared';

export type DecimalSeparator = '.' | ',';

export interface CellReading {
  flag: CellFlag;
  /** The number read, in the file's unit; for below_dl the stated limit; null when there is none. */
  value: number | null;
}

const GROUPING = { '.': "[,'\u00a0\u202f ]", ',': "[.'\u00a0\u202f ]" } as const;

/**
 * One pattern per decimal separator: digits with an optional single kind of thousands grouping (groups of
 * exactly three), an optional fraction and exponent. "1,234" is a thousand and more in a decimal-point file
 * and one and a bit in a decimal-comma file; the separator is decided per file, never per cell.
 */
function numberPattern(decimal: DecimalSeparator): RegExp {
  const point = decimal === '.' ? '\\.' : ',';
  const grouped = `\\d{1,3}(?:(?<sep>${GROUPING[decimal]})\\d{3})(?:\\k<sep>\\d{3})*`;
  return new RegExp(`^([+\\-\u2212]?)(${grouped}|\\d+|(?=${point}\\d))(?:${point}(\\d+))?(?:[eE]([+-]?\\d+))?$`);
}

// Most cells of a large file are plain decimals; they skip the full pattern, and their text need not be kept.
const PLAIN = /^-?\d+(?:\.\d+)?$/;
export const isPlainNumber = (text: string): boolean => PLAIN.test(text);

/** 10^0 … 10^22, each exactly a double. */
const POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));
const DIGIT_0 = 48;
const DOT = 46;

/**
 * A plain non-negative decimal ("12", "0.052") read straight from its characters, or null for any other
 * text (the caller then reads the cell in full). With at most 15 digits the digits form an exact integer
 * and the power of ten is exact, so one division is correctly rounded: the same double as Number(text)
 * (Clinger, "How to read floating point numbers accurately", PLDI 1990, the fast path). Longer numbers
 * go to Number itself.
 */
export function readPlainDecimal(text: string): number | null {
  const length = text.length;
  if (length === 0 || length > 15) return length > 15 && PLAIN.test(text) && text[0] !== '-' ? Number(text) : null;
  let digits = 0;
  let scale = -1;
  for (let i = 0; i < length; i++) {
    const code = text.charCodeAt(i);
    const digit = code - DIGIT_0;
    if (digit >= 0 && digit <= 9) {
      digits = digits * 10 + digit;
      if (scale >= 0) scale++;
    } else if (code === DOT && scale < 0 && i > 0 && i < length - 1) {
      scale = 0;
    } else {
      return null;
    }
  }
  return scale <= 0 ? digits : digits / POWERS_OF_TEN[scale];
}

const PATTERNS = { '.': numberPattern('.'), ',': numberPattern(',') };

/** A plain number as written in the file, or null when the text is not one. */
export function readNumber(text: string, decimal: DecimalSeparator): number | null {
  const match = PATTERNS[decimal].exec(text);
  if (!match) return null;
  const [, sign, whole, , fraction, exponent] = match;
  const digits = whole.replace(/\D/g, '') || '0';
  const value = Number(
    `${sign === '' || sign === '+' ? '' : '-'}${digits}${fraction ? `.${fraction}` : ''}${exponent ? `e${exponent}` : ''}`,
  );
  return Number.isFinite(value) ? value : null;
}

const BELOW_UNSTATED = /^(?:<\s*(?:dl|d\.l\.|lod|lld|ld|loq)|b\.?d\.?l?\.?|below\s+(?:dl|detection(?:\s+limit)?))$/i;
const NOT_DETERMINED =
  /^(?:n\.?\s?d\.?|n\/d|n\.?\s?a\.?|n\/a|not\s+determined|[-\u2012\u2013\u2014\u2015\u2212]{1,3})$/i;
const BELOW_STATED = /^<\s*(.+)$/;

/**
 * Reads one cell. Below-detection ("<0.5", "bdl"), not determined ("n.d.", "—") and empty cells stay
 * distinct, because a later step treats them differently (a limit can be substituted, a gap cannot).
 * Negative numbers are real results after blank correction: kept, and flagged so they are seen.
 */
export function readCell(cell: string | number | null, decimal: DecimalSeparator): CellReading {
  if (typeof cell === 'number') {
    if (!Number.isFinite(cell)) return { flag: 'unreadable', value: null };
    return { flag: cell < 0 ? 'negative' : 'measured', value: cell };
  }
  const text = (cell ?? '').trim();
  if (text === '') return { flag: 'empty', value: null };
  if (decimal === '.' && PLAIN.test(text)) {
    const plain = Number(text);
    return { flag: plain < 0 ? 'negative' : 'measured', value: plain };
  }
  const value = readNumber(text, decimal);
  if (value !== null) return { flag: value < 0 ? 'negative' : 'measured', value };
  if (BELOW_UNSTATED.test(text)) return { flag: 'below_dl_unstated', value: null };
  if (NOT_DETERMINED.test(text)) return { flag: 'not_determined', value: null };
  const below = BELOW_STATED.exec(text);
  if (below) {
    const limit = readNumber(below[1].trim(), decimal);
    if (limit !== null && limit > 0) return { flag: 'below_dl', value: limit };
  }
  return { flag: 'unreadable', value: null };
}

/**
 * The decimal separator a file uses, from its number-like cells: "0,52" or "12,5" can only hold a decimal
 * comma, "0.52" or "12.5" only a decimal point. "1,234" and "1.234" could be either; a file with nothing
 * but those is read with a comma when its cells have commas, the common case in files that use one.
 */
export function sniffDecimalSeparator(cells: Iterable<string>): DecimalSeparator {
  let comma = 0;
  let point = 0;
  let ambiguousComma = 0;
  for (const raw of cells) {
    const text = raw
      .trim()
      .replace(/^<\s*/, '')
      .replace(/[eE][+-]?\d+$/, '');
    if (/^[+\-\u2212]?[1-9]\d{0,2}[.,]\d{3}$/.test(text)) {
      if (text.includes(',')) ambiguousComma++;
    } else if (/^[+\-\u2212]?[\d.'\u00a0\u202f ]*,\d+$/.test(text)) comma++;
    else if (/^[+\-\u2212]?[\d,'\u00a0\u202f ]*\.\d+$/.test(text)) point++;
  }
  if (comma > point) return ',';
  if (point > 0) return '.';
  return ambiguousComma > 0 ? ',' : '.';
}
