import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import type { ReferenceGroupList, Study, StudyList } from '@provenote/shared';
import { signIn } from '../../test/auth-helpers';
import { createTestApp, type TestApp } from '../../test/test-app';
import { RunAssignmentEntity } from '../runs/run-assignment.entity';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo-accounts';
import { loadDemoScenario, type DemoScenarioResult } from './demo-scenario';
import { DEMO_OVERRIDE_REASON, FRESH_STUDY, REVIEWED_STUDY } from './demo-study-settings';
import { seedDemo } from './seed-demo';

const truth = readFileSync(join(__dirname, '../../../samples/data/truth.csv'), 'utf8')
  .trim()
  .split('\n')
  .slice(1)
  .map((line) => {
    const [sampleId, , origin, mainSource] = line.split(',');
    return { sampleId, origin, mainSource };
  });

describe('the demo lab (Lake Tarn, synthetic)', () => {
  let testApp: TestApp;
  let labId: string;
  let loaded: DemoScenarioResult;
  let studies: StudyList['studies'];

  beforeAll(async () => {
    testApp = await createTestApp({ MAIL_MODE: 'embedded' });
    await seedDemo(testApp.app.get(DataSource));
    loaded = await loadDemoScenario(testApp.app);
    const analyst = await signIn(testApp, DEMO_ACCOUNTS[1].email, DEMO_PASSWORD);
    labId = (await analyst.get('/api/me').expect(200)).body.memberships[0].labId;
    studies = (await analyst.get(`/api/labs/${labId}/studies`).expect(200)).body.studies;
  }, 120_000);
  afterAll(() => testApp.close());

  const pi = () => signIn(testApp, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);

  it('has the five source areas as approved groups built from the group column (samples/README.md sizes)', async () => {
    const { groups }: ReferenceGroupList = (await (await pi()).get(`/api/labs/${labId}/groups`).expect(200)).body;
    const sizes = Object.fromEntries(groups.map((g) => [g.name, g.versions[0].memberIds.length]));
    expect(sizes).toEqual({
      'Basalt plateau': 34,
      'Glacial till': 38,
      'Granite uplands': 42,
      'Limestone karst': 16,
      'Schist valley': 48,
    });
    expect(groups.every((g) => g.versions[0].source === 'column' && g.versions[0].approvedBy !== null)).toBe(true);
  });

  it('leaves one study computed and waiting for sign-off, with the analyst override and its reason', async () => {
    const summary = studies.find((s) => s.name === REVIEWED_STUDY.name)!;
    expect(summary).toMatchObject({ id: loaded.reviewedStudyId, status: 'ready_for_review', signedOffAt: null });
    const agent = await pi();
    const study: Study = (await agent.get(`/api/labs/${labId}/studies/${summary.id}`).expect(200)).body;
    expect(Object.fromEntries(study.steps.map((s) => [s.key, s.status]))).toMatchObject({
      check: 'current',
      assign: 'current',
    });
    const { overrides } = (await agent.get(`/api/labs/${labId}/studies/${summary.id}/overrides`).expect(200)).body;
    expect(overrides).toEqual([
      expect.objectContaining({
        sampleId: loaded.overriddenSampleId,
        computedVerdict: 'ambiguous',
        verdict: 'assigned',
        group: 'Schist valley',
        reason: DEMO_OVERRIDE_REASON,
      }),
    ]);
  });

  it('finds the unmapped tephra slices fitting no group, as the outside check in samples/README.md did', async () => {
    const study: Study = (await (await pi()).get(`/api/labs/${labId}/studies/${loaded.reviewedStudyId}`).expect(200))
      .body;
    const runId = study.steps.find((s) => s.key === 'assign')!.runId!;
    const rows = await testApp.app.get(DataSource).getRepository(RunAssignmentEntity).find({ where: { runId } });
    expect(rows).toHaveLength(120);
    const tephra = truth.filter((t) => t.origin === 'unmapped').map((t) => t.sampleId);
    expect(rows.filter((r) => tephra.includes(r.sampleId)).map((r) => r.verdict)).toEqual(Array(7).fill('unassigned'));
    // Most single-source slices fit their own source (85 of 99 fitted it alone in the outside check).
    const single = truth.filter((t) => t.origin === 'single');
    const ownOnly = single.filter((t) => {
      const row = rows.find((r) => r.sampleId === t.sampleId)!;
      return row.verdict === 'assigned' && row.groupName === t.mainSource;
    });
    expect(ownOnly.length).toBeGreaterThanOrEqual(80);
  });

  it('leaves a second study with only the Data card filled', async () => {
    const summary = studies.find((s) => s.name === FRESH_STUDY.name)!;
    expect(summary.id).toBe(loaded.freshStudyId);
    const study: Study = (await (await pi()).get(`/api/labs/${labId}/studies/${summary.id}`).expect(200)).body;
    const parameters = Object.fromEntries(study.steps.map((s) => [s.key, s.parameters]));
    expect(parameters.data).toMatchObject({
      referenceVersionId: expect.any(String),
      unknownsVersionId: expect.any(String),
    });
    expect([parameters.prepare, parameters.groups]).toEqual([null, null]);
    expect(study.steps.every((s) => s.runId === null)).toBe(true);
  });
});
