import { classifySamples, DEFAULT_MCD_SEED, distanceContributions, fitGroup } from '@provenote/shared';
import type { RunProcessor } from '../queue/run-worker';
import { prepareSamples, splitByGroup } from './prepare-samples';
import { computeProjections } from './projections';

/** Unknowns per slice between checkpoints: small enough that Bull's lock renewal is never starved. */
export const CLASSIFY_SLICE_ROWS = 4096;

/**
 * Classification: a model per reference group, then D², both membership probabilities, the verdict
 * and the per-element contributions to D² to the best group for every unknown.
 */
export const classifyProcessor: RunProcessor = async ({ run, store, checkpoint }) => {
  const { parameters } = run;
  await checkpoint(0, 'reading inputs');
  const reference = await store.loadSamples(run.id, 'reference');
  const unknowns = await store.loadSamples(run.id, 'unknown');
  await checkpoint(0.05, 'preparing data');
  const preparedReference = prepareSamples(reference, parameters);
  const preparedUnknowns = prepareSamples(unknowns, parameters);
  await checkpoint(0.1, 'fitting reference groups');
  const fitOptions = { covariance: parameters.covariance, seed: run.seed ?? DEFAULT_MCD_SEED };
  const referenceGroups = splitByGroup(reference, preparedReference);
  const models = referenceGroups.map((group) =>
    fitGroup(group.name, group.rows, preparedReference.variables, fitOptions),
  );
  const modelByName = new Map(models.map((model) => [model.name, model]));

  const n = unknowns.sampleIds.length;
  const g = models.length;
  const p = preparedReference.variables.length;
  const results = {
    groups: models.map((model) => ({ name: model.name, n: model.n, effectiveN: model.effectiveN })),
    variables: preparedReference.variables,
    sampleIds: unknowns.sampleIds,
    verdicts: new Array<string>(n),
    bestGroups: new Array<string>(n),
    probabilities: new Float64Array(n),
    runnerUps: new Array<string | null>(n),
    runnerUpProbabilities: new Array<number | null>(n),
    d2: new Float64Array(n * g),
    pChi2: new Float64Array(n * g),
    pHotelling: new Float64Array(n * g),
    contributions: new Float64Array(n * p),
  };
  const options = { basis: parameters.probability, alpha: parameters.alpha };
  for (let first = 0; first < n; first += CLASSIFY_SLICE_ROWS) {
    await checkpoint(0.15 + (0.7 * first) / n, 'classifying unknowns');
    const rows = preparedUnknowns.values.slice(first, first + CLASSIFY_SLICE_ROWS);
    classifySamples(models, rows, options).forEach((sample, r) => {
      const i = first + r;
      const { verdict } = sample;
      results.verdicts[i] = verdict.verdict;
      results.bestGroups[i] = verdict.group;
      results.probabilities[i] = verdict.probability;
      results.runnerUps[i] = verdict.runnerUp;
      results.runnerUpProbabilities[i] = verdict.runnerUpProbability;
      results.d2.set(sample.d2, i * g);
      results.pChi2.set(sample.pChi2, i * g);
      results.pHotelling.set(sample.pHotelling, i * g);
      results.contributions.set(distanceContributions(modelByName.get(verdict.group)!, rows[r]), i * p);
    });
  }
  await checkpoint(0.85, 'projecting');
  const projections = computeProjections({
    parameters,
    groups: referenceGroups.map((group, k) => ({
      model: models[k],
      rows: group.rows,
      sampleIds: group.ordinals.map((i) => reference.sampleIds[i]),
    })),
    unknowns: preparedUnknowns,
    unknownIds: unknowns.sampleIds,
    verdicts: results.verdicts,
    bestGroups: results.bestGroups,
  });
  await checkpoint(0.9, 'saving results');
  return store.saveClassifyResults(run.id, { ...results, projections });
};
