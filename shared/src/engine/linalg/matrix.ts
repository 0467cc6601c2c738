import { InvalidInputError } from '../errors/engine-errors';

/** Plain row-major matrices: rows are samples (or matrix rows), columns are variables. */
export type Matrix = readonly (readonly number[])[];

/** Throws unless every row has `columns` finite entries; returns the column count. */
export function assertFiniteMatrix(rows: Matrix, what: string, columns?: number): number {
  const p = columns ?? (rows.length > 0 ? rows[0].length : 0);
  rows.forEach((row, i) => {
    if (row.length !== p) {
      throw new InvalidInputError(`${what}: row ${i + 1} has ${row.length} values, expected ${p}`);
    }
    row.forEach((value, j) => {
      if (!Number.isFinite(value)) {
        throw new InvalidInputError(`${what}: row ${i + 1}, column ${j + 1} is not a finite number (${value})`);
      }
    });
  });
  return p;
}

export function zeros(rows: number, columns: number): number[][] {
  return Array.from({ length: rows }, () => new Array<number>(columns).fill(0));
}

export function transpose(a: Matrix): number[][] {
  const rows = a.length;
  const columns = rows > 0 ? a[0].length : 0;
  const t = zeros(columns, rows);
  for (let i = 0; i < rows; i++) for (let j = 0; j < columns; j++) t[j][i] = a[i][j];
  return t;
}

export function multiply(a: Matrix, b: Matrix): number[][] {
  const inner = b.length;
  const columns = inner > 0 ? b[0].length : 0;
  const out = zeros(a.length, columns);
  for (let i = 0; i < a.length; i++) {
    for (let k = 0; k < inner; k++) {
      const aik = a[i][k];
      for (let j = 0; j < columns; j++) out[i][j] += aik * b[k][j];
    }
  }
  return out;
}
