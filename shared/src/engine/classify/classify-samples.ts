import { InvalidInputError } from '../errors/engine-errors';
import { assertFiniteMatrix, type Matrix } from '../linalg/matrix';
import { posteriorProbabilities } from '../distances/posterior';
import { classifyInBlocks } from '../kernel/classify-kernel';
import { packGroups } from '../kernel/packed-groups';
import type { GroupModel } from '../stats/group-model';
import { decideVerdict, type ProbabilityBasis, type VerdictResult } from '../verdicts/verdict';

export interface SampleClassification {
  /** Per group, in the order of the models. */
  readonly d2: number[];
  readonly pChi2: number[];
  readonly pHotelling: number[];
  /** Quadratic-rule posteriors with equal priors: a second view beside typicality, never instead of it. */
  readonly posterior: number[];
  readonly verdict: VerdictResult;
}

export interface ClassifyOptions {
  readonly basis: ProbabilityBasis;
  readonly alpha: number;
}

/** Distances, both membership probabilities and the verdict for every sample against every group. */
export function classifySamples(
  models: readonly GroupModel[],
  samples: Matrix,
  options: ClassifyOptions,
): SampleClassification[] {
  const packed = packGroups(models);
  assertFiniteMatrix(samples, 'unknown samples', packed.p);
  if (samples.length === 0) throw new InvalidInputError('there are no samples to classify');
  const data = Float64Array.from(samples.flat());
  const g = models.length;
  const logDets = models.map((m) => m.cholesky.logDet);
  const results: SampleClassification[] = [];
  classifyInBlocks(packed, data, (first, rows, out) => {
    for (let r = 0; r < rows; r++) {
      const d2 = Array.from(out.d2.subarray(r * g, (r + 1) * g));
      const pChi2 = Array.from(out.pChi2.subarray(r * g, (r + 1) * g));
      const pHotelling = Array.from(out.pHotelling.subarray(r * g, (r + 1) * g));
      const basis = options.basis === 'chi2' ? pChi2 : pHotelling;
      results.push({
        d2,
        pChi2,
        pHotelling,
        posterior: posteriorProbabilities(d2, logDets),
        verdict: decideVerdict(packed.names, basis, d2, options.alpha),
      });
    }
  });
  return results;
}
