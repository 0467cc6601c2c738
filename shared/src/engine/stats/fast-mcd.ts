import { chiSquareQuantile } from '../distributions/quantiles';
import { chiSquareUpperTail } from '../distributions/upper-tails';
import { InvalidInputError, SingularCovarianceError } from '../errors/engine-errors';
import {
  cholesky,
  choleskyOrNull,
  squaredDistance,
  type CholeskyFactor,
  type CovarianceContext,
} from '../linalg/cholesky';
import type { Matrix } from '../linalg/matrix';
import { mulberry32, type RandomSource } from '../random/mulberry32';
import { columnMeans, covariance } from './moments';

/*
 * FAST-MCD (Rousseeuw & Van Driessen 1999, Technometrics 41:212): the h-subset of members whose
 * covariance has the smallest determinant, found from random (p+1)-subsets improved by C-steps
 * (each C-step keeps the h members closest to the current fit, which never raises the determinant).
 * Large groups use the paper's nested scheme: starts in up to five disjoint subsets of 300, refined on
 * their union, then on all members.
 */

export interface McdOptions {
  /** Seed of the random subsets, recorded in the result so a run can be repeated exactly. */
  readonly seed: number;
  readonly context: CovarianceContext;
  /** Subset size; default ⌊(n + p + 1)/2⌋, the most robust choice (breakdown near 50 %). */
  readonly h?: number;
  /** Number of random starts; the paper uses 500. */
  readonly starts?: number;
}

export interface McdResult {
  readonly seed: number;
  readonly h: number;
  /** Indices of the best h-subset. */
  readonly rawSubset: number[];
  readonly rawMean: number[];
  /** Covariance of the best h-subset times the consistency factor. */
  readonly rawCovariance: number[][];
  /** med D² / χ²_p(0.5) (Rousseeuw & Van Driessen 1999, §2). */
  readonly consistencyFactor: number;
  /** Reweighted estimate: the members with raw robust D² ≤ χ²_p(0.975). */
  readonly mean: number[];
  readonly covariance: number[][];
  readonly support: boolean[];
  /** Robust D² of every member against the reweighted estimate. */
  readonly distances: number[];
  /** χ²_p(0.975), the cut-off of the reweighting step. */
  readonly cutoff: number;
}

interface Candidate {
  readonly subset: number[];
  readonly mean: number[];
  readonly cov: number[][];
  readonly factor: CholeskyFactor;
}

const FINALISTS = 10;
const SUBSET_SIZE = 300;
const MAX_SUBSETS = 5;
const MAX_C_STEPS = 200;

function fitSubset(rows: Matrix, subset: number[]): Candidate | null {
  const members = subset.map((i) => rows[i]);
  const mean = columnMeans(members);
  const cov = covariance(members, mean);
  const factor = choleskyOrNull(cov);
  return factor ? { subset, mean, cov, factor } : null;
}

function exactFitError(context: CovarianceContext, h: number): SingularCovarianceError {
  return new SingularCovarianceError(
    context.group,
    context.variables,
    `${h} or more members lie on a hyperplane (an h-subset with a singular covariance, h = ${h})`,
  );
}

/**
 * One C-step on `pool`: the h members of the pool closest to the candidate. A singular h-subset is the
 * exact-fit case of the paper (h members on a hyperplane), reported instead of skipped.
 */
function cStep(
  rows: Matrix,
  pool: readonly number[],
  h: number,
  candidate: Candidate,
  context: CovarianceContext,
): Candidate {
  const d2 = pool.map((i) => squaredDistance(candidate.factor.lower, rows[i], candidate.mean));
  const order = pool.map((_, k) => k).sort((a, b) => d2[a] - d2[b]);
  const next = fitSubset(
    rows,
    order.slice(0, h).map((k) => pool[k]),
  );
  if (!next) throw exactFitError(context, h);
  return next;
}

/**
 * C-steps until the determinant stops falling. The first step is always taken: the start is a
 * (p+1)-subset or an h-subset of another pool, so its determinant is not comparable.
 */
function iterateCSteps(
  rows: Matrix,
  pool: readonly number[],
  h: number,
  start: Candidate,
  steps: number,
  context: CovarianceContext,
): Candidate {
  let current = cStep(rows, pool, h, start, context);
  for (let step = 1; step < steps; step++) {
    const next = cStep(rows, pool, h, current, context);
    // The determinant cannot rise (the C-step theorem of the paper): stop once it no longer falls.
    if (next.factor.logDet >= current.factor.logDet - 1e-12 * Math.abs(current.factor.logDet)) {
      return next.factor.logDet < current.factor.logDet ? next : current;
    }
    current = next;
  }
  return current;
}

