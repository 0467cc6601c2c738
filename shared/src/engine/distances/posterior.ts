import { InvalidInputError } from '../errors/engine-errors';

/**
 * Posterior probabilities of group membership under the quadratic discriminant rule:
 * P(k | x) = πₖ fₖ(x) / Σⱼ πⱼ fⱼ(x) with log fₖ = −½ log|Sₖ| − ½ D²ₖ (the −(p/2) log 2π term cancels)
 * (METHODS.md §2). Evaluated by log-sum-exp so far samples do not underflow to 0/0. Posteriors always
 * sum to 1, even for a sample that fits no group: show them beside the typicality probabilities only.
 */
export function posteriorProbabilities(
  d2: readonly number[],
  logDets: readonly number[],
  priors?: readonly number[],
): number[] {
  const g = d2.length;
  if (logDets.length !== g || (priors && priors.length !== g) || g === 0) {
    throw new InvalidInputError('posterior probabilities need one D², one log-determinant and one prior per group');
  }
  const prior = priors ?? new Array<number>(g).fill(1 / g);
  if (prior.some((value) => !(value > 0))) throw new InvalidInputError('every prior probability must be positive');
  const logWeights = d2.map((value, k) => Math.log(prior[k]) - 0.5 * logDets[k] - 0.5 * value);
  const largest = Math.max(...logWeights);
  const shifted = logWeights.map((value) => Math.exp(value - largest));
  const total = shifted.reduce((sum, value) => sum + value, 0);
  return shifted.map((value) => value / total);
}
