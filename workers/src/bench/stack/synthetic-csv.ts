import { mulberry32 } from '@provenote/shared';

/** Thirty trace and major elements, reported in ppm (an invented, synthetic lab file). */
export const BENCH_ELEMENTS =
  'Na Mg Al K Ca Sc Ti V Cr Mn Fe Co Ni Cu Zn Ga Rb Sr Y Zr Nb Cs Ba La Ce Nd Sm Hf Th U'.split(' ');
export const BENCH_GROUPS = 8;

/** Log-scale group centres: every group differs from the others on every element. */
function groupCentres(seed: number): number[][] {
  const random = mulberry32(seed);
  return Array.from({ length: BENCH_GROUPS }, () =>
    BENCH_ELEMENTS.map((_, j) => Math.log(5 + 40 * j) + 0.5 * random.normal()),
  );
}

function row(random: ReturnType<typeof mulberry32>, centre: number[], spread: number): string {
  const common = random.normal();
  return centre.map((c) => Math.exp(c + spread * (0.7 * random.normal() + 0.3 * common)).toFixed(3)).join(',');
}

/**
 * A seeded reference file: `perGroup` members of each of eight groups (source-1 … source-8), with a Group
 * column the product builds reference groups from.
 */
export function referenceCsv(perGroup: number, seed = 101): Buffer {
  const centres = groupCentres(seed);
  const random = mulberry32(seed + 1);
  const lines = [`Sample,Group,${BENCH_ELEMENTS.map((e) => `${e} ppm`).join(',')}`];
  for (let k = 0; k < BENCH_GROUPS; k++) {
    for (let i = 1; i <= perGroup; i++) lines.push(`R${k + 1}-${i},source-${k + 1},${row(random, centres[k], 0.15)}`);
  }
  return Buffer.from(`${lines.join('\n')}\n`);
}

/** A seeded file of `rows` unknowns, each drawn around one of the same eight centres, a little wider. */
export function unknownsCsv(rows: number, seed = 101): Buffer {
  const centres = groupCentres(seed);
  const random = mulberry32(seed + 2);
  const lines = [`Sample,${BENCH_ELEMENTS.map((e) => `${e} ppm`).join(',')}`];
  for (let i = 1; i <= rows; i++) {
    lines.push(`U${String(i).padStart(6, '0')},${row(random, centres[random.int(BENCH_GROUPS)], 0.2)}`);
  }
  return Buffer.from(`${lines.join('\n')}\n`);
}
