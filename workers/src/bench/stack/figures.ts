export const round2 = (x: number) => Math.round(x * 100) / 100;

/** The q-quantile of a sample by the nearest-rank method (Hyndman & Fan 1996, definition 1). */
export function quantile(values: readonly number[], q: number): number {
  if (values.length === 0) throw new Error('a quantile of no values is undefined');
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.max(0, Math.ceil(q * sorted.length) - 1)];
}
