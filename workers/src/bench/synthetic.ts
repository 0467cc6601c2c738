import { fitGroup, mulberry32, type GroupModel } from '@provenote/shared';

/**
 * Seeded synthetic data for the benchmark: groups with correlated variables (a shared factor plus
 * independent noise of growing scale) and unknowns drawn around the group means. Only speed is measured,
 * so the shapes matter, not the values.
 */
export function syntheticRows(n: number, p: number, shift: number, seed: number): number[][] {
  const random = mulberry32(seed);
  return Array.from({ length: n }, () => {
    const common = random.normal();
    return Array.from({ length: p }, (_, j) => shift + (1 + j / p) * random.normal() + 0.6 * common);
  });
}

export function syntheticModels(groups: number, n: number, p: number, seed: number): GroupModel[] {
  const variables = Array.from({ length: p }, (_, j) => `v${j + 1}`);
  return Array.from({ length: groups }, (_, k) =>
    fitGroup(`group-${k + 1}`, syntheticRows(n, p, 0.4 * k, seed + k), variables),
  );
}

/** N unknowns × p, row-major, in a SharedArrayBuffer so worker threads read it without copies. */
export function syntheticUnknowns(rows: number, p: number, groups: number, seed: number): Float64Array {
  const data = new Float64Array(new SharedArrayBuffer(rows * p * Float64Array.BYTES_PER_ELEMENT));
  const random = mulberry32(seed);
  for (let i = 0; i < rows; i++) {
    const shift = 0.4 * random.int(groups);
    for (let j = 0; j < p; j++) data[i * p + j] = shift + 1.5 * random.normal();
  }
  return data;
}
