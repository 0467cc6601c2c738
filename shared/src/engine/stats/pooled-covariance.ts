import { InvalidInputError } from '../errors/engine-errors';
import type { Matrix } from '../linalg/matrix';
import { columnMeans, crossProducts } from './moments';

/**
 * Pooled within-group covariance Σₖ (nₖ − 1) Sₖ / (N − g), the common covariance of linear
 * discriminant analysis and of the two-sample Hotelling T² (Hotelling 1931).
 */
export function pooledCovariance(groups: readonly Matrix[]): number[][] {
  const total = groups.reduce((sum, rows) => sum + rows.length, 0);
  const df = total - groups.length;
  if (groups.length === 0 || df < 1) {
    throw new InvalidInputError(`pooled covariance needs more members (${total}) than groups (${groups.length})`);
  }
  const p = groups[0][0].length;
  const pooled = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (const rows of groups) {
    const sscp = crossProducts(rows, columnMeans(rows));
    for (let j = 0; j < p; j++) for (let k = 0; k < p; k++) pooled[j][k] += sscp[j][k];
  }
  return pooled.map((row) => row.map((value) => value / df));
}
