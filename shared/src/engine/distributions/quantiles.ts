import betaQuantileStdlib from '@stdlib/stats-base-dists-beta-quantile';
import chiSquareQuantileStdlib from '@stdlib/stats-base-dists-chisquare-quantile';
import fQuantileStdlib from '@stdlib/stats-base-dists-f-quantile';
import { InvalidInputError } from '../errors/engine-errors';

function assertProbability(probability: number): void {
  if (!(probability >= 0 && probability <= 1)) {
    throw new InvalidInputError(`probability must lie in [0, 1], got ${probability}`);
  }
}

function assertPositive(value: number, name: string): void {
  if (!(value > 0) || !Number.isFinite(value)) {
    throw new InvalidInputError(`${name} must be a positive finite number, got ${value}`);
  }
}

/** x with P[χ²_df ≤ x] = probability (lower-tail quantile). */
export function chiSquareQuantile(probability: number, df: number): number {
  assertProbability(probability);
  assertPositive(df, 'degrees of freedom');
  return chiSquareQuantileStdlib(probability, df);
}

/** f with P[F(d1, d2) ≤ f] = probability. */
export function fQuantile(probability: number, d1: number, d2: number): number {
  assertProbability(probability);
  assertPositive(d1, 'numerator degrees of freedom');
  assertPositive(d2, 'denominator degrees of freedom');
  return fQuantileStdlib(probability, d1, d2);
}

/** x with P[Beta(a, b) ≤ x] = probability. */
export function betaQuantile(probability: number, a: number, b: number): number {
  assertProbability(probability);
  assertPositive(a, 'first shape parameter');
  assertPositive(b, 'second shape parameter');
  return betaQuantileStdlib(probability, a, b);
}
