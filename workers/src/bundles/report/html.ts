/** Text made safe for HTML element content and attribute values. */
export function escapeHtml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

/**
 * A probability or statistic for a reader, in one format throughout: three significant digits, and
 * exponent form below 0.001 so that small probabilities are compared by their exponent (6.39e-5).
 */
export function formatNumber(value: number | null): string {
  if (value === null) return '';
  if (!Number.isFinite(value)) throw new Error(`the report cannot show ${value} as a number`);
  if (value !== 0 && Math.abs(value) < 1e-3) return value.toExponential(2);
  const fixed = value.toPrecision(3);
  // From 1000 up toPrecision switches to exponent form; a large T² reads better as 12300.
  return fixed.includes('e') ? Number(fixed).toString() : fixed;
}
