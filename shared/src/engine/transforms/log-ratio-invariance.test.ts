import { Matrix as MlMatrix, pseudoInverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { squaredDistance } from '../linalg/cholesky';
import { mulberry32 } from '../random/mulberry32';
import { fastMcd } from '../stats/fast-mcd';
import { fitGroup } from '../stats/group-model';
import { columnMeans, covariance } from '../stats/moments';
import { applyTransform, toDistanceCoordinates, type TransformSpec } from './apply-transform';

// Identity from Aitchison (1986) and Egozcue et al. (2003), stated in METHODS.md §3: classical D² is
// the same under alr (any denominator), clr (pseudo-inverse) and ilr; robust MCD distances are the
// same under alr and ilr (affine equivariance).
const parts = ['Si', 'Al', 'Fe', 'Ca', 'K'];
const random = mulberry32(31);
const compositions = Array.from({ length: 40 }, () => {
  const raw = parts.map((_, j) => Math.exp(random.normal() * (0.3 + j / 10) + j));
  const total = raw.reduce((s, v) => s + v, 0);
  return raw.map((v) => (100 * v) / total);
});
const unknown = [[20, 5, 30, 40, 5]];

function d2Under(spec: TransformSpec): number[] {
  const reference = toDistanceCoordinates(applyTransform(compositions, parts, spec), spec);
  const sample = toDistanceCoordinates(applyTransform([...unknown, ...compositions.slice(0, 3)], parts, spec), spec);
  const model = fitGroup('g', reference.values, reference.variables);
  return sample.values.map((x) => squaredDistance(model.cholesky.lower, x, model.mean));
}

describe('D² invariance under log-ratio transforms', () => {
  const ilr = d2Under({ transform: 'ilr' });

  it.each(parts)('alr with denominator %s gives the ilr D² to 1e-10', (denominator) => {
    d2Under({ transform: 'alr', alrDenominator: denominator }).forEach((value, i) =>
      expect(Math.abs(value - ilr[i]) / ilr[i]).toBeLessThan(1e-10),
    );
  });

  it('clr through the pivot basis gives the ilr D² and the pseudo-inverse D² (ml-matrix) to 1e-10', () => {
    const clrD2 = d2Under({ transform: 'clr' });
    clrD2.forEach((value, i) => expect(Math.abs(value - ilr[i]) / ilr[i]).toBeLessThan(1e-10));
    // Independent path: the Moore–Penrose pseudo-inverse of the singular clr covariance.
    const clr = applyTransform(compositions, parts, { transform: 'clr' }).values;
    const mean = columnMeans(clr);
    const pinv = pseudoInverse(new MlMatrix(covariance(clr, mean)));
    const samples = applyTransform([...unknown, ...compositions.slice(0, 3)], parts, { transform: 'clr' }).values;
    samples.forEach((x, i) => {
      const r = MlMatrix.columnVector(x.map((v, j) => v - mean[j]));
      const viaPinv = r.transpose().mmul(pinv).mmul(r).get(0, 0);
      expect(Math.abs(viaPinv - ilr[i]) / ilr[i]).toBeLessThan(1e-10);
    });
  });

  it('the untransformed closed data are refused as singular, naming the closure', () => {
    expect(() => d2Under({ transform: 'none' })).toThrow(/closed composition/);
  });

  it('MCD distances are the same under alr and ilr', () => {
    const context = { group: 'g', variables: ['z1', 'z2', 'z3', 'z4'] };
    const a = fastMcd(applyTransform(compositions, parts, { transform: 'alr', alrDenominator: 'Fe' }).values, {
      seed: 4,
      context,
    });
    const b = fastMcd(applyTransform(compositions, parts, { transform: 'ilr' }).values, { seed: 4, context });
    a.distances.forEach((value, i) => expect(Math.abs(value - b.distances[i]) / b.distances[i]).toBeLessThan(1e-8));
  });
});
