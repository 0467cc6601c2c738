import { EigenvalueDecomposition, Matrix as MlMatrix } from 'ml-matrix';
import type { Matrix } from '../linalg/matrix';

/**
 * Eigen-decomposition of a symmetric matrix (ml-matrix, the symmetric QL algorithm of the EISPACK
 * tred2/tql2 routines), eigenvalues in decreasing order. Each eigenvector's sign is fixed so that its
 * largest-magnitude entry is positive: results do not flip between runs or platforms.
 */
export function symmetricEigen(a: Matrix): { values: number[]; vectors: number[][] } {
  const decomposition = new EigenvalueDecomposition(new MlMatrix(a.map((row) => [...row])), { assumeSymmetric: true });
  const values = decomposition.realEigenvalues;
  const vectors = decomposition.eigenvectorMatrix.transpose().to2DArray();
  const order = values.map((_, i) => i).sort((i, j) => values[j] - values[i]);
  return {
    values: order.map((i) => values[i]),
    vectors: order.map((i) => {
      const v = vectors[i];
      const largest = v.reduce((best, value) => (Math.abs(value) > Math.abs(best) ? value : best), 0);
      return largest < 0 ? v.map((value) => -value) : v;
    }),
  };
}
