import {
  applyTransform,
  distanceContributions,
  type AssignmentParameters,
  type GroupModel,
  type TransformSpec,
} from '@provenote/shared';
import { checkTable } from '../cli/check-command';
import { classifyTables } from '../cli/classify-command';
import { fitReference } from '../cli/fit-reference';
import { loadSamples } from '../cli/load-samples';
import type { ClassifyOptions } from '../cli/parse-args';
import { prepareFeatures } from '../cli/prepare-features';
import type { Table } from '../cli/read-table';
import type { AssignmentVerdict } from '@provenote/shared';
import type {
  ContributionRow,
  DistanceRow,
  GroupContent,
  MemberRow,
  SampleRole,
  SeparationRow,
} from './bundle-content';
import { PREPARED_PATH } from './bundle-layout';

/** Prepared (normalised, imputed) values, one row per sample in the order of `elements`. */
export interface PreparedSamples {
  readonly elements: readonly string[];
  readonly samples: readonly { sampleId: string; role: SampleRole; group: string | null; values: number[] }[];
}

export interface ComputedAssignment {
  readonly sampleId: string;
  readonly verdict: AssignmentVerdict;
  readonly group: string;
  readonly probability: number;
  readonly runnerUp: string | null;
  readonly runnerUpProbability: number | null;
}

export interface RecomputedRun {
  /** Per sample (order of the input), per element: the transformed coordinate, null where there is none. */
  readonly transformed: (number | null)[][];
  readonly groups: Omit<GroupContent, 'version'>[];
  readonly distances: DistanceRow[];
  readonly assignments: ComputedAssignment[];
  readonly contributions: ContributionRow[];
  readonly members: MemberRow[];
  readonly separation: SeparationRow[];
}

/** Which transformed coordinate belongs to which element: alr drops its denominator, the pivot coordinates the last part. */
function coordinateOfElement(elements: readonly string[], spec: TransformSpec): (number | null)[] {
  if (spec.transform === 'alr') {
    const denominator = elements.indexOf(spec.alrDenominator ?? elements[elements.length - 1]);
    return elements.map((_, j) => (j === denominator ? null : j < denominator ? j : j - 1));
  }
  if (spec.transform === 'ilr') return elements.map((_, j) => (j < elements.length - 1 ? j : null));
  return elements.map((_, j) => j);
}

const ID = 'sample_id';
const GROUP = 'group';

/** The prepared values as the command-line tool's in-memory tables; String() keeps every double exact. */
function tables(prepared: PreparedSamples): { reference: Table; unknowns: Table | null } {
  const reference = prepared.samples.filter((s) => s.role === 'reference');
  const unknowns = prepared.samples.filter((s) => s.role === 'unknown');
  const table = (label: string, header: string[], rows: string[][]): Table => ({
    file: `${PREPARED_PATH} (${label})`,
    header,
    rows,
    sha256: '',
  });
  return {
    reference: table(
      'reference samples',
      [ID, GROUP, ...prepared.elements],
      reference.map((s) => [s.sampleId, s.group ?? '', ...s.values.map(String)]),
    ),
    unknowns:
      unknowns.length === 0
        ? null
        : table(
            'unknown samples',
            [ID, ...prepared.elements],
            unknowns.map((s) => [s.sampleId, ...s.values.map(String)]),
          ),
  };
}

/**
 * Each unknown's per-coordinate contributions to D² to its best group, from the unknowns' features as
 * the command-line tool prepares them and the engine's sequential decomposition.
 */
function contributionsToBest(
  unknowns: Table,
  elements: readonly string[],
  options: ClassifyOptions,
  models: readonly GroupModel[],
  assignments: readonly (string | number | null)[][],
): ContributionRow[] {
  const features = prepareFeatures(loadSamples(unknowns, elements, ID, null), options);
  const byName = new Map(models.map((model) => [model.name, model]));
  return assignments.flatMap(([sampleId, , group], i) => {
    const model = byName.get(group as string);
    if (!model) throw new Error(`the best group "${String(group)}" of ${String(sampleId)} was not fitted`);
    return distanceContributions(model, features.values[i]).map((contribution, j) => ({
      sampleId: sampleId as string,
      group: model.name,
      variable: features.variables[j],
      contribution,
    }));
  });
}

