import { whiten } from '../linalg/cholesky';
import type { GroupModel } from '../stats/group-model';

/**
 * Per-variable contributions to D²: the squared whitened residuals zⱼ² with z = L⁻¹(x − x̄). They sum
 * to D². With the Cholesky factor, zⱼ is the part of variable j not predicted by the variables listed
 * before it (the sequential decomposition of Mason, Tracy & Young 1995, J. Quality Technology 27:99), so
 * the split depends on the variable order while the total does not.
 */
export function distanceContributions(model: GroupModel, x: readonly number[]): number[] {
  return whiten(model.cholesky.lower, x, model.mean, new Array<number>(model.mean.length)).map((z) => z * z);
}
