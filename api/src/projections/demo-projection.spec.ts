import { DataSource } from 'typeorm';
import type { Projection, Study } from '@provenote/shared';
import { signIn } from '../../test/auth-helpers';
import { createTestApp, type TestApp } from '../../test/test-app';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../demo/demo-accounts';
import { loadDemoScenario } from '../demo/demo-scenario';
import { seedDemo } from '../demo/seed-demo';

describe('the demo study’s projections (Lake Tarn, synthetic)', () => {
  let testApp: TestApp;

  beforeAll(async () => {
    testApp = await createTestApp({ MAIL_MODE: 'embedded' });
    await seedDemo(testApp.app.get(DataSource));
  }, 120_000);
  afterAll(() => testApp.close());

  it('come with the reviewed study’s assign run: both methods, every group with an ellipse', async () => {
    const loaded = await loadDemoScenario(testApp.app);
    const student = await signIn(testApp, DEMO_ACCOUNTS[2].email, DEMO_PASSWORD);
    const labId = (await student.get('/api/me').expect(200)).body.memberships[0].labId as string;
    const study: Study = (await student.get(`/api/labs/${labId}/studies/${loaded.reviewedStudyId}`).expect(200)).body;
    const runId = study.steps.find((s) => s.key === 'assign')!.runId!;
    const [{ count }] = (await testApp.app
      .get(DataSource)
      .query(`SELECT count(*)::int AS count FROM run_assignments WHERE run_id = $1`, [runId])) as { count: number }[];
    for (const method of ['pca', 'cv']) {
      const body = (await student.get(`/api/labs/${labId}/runs/${runId}/projection?method=${method}`).expect(200))
        .body as Projection;
      expect(body.unavailable).toBeNull();
      expect(body.groups).toHaveLength(5);
      expect(body.groups.every((g) => g.ellipse !== null)).toBe(true);
      expect(body.unknownTotal).toBe(count);
      expect(body.axes[0].share).toBeGreaterThanOrEqual(body.axes[1].share);
    }
  });
});
