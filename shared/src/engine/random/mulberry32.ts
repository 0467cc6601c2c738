/**
 * Seeded pseudo-random numbers. mulberry32 (Tommy Ettinger, 2017; public domain): a 32-bit state,
 * period 2³², fast and well tested for simulation-sized streams. Our own implementation so a seed gives
 * the same stream on every platform and release.
 */
export interface RandomSource {
  /** Uniform on [0, 1). */
  next(): number;
  /** Standard normal (Box–Muller transform, Box & Muller 1958). */
  normal(): number;
  /** Uniform integer on [0, n). */
  int(n: number): number;
}

export function mulberry32(seed: number): RandomSource {
  let state = seed >>> 0;
  let spareNormal: number | null = null;
  const next = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    next,
    int: (n) => Math.floor(next() * n),
    normal: () => {
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
    },
  };
}
