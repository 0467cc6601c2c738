import { checkResultsSchema } from '@provenote/shared';
import { robustCutoff } from '@provenote/workers';
import { createLabWithMembers, type SignedInMember } from '../../test/auth-helpers';
import { signedOffStudy } from '../../test/signed-off-study';
import { createTestApp, type TestApp } from '../../test/test-app';

/** χ²_3 upper 2.5 % point, 9.348 (NIST/SEMATECH e-Handbook, table 1.3.6.7.4). */
const CHI2_3_0975 = 9.348;

describe('group check results: the robust fit per member (HTTP, PostgreSQL, queue)', () => {
  let testApp: TestApp;
  let labId: string;
  let members: Record<'pi' | 'analyst', SignedInMember>;
  let url: string;

  beforeAll(async () => {
    testApp = await createTestApp();
    ({ labId, members } = await createLabWithMembers(testApp, ['pi', 'analyst'] as const));
    const { studyId } = await signedOffStudy(testApp, labId, members.analyst.agent, members.pi.agent);
    url = `/api/labs/${labId}/studies/${studyId}/check-results`;
  }, 120_000);
  afterAll(() => testApp.close());

  const get = async (query: string) =>
    checkResultsSchema.parse((await members.analyst.agent.get(`${url}?pageSize=200${query}`).expect(200)).body);

  it('stores a robust D² and flag for every member of groups large enough, with the seed and cut-off', async () => {
    const all = await get('');
    expect(all.robustFit.map((r) => r.group).sort()).toEqual(['East', 'North', 'South']);
    for (const fit of all.robustFit) {
      expect(fit.seed).toBe(5);
      expect(fit.note).toBeNull();
      // 12 members on 3 coordinates: the simulated point lies well beyond χ²_3's.
      expect(fit.cutoff).toBe(robustCutoff(12, 3, 5));
      expect(fit.cutoff!).toBeGreaterThan(CHI2_3_0975);
    }
    expect(all.members.rows).toHaveLength(36);
    for (const row of all.members.rows) {
      expect(row.robustD2).toEqual(expect.any(Number));
      expect(row.flaggedByRobustFit).toBe(row.robustD2! > all.robustFit[0].cutoff!);
    }
    const flaggedCount = all.robustFit.reduce((sum, r) => sum + r.flagged!, 0);
    expect(all.members.rows.filter((r) => r.flaggedByRobustFit)).toHaveLength(flaggedCount);
  });

  it('filters the members by the robust flag', async () => {
    const all = await get('');
    const flagged = await get('&flaggedByRobustFit=true');
    const clean = await get('&flaggedByRobustFit=false');
    // With 12 members on 3 coordinates the reweighting flags some members of this seeded data.
    expect(flagged.members.total).toBeGreaterThan(0);
    expect(flagged.members.rows.every((r) => r.flaggedByRobustFit === true)).toBe(true);
    expect(clean.members.rows.every((r) => r.flaggedByRobustFit === false)).toBe(true);
    expect(flagged.members.total + clean.members.total).toBe(all.members.total);
    await members.analyst.agent.get(`${url}?flaggedByRobustFit=perhaps`).expect(400);
  });
});
