import { ENGINE_VERSION, replaceBelowDetectionLimit, type Measurement } from '@provenote/shared';
import type {
  AssignmentRow,
  BundleContent,
  ContributionRow,
  DistanceRow,
  PreparedValue,
  SampleRole,
  SeparationRow,
} from '../bundles/bundle-content';
import { recomputeRun, type PreparedSamples } from '../bundles/recompute';
import { projectionContent } from '../bundles/report/projection-content';
import type { StoredSamples } from '../queue/run-store';
import type { BundleSources } from './bundle-source';

/** The run's values after its below-detection rule, exactly as the classify processor replaced them. */
function imputed(samples: StoredSamples, method: BundleSources['parameters']['belowDetection']): number[][] {
  if (!samples.belowDetection.some((flags) => flags?.some(Boolean))) return samples.values;
  const rows = samples.values.map((row, i): Measurement[] =>
    row.map((value, j) => (samples.belowDetection[i]?.[j] ? { belowDetectionLimit: value } : value)),
  );
  return replaceBelowDetectionLimit(rows, { method }).values;
}

/** Reference then unknowns, with per sample and element whether the value was imputed. */
function preparedSamples(sources: BundleSources): { prepared: PreparedSamples; imputedCells: boolean[][] } {
  const { parameters } = sources;
  const part = (samples: StoredSamples, role: SampleRole) => {
    const values = imputed(samples, parameters.belowDetection);
    return samples.sampleIds.map((sampleId, i) => ({
      sampleId,
      role,
      group: role === 'reference' ? samples.groups[i] : null,
      values: values[i],
    }));
  };
  const flags = (samples: StoredSamples) =>
    samples.sampleIds.map((_, i) => parameters.elements.map((_, j) => samples.belowDetection[i]?.[j] === true));
  return {
    prepared: {
      elements: parameters.elements,
      samples: [...part(sources.reference, 'reference'), ...part(sources.unknowns, 'unknown')],
    },
    imputedCells: [...flags(sources.reference), ...flags(sources.unknowns)],
  };
}

function assignments(sources: BundleSources): AssignmentRow[] {
  const overrides = new Map(sources.overrides.map((override) => [override.sampleId, override]));
  return sources.assignments.map((row) => {
    const override = overrides.get(row.sampleId);
    return {
      sampleId: row.sampleId,
      verdict: row.verdict,
      group: row.group,
      probability: row.probability,
      runnerUp: row.runnerUp,
      runnerUpProbability: row.runnerUpProbability,
      finalVerdict: override?.verdict ?? row.verdict,
      finalGroup: override ? override.group : row.verdict === 'assigned' ? row.group : null,
      overrideReason: override?.reason ?? null,
      overriddenBy: override?.by ?? null,
      overriddenAt: override?.at ?? null,
    };
  });
}

function distances(sources: BundleSources): DistanceRow[] {
  return sources.assignments.flatMap((row) =>
    sources.groups.map((group, k) => ({
      sampleId: row.sampleId,
      group,
      d2: row.d2[k],
      pChi2: row.pChi2[k],
      pHotelling: row.pHotelling[k],
    })),
  );
}

function contributions(sources: BundleSources): ContributionRow[] {
  return sources.assignments.flatMap((row) =>
    sources.variables.map((variable, j) => ({
      sampleId: row.sampleId,
      group: row.group,
      variable,
      contribution: row.contributions[j],
    })),
  );
}

/**
 * The stored pairs named in the order the groups first appear in the reference input, the command-line
 * tool's order. The group check run orders groups by name; T², F and p do not depend on which group of
 * a pair comes first, so this only renames.
 */
function separation(sources: BundleSources): SeparationRow[] {
  const order = [...new Set(sources.reference.groups.filter((g): g is string => g !== null))];
  const rank = (group: string) => order.indexOf(group);
  return sources.separation
    .map((pair) =>
      rank(pair.groupA) > rank(pair.groupB) ? { ...pair, groupA: pair.groupB, groupB: pair.groupA } : pair,
    )
    .sort((x, y) => rank(x.groupA) - rank(y.groupA) || rank(x.groupB) - rank(y.groupB));
}

/**
 * A bundle's content from what the runs stored. Results are copied, never recomputed; the group means
 * and covariances (which the run tables do not keep) and the transformed coordinates come from the
 * engine through the command-line tool's path, fitted on the same prepared values.
 */
export function bundleContentFromSources(sources: BundleSources): BundleContent {
  const { prepared, imputedCells } = preparedSamples(sources);
  const fitted = recomputeRun(prepared, sources.parameters, sources.seed);
  const preparedValues: PreparedValue[] = prepared.samples.flatMap((sample, i) =>
    prepared.elements.map((element, j) => ({
      sampleId: sample.sampleId,
      role: sample.role,
      group: sample.group,
      element,
      valuePpm: sample.values[j],
      transformedValue: fitted.transformed[i][j],
      flag: imputedCells[i][j] ? ('imputed' as const) : ('measured' as const),
    })),
  );
  return {
    provenoteVersion: sources.provenoteVersion,
    engineVersion: ENGINE_VERSION,
    createdAt: sources.createdAt,
    createdBy: sources.createdBy,
    lab: sources.lab,
    study: sources.study,
    runId: sources.assignRunId,
    signOff: sources.signOff,
    parameters: sources.parameters,
    seed: sources.seed,
    inputs: sources.rawFiles,
    prepared: preparedValues,
    groups: fitted.groups.map((group) => ({ ...group, version: sources.groupVersions.get(group.name) ?? 1 })),
    results: {
      distances: distances(sources),
      assignments: assignments(sources),
      contributions: contributions(sources),
      members: [...sources.members],
      separation: separation(sources),
    },
    projections: (['pca', 'cv'] as const).map((method) => projectionContent(method, sources.projections[method])),
  };
}
