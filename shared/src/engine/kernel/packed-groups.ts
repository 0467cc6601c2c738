import { GroupTooSmallError, InvalidInputError } from '../errors/engine-errors';
import type { GroupModel } from '../stats/group-model';

/**
 * Reference groups packed into flat Float64Arrays for the classification kernel: the means, the
 * Cholesky factors (row-major, lower triangle), their reciprocal diagonals and the group sizes. Plain
 * data only, so it can be posted to worker threads as it is.
 */
export interface PackedGroups {
  readonly names: string[];
  readonly p: number;
  /** G × p. */
  readonly means: Float64Array;
  /** G × p × p, row-major; only the lower triangle is used. */
  readonly lowers: Float64Array;
  /** G × p: 1 / Lⱼⱼ. */
  readonly inverseDiagonals: Float64Array;
  /** G: the sizes the F law uses (effective n). */
  readonly sizes: Float64Array;
}

export function packGroups(models: readonly GroupModel[]): PackedGroups {
  if (models.length === 0) throw new InvalidInputError('at least one reference group is needed');
  const p = models[0].mean.length;
  const g = models.length;
  const means = new Float64Array(g * p);
  const lowers = new Float64Array(g * p * p);
  const inverseDiagonals = new Float64Array(g * p);
  const sizes = new Float64Array(g);
  models.forEach((model, k) => {
    if (model.mean.length !== p)
      throw new InvalidInputError(`group "${model.name}" has ${model.mean.length} variables, expected ${p}`);
    if (!(model.effectiveN > p))
      throw new GroupTooSmallError(model.name, model.effectiveN, p, p + 1, 'the new-observation F distribution');
    means.set(model.mean, k * p);
    model.cholesky.lower.forEach((row, j) => {
      lowers.set(row, (k * p + j) * p);
      inverseDiagonals[k * p + j] = 1 / row[j];
    });
    sizes[k] = model.effectiveN;
  });
  return { names: models.map((m) => m.name), p, means, lowers, inverseDiagonals, sizes };
}
