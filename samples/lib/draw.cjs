'use strict';
/** Draws compositions: correlated log-normal values per source, closed like a real analysis, and mixtures. */
const { factorCorrelation, cholesky, lowerTimes } = require('./linalg.cjs');
const { COLUMNS, MAJOR_OXIDES, LOADINGS, MEANS, LOG_SDS, TOTAL_RSD } = require('./scenario.cjs');

const NAMES = COLUMNS.map((column) => column.name);
const MAJOR_INDEX = MAJOR_OXIDES.map((name) => NAMES.indexOf(name));
const LOI_INDEX = NAMES.indexOf('LOI');

/** One sampler per source: the Cholesky factor of its log-scale correlation matrix, computed once. */
function makeSampler(sourceIndex, factorStrength) {
  const loadings = NAMES.map((name) => LOADINGS[name].map((l, k) => l * factorStrength[k]));
  const factor = cholesky(factorCorrelation(loadings));
  const logMean = NAMES.map((name) => Math.log(MEANS[name][sourceIndex]));
  const logSd = NAMES.map((name) => LOG_SDS[name][sourceIndex]);
  return (random) => {
    const y = lowerTimes(
      factor,
      NAMES.map(() => random.normal()),
    );
    const raw = y.map((value, j) => Math.exp(logMean[j] + logSd[j] * value));
    return closeMajors(raw, random);
  };
}

/**
 * Rescales the oxides so oxides + LOI add up to 100 % within analytical scatter. Closure keeps the oxide
 * ratios and brings in the negative correlations every real major-element table has.
 */
function closeMajors(raw, random) {
  const oxideSum = MAJOR_INDEX.reduce((sum, j) => sum + raw[j], 0);
  const total = 100 * (1 + TOTAL_RSD * random.normal());
  const scale = (total - raw[LOI_INDEX]) / oxideSum;
  if (!(scale > 0)) throw new Error(`loss on ignition ${raw[LOI_INDEX]} leaves no room for the oxides`);
  return raw.map((value, j) => (MAJOR_INDEX.includes(j) ? value * scale : value));
}

/** Mass-weighted mixture: concentrations (wt % and ppm alike) mix linearly in the mass fractions. */
function mix(parts) {
  const share = parts.reduce((sum, part) => sum + part.share, 0);
  if (Math.abs(share - 1) > 1e-12) throw new Error(`mixture shares add up to ${share}, not 1`);
  return NAMES.map((_, j) => parts.reduce((sum, part) => sum + part.share * part.values[j], 0));
}

module.exports = { makeSampler, mix };
