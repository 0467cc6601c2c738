'use strict';
/**
 * Seeded random numbers for the demo scenario. mulberry32 (Tommy Ettinger, 2017; public domain) and the
 * Box–Muller transform (Box & Muller 1958). Kept here in plain Node, not imported from the engine, so the
 * sample files can be regenerated without building any workspace.
 */

function mulberry32(seed) {
  let state = seed >>> 0;
  let spareNormal = null;
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = () => {
    if (spareNormal !== null) {
      const z = spareNormal;
      spareNormal = null;
      return z;
    }
    // 1 − u keeps the logarithm finite: next() can return 0 but never 1.
    const radius = Math.sqrt(-2 * Math.log(1 - next()));
    const angle = 2 * Math.PI * next();
    spareNormal = radius * Math.sin(angle);
    return radius * Math.cos(angle);
  };
  return {
    next,
    normal,
    uniform: (low, high) => low + (high - low) * next(),
    int: (n) => Math.floor(next() * n),
    /** Index drawn with probability proportional to weights[i]. */
    weighted: (weights) => {
      const total = weights.reduce((sum, w) => sum + w, 0);
      let u = next() * total;
      for (let i = 0; i < weights.length; i += 1) {
        u -= weights[i];
        if (u < 0) return i;
      }
      return weights.length - 1;
    },
  };
}

module.exports = { mulberry32 };