/**
 * A run's results from its prepared data and parameters through the command-line tool's own classify
 * and check paths, so a bundle is judged by exactly the computation anyone can run on CSV files. The
 * values are already imputed, so the tool's below-detection step has nothing left to replace.
 */
export function recomputeRun(prepared: PreparedSamples, parameters: AssignmentParameters, seed: number): RecomputedRun {
  const spec: TransformSpec = { transform: parameters.transform, alrDenominator: parameters.alrDenominator };
  const transformedData = applyTransform(
    prepared.samples.map((sample) => sample.values),
    prepared.elements,
    spec,
  );
  const coordinate = coordinateOfElement(prepared.elements, spec);
  const transformed = transformedData.values.map((row) => coordinate.map((k) => (k === null ? null : row[k])));

  const { reference, unknowns } = tables(prepared);
  const options: ClassifyOptions = {
    reference: reference.file,
    unknowns: unknowns?.file ?? '',
    out: '',
    idColumn: ID,
    groupColumn: GROUP,
    elements: [...prepared.elements],
    transform: parameters.transform,
    alrDenominator: parameters.alrDenominator ?? null,
    covariance: parameters.covariance,
    probability: parameters.probability,
    alpha: parameters.alpha,
    seed,
    belowLimit: parameters.belowDetection,
    closure: 1e6,
  };
  const samples = loadSamples(reference, prepared.elements, ID, GROUP);
  const features = prepareFeatures(samples, options);
  const fit = fitReference(samples, features, options);
  const groups = fit.models.map((model, k): Omit<GroupContent, 'version'> => ({
    name: model.name,
    n: model.n,
    effectiveN: model.effectiveN,
    method: model.method,
    members: fit.memberRows[k].map((i) => samples.ids[i]),
    variables: features.variables,
    mean: model.mean,
    covariance: model.covariance,
    robust: model.mcd && {
      seed: model.mcd.seed,
      h: model.mcd.h,
      consistencyFactor: model.mcd.consistencyFactor,
      cutoff: model.mcd.cutoff,
      distances: model.mcd.distances,
      support: model.mcd.support,
    },
  }));

  const classified = unknowns ? classifyTables(reference, unknowns, options) : { distances: [], assignments: [] };
  const contributions = unknowns
    ? contributionsToBest(unknowns, prepared.elements, options, fit.models, classified.assignments)
    : [];
  const checked = checkTable(reference, options);
  const text = (cell: string | number | null) => cell as string;
  const number = (cell: string | number | null) => cell as number;
  return {
    transformed,
    groups,
    distances: classified.distances.map(([sampleId, group, d2, pChi2, pHotelling]) => ({
      sampleId: text(sampleId),
      group: text(group),
      d2: number(d2),
      pChi2: number(pChi2),
      pHotelling: number(pHotelling),
    })),
    assignments: classified.assignments.map(
      ([sampleId, verdict, group, probability, runnerUp, runnerUpProbability]) => ({
        sampleId: text(sampleId),
        verdict: text(verdict) as AssignmentVerdict,
        group: text(group),
        probability: number(probability),
        runnerUp: runnerUp === null ? null : text(runnerUp),
        runnerUpProbability: runnerUpProbability === null ? null : number(runnerUpProbability),
      }),
    ),
    contributions,
    members: checked.members.map(([sampleId, group, d2, d2Loo, pHotellingLoo, verdictLoo]) => ({
      sampleId: text(sampleId),
      group: text(group),
      d2: number(d2),
      d2Loo: number(d2Loo),
      pHotellingLoo: number(pHotellingLoo),
      verdictLoo: text(verdictLoo),
    })),
    separation: checked.separation.map(([groupA, groupB, t2, f, df1, df2, p]) => ({
      groupA: text(groupA),
      groupB: text(groupB),
      t2: number(t2),
      f: number(f),
      df1: number(df1),
      df2: number(df2),
      p: number(p),
    })),
  };
}
