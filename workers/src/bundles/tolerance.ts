/*
 * How closely a recomputed value must match the bundle's. Numbers are written at full precision, so the
 * same engine on any IEEE-754 machine reproduces them exactly; the slack covers a different order of
 * floating-point operations in a later engine version, and no more.
 */
export const RELATIVE_TOLERANCE = 1e-9;
/** Floor for continuous values at or near zero (a centred mean, a covariance between unrelated elements). */
export const ABSOLUTE_FLOOR = 1e-12;
/** Probabilities lie in [0, 1] and are compared absolutely. */
export const PROBABILITY_TOLERANCE = 1e-12;

export function withinRelative(expected: number, actual: number): boolean {
  return (
    Math.abs(expected - actual) <= RELATIVE_TOLERANCE * Math.max(Math.abs(expected), Math.abs(actual)) + ABSOLUTE_FLOOR
  );
}

export function withinProbability(expected: number, actual: number): boolean {
  return Math.abs(expected - actual) <= PROBABILITY_TOLERANCE;
}

export const TOLERANCE_TEXT =
  `D², contributions to D², T², F, means, covariances, transformed values and robust distances: |a - b| <= ${RELATIVE_TOLERANCE} x max(|a|, |b|) + ${ABSOLUTE_FLOOR} ` +
  `(relative ${RELATIVE_TOLERANCE}, absolute floor ${ABSOLUTE_FLOOR}); probabilities: |a - b| <= ${PROBABILITY_TOLERANCE} (absolute); ` +
  'counts, degrees of freedom, names and verdicts: exactly equal.';
