import { InvalidInputError } from '../errors/engine-errors';
import { assertFiniteMatrix, type Matrix } from '../linalg/matrix';
import { columnMeans, covariance } from '../stats/moments';
import { symmetricEigen } from './symmetric-eigen';

export interface PrincipalComponents {
  readonly centre: number[];
  /** Column scales: 1 for 'covariance', the standard deviations for 'correlation'. */
  readonly scale: number[];
  /** Variances of the components (eigenvalues), largest first. */
  readonly variances: number[];
  readonly explainedVarianceRatio: number[];
  /** loadings[c] is the unit vector of component c over the variables. */
  readonly loadings: number[][];
  /** scores[i][c]: row i on component c. */
  readonly scores: number[][];
}

/**
 * Principal components (Pearson 1901; Hotelling 1933) of the (transformed) data from the eigenvectors
 * of the covariance matrix, or of the correlation matrix when variables have different units. A
 * constant variable is refused for 'correlation' (its standard deviation is 0).
 */
export function principalComponents(
  rows: Matrix,
  basis: 'covariance' | 'correlation' = 'covariance',
): PrincipalComponents {
  const p = assertFiniteMatrix(rows, 'PCA input');
  if (rows.length < 2) throw new InvalidInputError('PCA needs at least two rows');
  const centre = columnMeans(rows);
  const cov = covariance(rows, centre);
  const scale = cov.map((row, j) => (basis === 'correlation' ? Math.sqrt(row[j]) : 1));
  scale.forEach((s, j) => {
    if (!(s > 0)) throw new InvalidInputError(`variable ${j + 1} is constant: its correlations are undefined`);
  });
  const matrix = cov.map((row, j) => row.map((value, k) => value / (scale[j] * scale[k])));
  const { values, vectors } = symmetricEigen(matrix);
  const variances = values.map((v) => Math.max(v, 0));
  const total = variances.reduce((s, v) => s + v, 0);
  const scores = rows.map((row) => {
    const standardised = row.map((value, j) => (value - centre[j]) / scale[j]);
    return vectors.map((vector) => vector.reduce((s, w, j) => s + w * standardised[j], 0));
  });
  return {
    centre,
    scale,
    variances,
    explainedVarianceRatio: variances.map((v) => v / total),
    loadings: vectors.slice(0, p),
    scores,
  };
}
