import {
  canonicalVariates,
  confidenceEllipse,
  EngineError,
  InvalidInputError,
  PROJECTION_LEVELS,
  PROJECTION_UNKNOWNS_LIMIT,
  principalComponents,
  projectGroup,
  type AssignmentParameters,
  type AssignmentVerdict,
  type GroupModel,
  type ProjectionMethod,
  type StoredProjection,
  type TransformedData,
} from '@provenote/shared';

export interface ProjectionInputs {
  readonly parameters: AssignmentParameters;
  /** Fitted groups in run order, with the rows they were fitted on. */
  readonly groups: readonly { model: GroupModel; rows: number[][]; sampleIds: string[] }[];
  readonly unknowns: TransformedData;
  readonly unknownIds: readonly string[];
  readonly verdicts: readonly string[];
  readonly bestGroups: readonly string[];
}

/** A linear 2-D map y = A·(x − origin); the axes are the rows of A. */
interface Plane {
  readonly axes: [number[], number[]];
  readonly origin: number[];
  readonly shares: [number, number];
}

const project = (plane: Plane, row: readonly number[]): [number, number] => {
  const centred = row.map((value, j) => value - plane.origin[j]);
  const dot = (axis: number[]) => axis.reduce((s, w, j) => s + w * centred[j], 0);
  return [dot(plane.axes[0]), dot(plane.axes[1])];
};

/**
 * Principal components of all reference samples. Raw ppm of different elements differ by orders of
 * magnitude, so untransformed data use the correlation matrix; log and log-ratio coordinates are on one
 * scale and keep the covariance matrix.
 */
function pcaPlane(rows: number[][], parameters: AssignmentParameters): Plane & { basis: 'covariance' | 'correlation' } {
  const basis = parameters.transform === 'none' ? 'correlation' : 'covariance';
  const pca = principalComponents(rows, basis);
  const axis = (c: number) => pca.loadings[c].map((w, j) => w / pca.scale[j]);
  return {
    basis,
    axes: [axis(0), axis(1)],
    origin: pca.centre,
    shares: [pca.explainedVarianceRatio[0], pca.explainedVarianceRatio[1]],
  };
}

/** Canonical variates from W⁻¹B, centred on the grand mean of the reference samples. */
function cvPlane(groups: ProjectionInputs['groups'], variables: readonly string[]): Plane {
  if (groups.length < 3) {
    throw new InvalidInputError(
      `canonical variates of ${groups.length} group(s) give at most ${groups.length - 1} axis; a plane needs three or more groups`,
    );
  }
  const cv = canonicalVariates(
    groups.map((g) => g.rows),
    variables,
  );
  const all = groups.flatMap((g) => g.rows);
  const origin = variables.map((_, j) => all.reduce((s, row) => s + row[j], 0) / all.length);
  return {
    axes: [cv.coefficients[0], cv.coefficients[1]],
    origin,
    shares: [cv.proportionOfTrace[0], cv.proportionOfTrace[1]],
  };
}

/**
 * A group's ellipse from its fitted model (the mean and covariance its distances use, robust under
 * MCD), at every stored level. The basis follows the run's probability: F for Hotelling, χ² otherwise.
 */
function groupEllipses(plane: Plane, model: GroupModel, ellipseBasis: 'chi2' | 'f') {
  const centred = model.mean.map((value, j) => value - plane.origin[j]);
  const projected = projectGroup(centred, model.covariance, plane.axes);
  const base = { name: model.name, n: model.n, effectiveN: model.effectiveN, ...projected };
  try {
    const ellipses = Object.fromEntries(
      PROJECTION_LEVELS.map((level) => {
        const { x, y } = confidenceEllipse(projected, { level, basis: ellipseBasis, n: model.effectiveN, points: 72 });
        return [String(level), { x, y }];
      }),
    );
    return { ...base, ellipses, ellipseNote: null };
  } catch (error) {
    if (!(error instanceof EngineError)) throw error;
    return { ...base, ellipses: null, ellipseNote: error.message };
  }
}

function projectOnto(
  inputs: ProjectionInputs,
  plane: Plane,
  labels: [string, string],
  basis: StoredProjection['basis'],
): StoredProjection {
  const ellipseBasis = inputs.parameters.probability === 'hotelling' ? 'f' : 'chi2';
  const kept = Math.min(inputs.unknownIds.length, PROJECTION_UNKNOWNS_LIMIT);
  return {
    unavailable: null,
    basis,
    ellipseBasis,
    axes: labels.map((label, c) => ({ label, share: plane.shares[c] })),
    reference: inputs.groups.flatMap((g) =>
      g.rows.map((row, i) => {
        const [x, y] = project(plane, row);
        return { sampleId: g.sampleIds[i], group: g.model.name, x, y };
      }),
    ),
    unknowns: Array.from({ length: kept }, (_, i) => {
      const [x, y] = project(plane, inputs.unknowns.values[i]);
      return {
        sampleId: inputs.unknownIds[i],
        verdict: inputs.verdicts[i] as AssignmentVerdict,
        group: inputs.bestGroups[i],
        x,
        y,
      };
    }),
    unknownTotal: inputs.unknownIds.length,
    groups: inputs.groups.map((g) => groupEllipses(plane, g.model, ellipseBasis)),
  };
}

const unavailable = (reason: string, inputs: ProjectionInputs): StoredProjection => ({
  unavailable: reason,
  basis: null,
  ellipseBasis: inputs.parameters.probability === 'hotelling' ? 'f' : 'chi2',
  axes: [],
  reference: [],
  unknowns: [],
  unknownTotal: inputs.unknownIds.length,
  groups: [],
});

/**
 * Both projections of a classify run's prepared data. A method the data do not allow (one variable,
 * two groups for canonical variates) is stored with the engine's reason instead of failing the run:
 * the plot is a view of the assignment, not a condition for it.
 */
export function computeProjections(inputs: ProjectionInputs): Record<ProjectionMethod, StoredProjection> {
  const variables = inputs.unknowns.variables;
  const attempt = (build: () => StoredProjection): StoredProjection => {
    if (variables.length < 2) return unavailable('a plane needs at least two variables', inputs);
    try {
      return build();
    } catch (error) {
      if (error instanceof EngineError) return unavailable(error.message, inputs);
      throw error;
    }
  };
  return {
    pca: attempt(() => {
      const plane = pcaPlane(
        inputs.groups.flatMap((g) => g.rows),
        inputs.parameters,
      );
      return projectOnto(inputs, plane, ['PC1', 'PC2'], plane.basis);
    }),
    cv: attempt(() => projectOnto(inputs, cvPlane(inputs.groups, variables), ['CV1', 'CV2'], null)),
  };
}
