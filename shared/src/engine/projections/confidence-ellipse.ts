import { chiSquareQuantile, fQuantile } from '../distributions/quantiles';
import { GroupTooSmallError, InvalidInputError } from '../errors/engine-errors';
import type { Matrix } from '../linalg/matrix';

export interface ProjectedGroup {
  readonly mean: [number, number];
  readonly covariance: [[number, number], [number, number]];
}

/** A group's mean A·x̄ and covariance A·S·Aᵀ in a 2-D projection whose two rows are the axes A. */
export function projectGroup(
  mean: readonly number[],
  covariance: Matrix,
  axes: readonly [readonly number[], readonly number[]],
): ProjectedGroup {
  const p = mean.length;
  if (axes.some((axis) => axis.length !== p)) throw new InvalidInputError(`projection axes must have ${p} entries`);
  const dot = (a: readonly number[], b: readonly number[]) => a.reduce((s, v, j) => s + v * b[j], 0);
  const times = (axis: readonly number[]) => covariance.map((row) => dot(row, axis));
  const [u, v] = axes;
  const su = times(u);
  const sv = times(v);
  return {
    mean: [dot(u, mean), dot(v, mean)],
    covariance: [
      [dot(u, su), dot(u, sv)],
      [dot(v, su), dot(v, sv)],
    ],
  };
}

export interface EllipseOptions {
  /** Coverage, e.g. 0.95. */
  readonly level: number;
  /**
   * 'chi2': q = χ²₂(level) (METHODS.md §6). 'f': the region holding a new member of a group of n
   * with probability `level`, q = 2(n+1)(n−1)/(n(n−2)) · F₂,ₙ₋₂(level) (the new-observation F law of
   * NIST e-Handbook §6.5.4.3 with p = 2), wider for small groups.
   */
  readonly basis: 'chi2' | 'f';
  readonly n?: number;
  readonly points?: number;
}

/**
 * Outline of the ellipse {y : (y − m)ᵀ C⁻¹ (y − m) = q}: centre m, axes along the eigenvectors of the
 * 2×2 covariance C, half-lengths √(λ·q). Returned as closed x, y arrays (first point repeated last).
 */
export function confidenceEllipse(
  group: ProjectedGroup,
  options: EllipseOptions,
): { x: number[]; y: number[]; q: number } {
  if (!(options.level > 0 && options.level < 1))
    throw new InvalidInputError(`level must lie in (0, 1), got ${options.level}`);
  let q: number;
  if (options.basis === 'chi2') {
    q = chiSquareQuantile(options.level, 2);
  } else {
    const n = options.n ?? 0;
    if (!(n > 2)) throw new GroupTooSmallError('projected group', n, 2, 3, 'the F-based ellipse');
    q = ((2 * (n + 1) * (n - 1)) / (n * (n - 2))) * fQuantile(options.level, 2, n - 2);
  }
  const [[a, b], [, d]] = group.covariance;
  // Closed-form eigen-decomposition of a symmetric 2×2 matrix.
  const half = (a - d) / 2;
  const radius = Math.hypot(half, b);
  const l1 = (a + d) / 2 + radius;
  const l2 = (a + d) / 2 - radius;
  if (!(l2 > 0)) throw new InvalidInputError('the projected covariance is singular: the ellipse degenerates to a line');
  const angle = radius === 0 ? 0 : Math.atan2(l1 - a, b);
  const [cx, cy] = group.mean;
  const count = options.points ?? 100;
  const x: number[] = [];
  const y: number[] = [];
  for (let i = 0; i <= count; i++) {
    const t = (2 * Math.PI * (i % count)) / count;
    const u = Math.sqrt(l1 * q) * Math.cos(t);
    const v = Math.sqrt(l2 * q) * Math.sin(t);
    x.push(cx + u * Math.cos(angle) - v * Math.sin(angle));
    y.push(cy + u * Math.sin(angle) + v * Math.cos(angle));
  }
  return { x, y, q };
}
