import { assessGroupSize, EngineError, fitGroup, type GroupModel, type GroupSizeAssessment } from '@provenote/shared';
import { InputFileError } from './cli-errors';
import type { Features } from './prepare-features';
import type { LoadedSamples } from './load-samples';
import type { DataOptions } from './parse-args';

export interface ReferenceFit {
  readonly models: GroupModel[];
  /** Row indices (into the reference file) of each group's members. */
  readonly memberRows: number[][];
  readonly sizes: GroupSizeAssessment[];
}

/** One model per group, in order of first appearance; engine refusals are reported against the file. */
export function fitReference(samples: LoadedSamples, features: Features, options: DataOptions): ReferenceFit {
  const groups = samples.groups;
  if (groups === null) throw new InputFileError(samples.file, `has no group column "${options.groupColumn}"`, 1);
  const names = [...new Set(groups)];
  const memberRows = names.map((name) => groups.flatMap((g, i) => (g === name ? [i] : [])));
  const p = features.variables.length;
  try {
    const models = names.map((name, k) =>
      fitGroup(
        name,
        memberRows[k].map((i) => features.values[i]),
        features.variables,
        { covariance: options.covariance, seed: options.seed },
      ),
    );
    return {
      models,
      memberRows,
      sizes: names.map((name, k) => assessGroupSize(name, memberRows[k].length, p, options.alpha)),
    };
  } catch (error) {
    if (error instanceof EngineError) throw new InputFileError(samples.file, error.message);
    throw error;
  }
}
