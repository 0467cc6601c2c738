import { PROBABILITY_MAP_ROW_LIMIT, type AssignmentsPage, type ProbabilityMap } from '@provenote/shared';
import { createLabWithMembers, type SignedInMember } from '../../test/auth-helpers';
import { classifyRequest } from '../../test/run-fixtures';
import { waitForRun } from '../../test/run-waits';
import { createTestApp, type TestApp } from '../../test/test-app';

describe('the probability heat map of a whole assign run', () => {
  let testApp: TestApp;
  let labId: string;
  let members: Record<'pi' | 'analyst' | 'student' | 'guest', SignedInMember>;
  let otherLab: Awaited<ReturnType<typeof createLabWithMembers>>;
  const url = (lab: string, runId: string) => `/api/labs/${lab}/runs/${runId}/probability-map`;

  beforeAll(async () => {
    testApp = await createTestApp();
    ({ labId, members } = await createLabWithMembers(testApp));
    otherLab = await createLabWithMembers(testApp, ['analyst'] as const);
  }, 60_000);
  afterAll(() => testApp.close());

  async function classified(unknowns: number): Promise<string> {
    const res = await members.analyst.agent.post(`/api/labs/${labId}/runs`).send(classifyRequest(unknowns)).expect(201);
    await waitForRun(testApp, res.body.id, (r) => r.status === 'succeeded');
    return res.body.id as string;
  }

  it('thins a large run to evenly spaced rows ordered by best group, with the run’s own probabilities', async () => {
    const unknowns = 1000;
    const runId = await classified(unknowns);
    const map: ProbabilityMap = (await members.guest.agent.get(url(labId, runId)).expect(200)).body;
    const stride = Math.ceil(unknowns / PROBABILITY_MAP_ROW_LIMIT);
    expect(map).toMatchObject({ runId, total: unknowns, stride });
    expect(map.rows).toHaveLength(Math.ceil(unknowns / stride));
    expect(map.groups).toHaveLength(3);

    const groupIndex = map.rows.map((r) => map.groups.indexOf(r.group));
    expect(groupIndex).toEqual([...groupIndex].sort((a, b) => a - b));
    expect(new Set(map.rows.map((r) => r.group)).size).toBe(3);

    // Every drawn row is the sample as the results table has it.
    const page: AssignmentsPage = (
      await members.guest.agent.get(`/api/labs/${labId}/runs/${runId}/assignments?pageSize=200`).expect(200)
    ).body;
    const drawn = new Map(map.rows.map((r) => [r.sampleId, r]));
    const shared = page.rows.filter((r) => drawn.has(r.sampleId));
    expect(shared.length).toBeGreaterThan(0);
    for (const row of shared) {
      expect(drawn.get(row.sampleId)).toEqual({
        sampleId: row.sampleId,
        group: row.group,
        verdict: row.verdict,
        pChi2: row.pChi2,
        pHotelling: row.pHotelling,
      });
    }
  }, 60_000);

  it('draws every unknown of a small run and hides runs of other labs', async () => {
    const runId = await classified(12);
    const map: ProbabilityMap = (await members.student.agent.get(url(labId, runId)).expect(200)).body;
    expect(map.stride).toBe(1);
    expect(new Set(map.rows.map((r) => r.sampleId)).size).toBe(12);
    await otherLab.members.analyst.agent.get(url(otherLab.labId, runId)).expect(404);
    // An outsider learns nothing of the lab, as on every lab route.
    await otherLab.members.analyst.agent.get(url(labId, runId)).expect(404);
  }, 60_000);
});
