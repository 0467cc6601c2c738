import { BadRequestException } from '@nestjs/common';
import {
  applyTransform,
  cellFlags,
  EngineError,
  replaceBelowDetectionLimit,
  type Measurement,
  type StepParameters,
} from '@provenote/shared';
import type { DatasetVersion } from '../datasets/dataset-version.entity';

const BELOW_DL = cellFlags.indexOf('below_dl');

export interface StoredRow {
  sample_id: string;
  ppm: (number | null)[];
  flags: number[];
}

export interface CoordinateRows {
  variables: string[];
  rows: { sampleId: string; values: (number | null)[]; belowDetection: boolean[] }[];
}

function indexesOf(version: DatasetVersion, elements: readonly string[], what: string): number[] {
  return elements.map((element) => {
    const index = version.columns.findIndex((c) => c.element === element);
    if (index < 0) throw new BadRequestException(`The ${what} data have no "${element}" column`);
    return index;
  });
}

/** The stored ppm of the given elements, a missing value left null. */
export function measuredCoordinates(
  version: DatasetVersion,
  rows: StoredRow[],
  elements: readonly string[],
  what: string,
): CoordinateRows {
  const indexes = indexesOf(version, elements, what);
  return {
    variables: [...elements],
    rows: rows.map((row) => ({
      sampleId: row.sample_id,
      values: indexes.map((j) => row.ppm[j]),
      belowDetection: indexes.map((j) => row.flags[j] === BELOW_DL),
    })),
  };
}

/**
 * The coordinates a run computes in, by the same engine steps as the workers (below-detection
 * replacement, then the transform), so a plotted point is the one classification used. clr is shown as
 * clr, not as the pivot coordinates distances are taken in, since clr(element) is what one reads. Samples
 * lacking a number for a chosen element cannot take part in a run and are left out here too. A log-ratio
 * coordinate depends on every part, so any replaced part marks it; log10 and ln depend on their own only.
 */
export function preparedCoordinates(
  version: DatasetVersion,
  rows: StoredRow[],
  prepare: NonNullable<StepParameters['prepare']>,
  what: string,
): CoordinateRows {
  const indexes = indexesOf(version, prepare.elements, what);
  const usable = rows.filter((row) => indexes.every((j) => row.ppm[j] !== null && Number.isFinite(row.ppm[j])));
  const spec = { transform: prepare.transform, alrDenominator: prepare.alrDenominator ?? undefined };
  const below = usable.map((row) => indexes.map((j) => row.flags[j] === BELOW_DL));
  try {
    const measurements = usable.map((row, i): Measurement[] =>
      indexes.map((j, k) => (below[i][k] ? { belowDetectionLimit: row.ppm[j]! } : row.ppm[j]!)),
    );
    const replaced = replaceBelowDetectionLimit(measurements, { method: prepare.belowDetection }).values;
    const transformed = applyTransform(replaced, prepare.elements, spec);
    const ownPartOnly = ['none', 'log10', 'ln'].includes(prepare.transform);
    return {
      variables: transformed.variables,
      rows: usable.map((row, i) => ({
        sampleId: row.sample_id,
        values: transformed.values[i],
        belowDetection: ownPartOnly ? below[i] : transformed.variables.map(() => below[i].some(Boolean)),
      })),
    };
  } catch (error) {
    if (error instanceof EngineError)
      throw new BadRequestException(`The ${what} data cannot be prepared as the Prepare card says: ${error.message}`);
    throw error;
  }
}
