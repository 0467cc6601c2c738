import {
  applyTransform,
  NonPositiveValueError,
  replaceBelowDetectionLimit,
  toDistanceCoordinates,
  type TransformSpec,
} from '@provenote/shared';
import { InputFileError } from './cli-errors';
import type { LoadedSamples } from './load-samples';
import type { DataOptions } from './parse-args';

export interface Features {
  /** Coordinates in which distances are computed (ilr pivot coordinates for clr). */
  readonly values: number[][];
  readonly variables: string[];
  /** Number of imputed ("<DL") cells per element. */
  readonly imputedCells: Record<string, number>;
}

export function transformSpec(options: DataOptions): TransformSpec {
  return { transform: options.transform, alrDenominator: options.alrDenominator ?? undefined };
}

/** Replaces "<DL" cells, applies the transform, and moves clr data to the pivot basis for distances. */
export function prepareFeatures(samples: LoadedSamples, options: DataOptions): Features {
  const replaced = replaceBelowDetectionLimit(samples.measurements, {
    method: options.belowLimit,
    closure: options.closure,
  });
  const imputedCells = Object.fromEntries(
    samples.elements.map((element, j) => [element, replaced.imputed.filter((row) => row[j]).length]),
  );
  const spec = transformSpec(options);
  try {
    const transformed = toDistanceCoordinates(applyTransform(replaced.values, samples.elements, spec), spec);
    return { values: transformed.values, variables: transformed.variables, imputedCells };
  } catch (error) {
    if (error instanceof NonPositiveValueError) {
      throw new InputFileError(
        samples.file,
        `value ${error.value} cannot take the ${options.transform} transform; write values below the detection limit as <DL`,
        samples.lines[error.row],
        samples.elements[error.column],
      );
    }
    throw error;
  }
}
