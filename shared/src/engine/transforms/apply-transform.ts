import { InvalidInputError } from '../errors/engine-errors';
import type { Matrix } from '../linalg/matrix';
import {
  alrTransform,
  clrToPivotCoordinates,
  clrTransform,
  ilrTransform,
  lnTransform,
  log10Transform,
} from './log-ratio';

export const TRANSFORM_NAMES = ['none', 'log10', 'ln', 'alr', 'clr', 'ilr'] as const;
export type TransformName = (typeof TRANSFORM_NAMES)[number];

export interface TransformSpec {
  readonly transform: TransformName;
  /** alr only: the name of the denominator part. */
  readonly alrDenominator?: string;
}

export interface TransformedData {
  readonly values: number[][];
  /** Names of the transformed coordinates, e.g. "ln(Cu/Fe)", "clr(Cu)", "pivot(Cu)". */
  readonly variables: string[];
}

/** Applies the named transform to rows whose columns are `variables`. */
export function applyTransform(rows: Matrix, variables: readonly string[], spec: TransformSpec): TransformedData {
  switch (spec.transform) {
    case 'none':
      return { values: rows.map((row) => [...row]), variables: [...variables] };
    case 'log10':
      return { values: log10Transform(rows), variables: variables.map((v) => `log10(${v})`) };
    case 'ln':
      return { values: lnTransform(rows), variables: variables.map((v) => `ln(${v})`) };
    case 'alr': {
      const denominatorName = spec.alrDenominator ?? variables[variables.length - 1];
      const denominator = variables.indexOf(denominatorName);
      if (denominator < 0) {
        throw new InvalidInputError(
          `alr denominator "${denominatorName}" is not one of the variables ${variables.join(', ')}`,
        );
      }
      return {
        values: alrTransform(rows, denominator),
        variables: variables.filter((_, j) => j !== denominator).map((v) => `ln(${v}/${denominatorName})`),
      };
    }
    case 'clr':
      return { values: clrTransform(rows), variables: variables.map((v) => `clr(${v})`) };
    case 'ilr':
      return { values: ilrTransform(rows), variables: pivotNames(variables) };
  }
}

function pivotNames(variables: readonly string[]): string[] {
  return variables.slice(0, -1).map((v) => `pivot(${v})`);
}

/**
 * The coordinates in which distances are computed. clr data have a singular covariance (rank D−1);
 * instead of a pseudo-inverse, D² is computed in the pivot (ilr) coordinates, an orthonormal basis of
 * the same clr plane, which gives exactly the pseudo-inverse D² (Egozcue et al. 2003, Mathematical
 * Geology 35:279; the tests check the equality). Every other transform is used as it is.
 */
export function toDistanceCoordinates(data: TransformedData, spec: TransformSpec): TransformedData {
  if (spec.transform !== 'clr') return data;
  const parts = data.variables.map((name) => name.replace(/^clr\((.*)\)$/, '$1'));
  return { values: clrToPivotCoordinates(data.values), variables: pivotNames(parts) };
}