/** A random (p+1)-subset of the pool, extended by further random members while it is singular. */
function randomStart(rows: Matrix, pool: number[], p: number, random: RandomSource): Candidate | null {
  for (let size = 0; size < pool.length; size++) {
    const k = size + random.int(pool.length - size);
    [pool[size], pool[k]] = [pool[k], pool[size]];
    if (size + 1 >= p + 1) {
      const candidate = fitSubset(rows, pool.slice(0, size + 1));
      if (candidate) return candidate;
    }
  }
  return null;
}

function best(candidates: Candidate[], count: number): Candidate[] {
  return [...candidates].sort((a, b) => a.factor.logDet - b.factor.logDet).slice(0, count);
}

/** Starts in `pool`, two C-steps each with the pool's share of h, the best few kept. */
function searchPool(
  rows: Matrix,
  pool: number[],
  hPool: number,
  starts: number,
  random: RandomSource,
  context: CovarianceContext,
): Candidate[] {
  const p = rows[0].length;
  const found: Candidate[] = [];
  for (let s = 0; s < starts; s++) {
    const start = randomStart(rows, pool, p, random);
    if (start) found.push(iterateCSteps(rows, pool, hPool, start, 2, context));
  }
  return best(found, FINALISTS);
}

function finalists(
  rows: Matrix,
  h: number,
  starts: number,
  random: RandomSource,
  context: CovarianceContext,
): Candidate[] {
  const n = rows.length;
  const all = rows.map((_, i) => i);
  if (n <= 2 * SUBSET_SIZE) return searchPool(rows, all, h, starts, random, context);
  const subsetCount = Math.min(MAX_SUBSETS, Math.floor(n / SUBSET_SIZE));
  const subsetSize = Math.min(SUBSET_SIZE, Math.floor(n / subsetCount));
  for (let i = 0; i < subsetCount * subsetSize; i++) {
    const k = i + random.int(n - i);
    [all[i], all[k]] = [all[k], all[i]];
  }
  const merged = all.slice(0, subsetCount * subsetSize);
  const perSubset: Candidate[] = [];
  for (let s = 0; s < subsetCount; s++) {
    const pool = merged.slice(s * subsetSize, (s + 1) * subsetSize);
    const hPool = Math.ceil((subsetSize * h) / n);
    perSubset.push(...searchPool(rows, pool, hPool, Math.ceil(starts / subsetCount), random, context));
  }
  const hMerged = Math.ceil((merged.length * h) / n);
  return best(
    perSubset.map((c) => iterateCSteps(rows, merged, hMerged, c, 2, context)),
    FINALISTS,
  );
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

export function fastMcd(rows: Matrix, options: McdOptions): McdResult {
  const n = rows.length;
  const p = rows[0]?.length ?? 0;
  const h = options.h ?? Math.floor((n + p + 1) / 2);
  if (!(Number.isInteger(h) && h > p && h <= n)) {
    throw new InvalidInputError(`MCD subset size h = ${h} must be an integer with p < h ≤ n (p = ${p}, n = ${n})`);
  }
  const random = mulberry32(options.seed);
  const all = rows.map((_, i) => i);
  const everyone = fitSubset(rows, all);
  if (h === n && !everyone) throw exactFitError(options.context, h);
  const candidates =
    h === n && everyone ? [everyone] : finalists(rows, h, options.starts ?? 500, random, options.context);
  const refined = candidates.map((c) => iterateCSteps(rows, all, h, c, MAX_C_STEPS, options.context));
  if (refined.length === 0) throw exactFitError(options.context, h);
  const raw = best(refined, 1)[0];
  const rawD2 = rows.map((row) => squaredDistance(raw.factor.lower, row, raw.mean));
  const consistencyFactor = median(rawD2) / chiSquareQuantile(0.5, p);
  const cutoff = chiSquareQuantile(0.975, p);
  const support = rawD2.map((d2) => d2 / consistencyFactor <= cutoff);
  const kept = rows.filter((_, i) => support[i]);
  const mean = columnMeans(kept);
  // Croux & Haesbroeck (1999), J. Multivariate Analysis 71:161: a normal sample truncated at
  // χ²_p(q) has covariance P[χ²_{p+2} ≤ χ²_p(q)] / q times the full one; dividing restores consistency.
  const truncation = (1 - chiSquareUpperTail(cutoff, p + 2)) / 0.975;
  const cov = covariance(kept, mean).map((r) => r.map((v) => v / truncation));
  const factor = cholesky(cov, options.context);
  return {
    seed: options.seed,
    h,
    rawSubset: [...raw.subset].sort((a, b) => a - b),
    rawMean: raw.mean,
    rawCovariance: raw.cov.map((r) => r.map((v) => v * consistencyFactor)),
    consistencyFactor,
    mean,
    covariance: cov,
    support,
    distances: rows.map((row) => squaredDistance(factor.lower, row, mean)),
    cutoff,
  };
}
