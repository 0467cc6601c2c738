import { DataSource } from 'typeorm';
import { createLab } from '../../test/auth-helpers';
import { createTestApp, type TestApp } from '../../test/test-app';
import { type AssignmentResults, insertAssignments, rowSlices } from './insert-assignments';

/** Three unknowns against two groups on two variables; the last has no runner-up and a D² beyond any float. */
const RESULTS: AssignmentResults = {
  groups: [
    { name: 'north-pit', n: 20, effectiveN: 20 },
    { name: 'upland', n: 18, effectiveN: 18 },
  ],
  variables: ['ln(Zr)', 'ln(Rb)'],
  sampleIds: ['U-1', 'U-2 "odd"\tid', 'U-3'],
  verdicts: ['assigned', 'ambiguous', 'unassigned'],
  bestGroups: ['north-pit', 'upland', 'north-pit'],
  probabilities: Float64Array.from([0.93, 0.51, 1e-300]),
  runnerUps: ['upland', 'north-pit', null],
  runnerUpProbabilities: [0.04, 0.47, null],
  d2: Float64Array.from([1.25, 30.5, 2.5, 2.75, 1e300, Infinity]),
  pChi2: Float64Array.from([0.5, 1e-7, 0.25, 0.2, 0, 0]),
  pHotelling: Float64Array.from([0.45, 1e-6, 0.3, 0.25, 0, 0]),
  contributions: Float64Array.from([0.75, 0.5, -0.125, 2.625, 6e299, 4e299]),
};

describe('assignments written with binary COPY', () => {
  let testApp: TestApp;
  let dataSource: DataSource;

  beforeAll(async () => {
    testApp = await createTestApp();
    dataSource = testApp.app.get(DataSource);
  });
  afterAll(() => testApp.close());

  it('stores every field of every unknown, in order, across slices', async () => {
    const labId = await createLab(testApp);
    const [{ id: runId }]: { id: string }[] = await dataSource.query(
      `INSERT INTO runs (lab_id, kind, parameters) VALUES ($1, 'classify', '{}') RETURNING id`,
      [labId],
    );
    await dataSource.transaction(async (manager) => {
      for (const [from, to] of rowSlices(RESULTS.sampleIds.length, 2))
        await insertAssignments(manager, runId, RESULTS, from, to);
    });
    const rows = await dataSource.query(
      `SELECT ordinal, sample_id, verdict, group_name, probability, runner_up, runner_up_probability, d2, p_chi2,
         p_hotelling, contributions FROM run_assignments WHERE run_id = $1 ORDER BY ordinal`,
      [runId],
    );
    expect(rows).toEqual(
      RESULTS.sampleIds.map((sampleId, i) => ({
        ordinal: i,
        sample_id: sampleId,
        verdict: RESULTS.verdicts[i],
        group_name: RESULTS.bestGroups[i],
        probability: RESULTS.probabilities[i],
        runner_up: RESULTS.runnerUps[i],
        runner_up_probability: RESULTS.runnerUpProbabilities[i],
        d2: Array.from(RESULTS.d2.subarray(2 * i, 2 * i + 2)),
        p_chi2: Array.from(RESULTS.pChi2.subarray(2 * i, 2 * i + 2)),
        p_hotelling: Array.from(RESULTS.pHotelling.subarray(2 * i, 2 * i + 2)),
        contributions: Array.from(RESULTS.contributions.subarray(2 * i, 2 * i + 2)),
      })),
    );
  });
});
