import {
  applyTransform,
  replaceBelowDetectionLimit,
  toDistanceCoordinates,
  type AssignmentParameters,
  type Measurement,
  type TransformedData,
} from '@provenote/shared';
import type { StoredSamples } from '../queue/run-store';

/**
 * Values below the detection limit replaced by the run's rule, then transformed into the coordinates
 * distances are computed in. Reference and unknowns go through the same steps.
 */
export function prepareSamples(samples: StoredSamples, parameters: AssignmentParameters): TransformedData {
  const anyBelow = samples.belowDetection.some((flags) => flags?.some(Boolean));
  const values = anyBelow
    ? replaceBelowDetectionLimit(
        samples.values.map((row, i): Measurement[] =>
          row.map((value, j) => (samples.belowDetection[i]?.[j] ? { belowDetectionLimit: value } : value)),
        ),
        { method: parameters.belowDetection },
      ).values
    : samples.values;
  const spec = { transform: parameters.transform, alrDenominator: parameters.alrDenominator };
  return toDistanceCoordinates(applyTransform(values, parameters.elements, spec), spec);
}

/** Reference rows split by group, groups in order of name so a run's group order never depends on input order. */
export function splitByGroup(samples: StoredSamples, prepared: TransformedData) {
  const byGroup = new Map<string, { ordinals: number[]; rows: number[][] }>();
  samples.groups.forEach((group, i) => {
    if (group === null) return;
    const entry = byGroup.get(group) ?? { ordinals: [], rows: [] };
    entry.ordinals.push(i);
    entry.rows.push(prepared.values[i]);
    byGroup.set(group, entry);
  });
  return [...byGroup.entries()]
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([name, entry]) => ({ name, ...entry }));
}
