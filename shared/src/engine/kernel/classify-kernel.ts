import { betaUpperTailFor, chiSquareUpperTailFor } from '../distributions/fast-upper-tails';
import { InvalidInputError } from '../errors/engine-errors';
import type { PackedGroups } from './packed-groups';

/** Outputs for a block of rows, sample-major: entry (i, k) at i·G + k. */
export interface KernelOutput {
  readonly d2: Float64Array;
  readonly pChi2: Float64Array;
  readonly pHotelling: Float64Array;
}

export function allocateKernelOutput(rows: number, groups: number): KernelOutput {
  return {
    d2: new Float64Array(rows * groups),
    pChi2: new Float64Array(rows * groups),
    pHotelling: new Float64Array(rows * groups),
  };
}

interface TailEvaluators {
  readonly chi: (x: number) => number;
  readonly beta: ((x: number, y: number) => number)[];
  /** n(n−p)/((n+1)(n−1)) per group: p·F of the new-observation law (NIST e-Handbook §6.5.4.3). */
  readonly pfScale: Float64Array;
  readonly d2f: Float64Array;
}

function evaluatorsFor(groups: PackedGroups): TailEvaluators {
  const p = groups.p;
  const n = groups.sizes;
  return {
    chi: chiSquareUpperTailFor(p),
    beta: Array.from(n, (size) => betaUpperTailFor(p / 2, (size - p) / 2)),
    pfScale: n.map((size) => (size * (size - p)) / ((size + 1) * (size - 1))),
    d2f: n.map((size) => size - p),
  };
}

/**
 * D² of four consecutive rows against group k by forward substitution with the group's Cholesky
 * factor (no inverse). Four rows share each load of L and give the processor four independent chains
 * of additions: one row at a time is bound by floating-point latency and runs at less than half speed.
 */
function distancesOfFour(
  groups: PackedGroups,
  data: Float64Array,
  first: number,
  k: number,
  z: Float64Array,
  d2: Float64Array,
  at: number,
  g: number,
): void {
  const { p, means, lowers, inverseDiagonals } = groups;
  const x0 = first * p;
  const x1 = x0 + p;
  const x2 = x1 + p;
  const x3 = x2 + p;
  const m = k * p;
  const l = m * p;
  let a0 = 0;
  let a1 = 0;
  let a2 = 0;
  let a3 = 0;
  for (let j = 0; j < p; j++) {
    const row = l + j * p;
    const mu = means[m + j];
    let s0 = data[x0 + j] - mu;
    let s1 = data[x1 + j] - mu;
    let s2 = data[x2 + j] - mu;
    let s3 = data[x3 + j] - mu;
    for (let c = 0; c < j; c++) {
      const lc = lowers[row + c];
      const zc = 4 * c;
      s0 -= lc * z[zc];
      s1 -= lc * z[zc + 1];
      s2 -= lc * z[zc + 2];
      s3 -= lc * z[zc + 3];
    }
    const w = inverseDiagonals[m + j];
    s0 *= w;
    s1 *= w;
    s2 *= w;
    s3 *= w;
    const zj = 4 * j;
    z[zj] = s0;
    z[zj + 1] = s1;
    z[zj + 2] = s2;
    z[zj + 3] = s3;
    a0 += s0 * s0;
    a1 += s1 * s1;
    a2 += s2 * s2;
    a3 += s3 * s3;
  }
  d2[at] = a0;
  d2[at + g] = a1;
  d2[at + 2 * g] = a2;
  d2[at + 3 * g] = a3;
}

/** D² of one row against group k (the remainder rows of a block). */
function distanceOfOne(groups: PackedGroups, data: Float64Array, i: number, k: number, z: Float64Array): number {
  const { p, means, lowers, inverseDiagonals } = groups;
  const x = i * p;
  const m = k * p;
  const l = m * p;
  let d2 = 0;
  for (let j = 0; j < p; j++) {
    const row = l + j * p;
    let sum = data[x + j] - means[m + j];
    for (let c = 0; c < j; c++) sum -= lowers[row + c] * z[c];
    const zj = sum * inverseDiagonals[m + j];
    z[j] = zj;
    d2 += zj * zj;
  }
  return d2;
}

/**
 * D², P[χ²_p > D²] and the new-observation F probability for rows [rowStart, rowEnd) of `data`
 * (row-major, p columns) against every packed group, written to `out` from index 0.
 * P[F(p, n−p) > F] is the upper Beta tail at x = pF/(pF + d₂), y = d₂/(pF + d₂) (d₂ = n − p), so no
 * 1 − cdf is ever formed. Memory: 4p numbers of scratch, whatever the number of rows.
 */
export function classifyBlock(
  groups: PackedGroups,
  data: Float64Array,
  rowStart: number,
  rowEnd: number,
  out: KernelOutput,
  tails = evaluatorsFor(groups),
): void {
  const g = groups.names.length;
  const rows = rowEnd - rowStart;
  if (data.length < rowEnd * groups.p || out.d2.length < rows * g) {
    throw new InvalidInputError('kernel buffers are smaller than the requested rows');
  }
  const z = new Float64Array(4 * groups.p);
  let i = rowStart;
  for (; i + 3 < rowEnd; i += 4) {
    for (let k = 0; k < g; k++) distancesOfFour(groups, data, i, k, z, out.d2, (i - rowStart) * g + k, g);
  }
  for (; i < rowEnd; i++) {
    for (let k = 0; k < g; k++) out.d2[(i - rowStart) * g + k] = distanceOfOne(groups, data, i, k, z);
  }
  for (let e = 0; e < rows * g; e++) {
    const k = e % g;
    const d2 = out.d2[e];
    const t = tails.pfScale[k] * d2;
    const denominator = t + tails.d2f[k];
    out.pChi2[e] = tails.chi(d2);
    out.pHotelling[e] = tails.beta[k](t / denominator, tails.d2f[k] / denominator);
  }
}

/**
 * Classifies all rows in blocks of `blockRows`, handing each block to `onBlock` in a reused buffer:
 * memory stays at blockRows × G × 3 numbers, never N × G × p.
 */
export function classifyInBlocks(
  groups: PackedGroups,
  data: Float64Array,
  onBlock: (firstRow: number, rows: number, out: KernelOutput) => void,
  blockRows = 4096,
  rowStart = 0,
  rowEnd = data.length / groups.p,
): void {
  if (!Number.isInteger(rowEnd))
    throw new InvalidInputError(`data length ${data.length} is not a multiple of p = ${groups.p}`);
  const tails = evaluatorsFor(groups);
  const out = allocateKernelOutput(Math.min(blockRows, rowEnd - rowStart), groups.names.length);
  for (let first = rowStart; first < rowEnd; first += blockRows) {
    const last = Math.min(first + blockRows, rowEnd);
    classifyBlock(groups, data, first, last, out, tails);
    onBlock(first, last - first, out);
  }
}
