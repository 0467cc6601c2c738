/** Text made safe for HTML element content and attribute values. */
export function escapeHtml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

/** A probability or statistic for a reader: four significant digits, very small values in exponent form. */
export function formatNumber(value: number | null): string {
  if (value === null) return '';
  if (value !== 0 && Math.abs(value) < 1e-4) return value.toExponential(2);
  return Number(value.toPrecision(4)).toString();
}
