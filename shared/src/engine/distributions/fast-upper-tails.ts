import { betaUpperTail, chiSquareUpperTail } from './upper-tails';

/*
 * Exact finite series for the upper tails that the classification kernel evaluates millions of times.
 * They apply when a shape parameter is an integer (an even number of variables p), contain only
 * positive terms (no cancellation), and agree with the general incomplete gamma / beta functions to
 * about 1e-13 relative (see the tests). Outside their safe range (underflow of the leading factor) they
 * hand over to the general functions.
 */

/** The leading factor e^{−x/2} or y^b must stay a normal double for the series to keep full precision. */
const LOG_SMALLEST_SAFE = -700;

/**
 * P[χ²_{2k} > x] = e^{−x/2} Σ_{j<k} (x/2)ʲ / j!  (the gamma–Poisson relation; Abramowitz & Stegun 1964, ch. 26).
 */
export function chiSquareUpperTailEvenDf(x: number, k: number): number {
  const half = x / 2;
  if (-half < LOG_SMALLEST_SAFE) return chiSquareUpperTail(x, 2 * k);
  let term = 1;
  let sum = 1;
  for (let j = 1; j < k; j++) {
    term *= half / j;
    sum += term;
  }
  return Math.exp(-half) * sum;
}

/**
 * P[Beta(a, b) > x] for integer a: I_{1−x}(b, a) = (1−x)ᵇ Σ_{j<a} Γ(b+j)/(Γ(b)·j!) xʲ
 * (the beta–negative-binomial relation; Abramowitz & Stegun 1964, ch. 26; Johnson, Kotz & Balakrishnan, Continuous Univariate Distributions vol. 2, ch. 25).
 * `y` is 1 − x, passed separately so callers can form it without cancellation.
 */
export function betaUpperTailIntegerA(x: number, y: number, a: number, b: number): number {
  const logLeading = b * Math.log(y);
  if (!(logLeading > LOG_SMALLEST_SAFE)) return betaUpperTail(x, a, b);
  let term = 1;
  let sum = 1;
  for (let j = 1; j < a; j++) {
    term *= ((b + j - 1) / j) * x;
    sum += term;
  }
  return Math.exp(logLeading) * sum;
}

/** The fastest exact evaluator of P[χ²_df > x] for a fixed df. */
export function chiSquareUpperTailFor(df: number): (x: number) => number {
  if (Number.isInteger(df) && df % 2 === 0 && df > 0) {
    const k = df / 2;
    return (x) => chiSquareUpperTailEvenDf(x, k);
  }
  return (x) => chiSquareUpperTail(x, df);
}

/**
 * The fastest exact evaluator of P[Beta(a, b) > x] for fixed shapes, taking x and y = 1 − x.
 */
export function betaUpperTailFor(a: number, b: number): (x: number, y: number) => number {
  if (Number.isInteger(a) && a > 0) return (x, y) => betaUpperTailIntegerA(x, y, a, b);
  return (x) => betaUpperTail(x, a, b);
}
