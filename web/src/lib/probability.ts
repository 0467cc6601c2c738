/**
 * The smallest probability Provenote states. The engine's tail probabilities can underflow to an exact 0
 * in double precision (below about 1e-308), and a printed "0" would read as impossible rather than tiny.
 */
export const PROBABILITY_FLOOR_TEXT = '< 1e-300';

/**
 * One format for every membership probability: three significant digits, exponent form below 0.001,
 * and the floor text for an underflow to 0.
 */
export function formatProbability(p: number): string {
  if (!Number.isFinite(p) || p < 0 || p > 1) throw new RangeError(`Not a probability: ${p}`);
  if (p === 0) return PROBABILITY_FLOOR_TEXT;
  if (p < 0.001) return p.toExponential(2);
  return p.toPrecision(3);
}

/** As formatProbability, with a dash where there is no probability (no runner-up, say). */
export const formatOptionalProbability = (p: number | null) => (p === null ? '—' : formatProbability(p));
