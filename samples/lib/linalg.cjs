'use strict';
/** The little linear algebra the generator needs: a correlation matrix from factor loadings and its Cholesky factor. */

/**
 * R = ΛΛᵀ + Ψ with Ψ = diag(1 − Σⱼ λᵢⱼ²): a factor-model correlation matrix. It is positive definite whenever
 * every communality Σⱼ λᵢⱼ² stays below 1, which is what makes it a safe way to write down realistic
 * correlations by hand.
 */
function factorCorrelation(loadings) {
  const p = loadings.length;
  const communality = loadings.map((row) => row.reduce((sum, l) => sum + l * l, 0));
  communality.forEach((c, i) => {
    if (!(c < 1)) throw new Error(`variable ${i + 1}: communality ${c.toFixed(3)} must stay below 1`);
  });
  const r = [];
  for (let i = 0; i < p; i += 1) {
    r.push([]);
    for (let j = 0; j < p; j += 1) {
      r[i].push(i === j ? 1 : loadings[i].reduce((sum, l, k) => sum + l * loadings[j][k], 0));
    }
  }
  return r;
}

/** Lower-triangular L with L·Lᵀ = A (Cholesky–Banachiewicz). Throws when A is not positive definite. */
function cholesky(a) {
  const n = a.length;
  const l = a.map(() => new Array(n).fill(0));
  for (let i = 0; i < n; i += 1) {
    for (let j = 0; j <= i; j += 1) {
      let sum = a[i][j];
      for (let k = 0; k < j; k += 1) sum -= l[i][k] * l[j][k];
      if (i === j) {
        if (!(sum > 0)) throw new Error(`matrix is not positive definite (pivot ${i + 1} is ${sum})`);
        l[i][i] = Math.sqrt(sum);
      } else {
        l[i][j] = sum / l[j][j];
      }
    }
  }
  return l;
}

/** y = L·z for a lower-triangular L. */
function lowerTimes(l, z) {
  return l.map((row, i) => {
    let sum = 0;
    for (let k = 0; k <= i; k += 1) sum += row[k] * z[k];
    return sum;
  });
}

module.exports = { factorCorrelation, cholesky, lowerTimes };
