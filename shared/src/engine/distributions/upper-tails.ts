import betainc from '@stdlib/math-base-special-betainc';
import gammainc from '@stdlib/math-base-special-gammainc';
import { InvalidInputError } from '../errors/engine-errors';

/*
 * Upper tails are evaluated directly as regularized upper incomplete gamma and beta functions
 * (Abramowitz & Stegun 1964, Handbook of Mathematical Functions, ch. 26), never as 1 − cdf: a probability of 1e-30 keeps all
 * its digits instead of rounding to 0.
 */

function assertParameter(value: number, name: string): void {
  if (!(value > 0) || !Number.isFinite(value)) {
    throw new InvalidInputError(`${name} must be a positive finite number, got ${value}`);
  }
}

function assertStatistic(value: number, name: string): void {
  if (Number.isNaN(value) || value < 0) {
    throw new InvalidInputError(`${name} must be a non-negative number, got ${value}`);
  }
}

/** P[χ²_df > x] = Q(df/2, x/2), the regularized upper incomplete gamma function. */
export function chiSquareUpperTail(x: number, df: number): number {
  assertParameter(df, 'degrees of freedom');
  assertStatistic(x, 'chi-square statistic');
  if (x === Infinity) return 0;
  return gammainc(x / 2, df / 2, true, true);
}

/** P[Beta(a, b) > x] = 1 − I_x(a, b), evaluated as the upper regularized incomplete beta function. */
export function betaUpperTail(x: number, a: number, b: number): number {
  assertParameter(a, 'first shape parameter');
  assertParameter(b, 'second shape parameter');
  if (Number.isNaN(x) || x < 0 || x > 1) {
    throw new InvalidInputError(`beta statistic must lie in [0, 1], got ${x}`);
  }
  return betainc(x, a, b, true, true);
}

/**
 * P[F(d1, d2) > f]. With X = d1·f / (d1·f + d2) ~ Beta(d1/2, d2/2) (Abramowitz & Stegun 1964, ch. 26), the tail is
 * I_{1−X}(d2/2, d1/2); 1 − X is formed as d2 / (d1·f + d2) so no digits cancel.
 */
export function fUpperTail(f: number, d1: number, d2: number): number {
  assertParameter(d1, 'numerator degrees of freedom');
  assertParameter(d2, 'denominator degrees of freedom');
  assertStatistic(f, 'F statistic');
  if (f === Infinity) return 0;
  return betainc(d2 / (d1 * f + d2), d2 / 2, d1 / 2, true, false);
}
