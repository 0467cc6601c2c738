import type { FileLayout, Study } from '@provenote/shared';
import { mulberry32 } from '@provenote/shared';
import { createLabWithMembers, type Agent, type SignedInMember } from '../../test/auth-helpers';
import { waitForRun } from '../../test/run-waits';
import { createTestApp, type TestApp } from '../../test/test-app';

/** A synthetic, seeded lab file: three groups with distinct log-normal centres on three elements. */
function syntheticCsv(kind: 'reference' | 'unknowns', seed: number): { csv: string; groups: Record<string, string[]> } {
  const random = mulberry32(seed);
  const centres: Record<string, number[]> = { North: [200, 12, 30], South: [90, 25, 45], East: [140, 8, 70] };
  const groups: Record<string, string[]> = {};
  const lines = [kind === 'reference' ? 'Sample,Group,Zr ppm,Nb ppm,La ppm' : 'Sample,Zr ppm,Nb ppm,La ppm'];
  for (const [group, centre] of Object.entries(centres)) {
    groups[group] = [];
    for (let i = 1; i <= (kind === 'reference' ? 14 : 3); i++) {
      const id = `${kind === 'reference' ? group[0] : 'U'}${group[0]}${i}`;
      groups[group].push(id);
      const values = centre.map((c) => (c * Math.exp(0.12 * random.normal())).toFixed(3));
      lines.push([id, ...(kind === 'reference' ? [group] : []), ...values].join(','));
    }
  }
  return { csv: `${lines.join('\n')}\n`, groups };
}

describe('running the notebook cards on the queue (HTTP, PostgreSQL, Redis)', () => {
  let testApp: TestApp;
  let labId: string;
  let members: Record<'pi' | 'analyst' | 'student', SignedInMember>;
  const base = () => `/api/labs/${labId}`;

  async function importCsv(agent: Agent, name: string, kind: 'reference' | 'unknowns', csv: string) {
    const layout: FileLayout = (
      await agent.post(`${base()}/dataset-files`).attach('file', Buffer.from(csv), name).expect(201)
    ).body;
    const res = await agent
      .post(`${base()}/datasets`)
      .send({ name, kind, fileId: layout.file.id, mapping: layout.mapping })
      .expect(201);
    return { versionId: res.body.versions[0].id as string, datasetId: res.body.id as string };
  }

  const prepare = {
    elements: ['Zr', 'Nb', 'La'],
    transform: 'ln',
    alrDenominator: null,
    belowDetection: 'dl-half',
    covariance: 'classic',
    seed: 3,
  };

  /**
   * Imports the synthetic files, builds the three groups (as the analyst) and a study whose owner fills it;
   * a prefix keeps the group names of several studies in one lab apart.
   */
  async function studyWithGroups(owner: Agent, analyst: Agent, prefix = '') {
    const reference = syntheticCsv('reference', 20250501);
    const referenceData = await importCsv(analyst, `${prefix}reference.csv`, 'reference', reference.csv);
    const referenceVersionId = referenceData.versionId;
    const unknownsVersionId = (
      await importCsv(owner, `${prefix}unknowns.csv`, 'unknowns', syntheticCsv('unknowns', 7).csv)
    ).versionId;
    const groups: { id: string; versionId: string }[] = [];
    for (const [name, memberIds] of Object.entries(reference.groups)) {
      const res = await analyst
        .post(`${base()}/groups`)
        .send({ name: `${prefix}${name}`, datasetVersionId: referenceVersionId, memberIds })
        .expect(201);
      groups.push({ id: res.body.id, versionId: res.body.versions[0].id });
    }
    const groupVersionIds = groups.map((g) => g.versionId);
    const study: Study = (await owner.post(`${base()}/studies`).send({ name: 'Synthetic core' }).expect(201)).body;
    const steps = `${base()}/studies/${study.id}/steps`;
    await owner.put(`${steps}/data`).send({ parameters: { referenceVersionId, unknownsVersionId } }).expect(200);
    await owner.put(`${steps}/prepare`).send({ parameters: prepare }).expect(200);
    // Analysts may choose groups not yet approved, also in a student's study.
    await analyst.put(`${steps}/groups`).send({ parameters: { groupVersionIds } }).expect(200);
    return { reference, referenceData, groups, steps, study };
  }

  beforeAll(async () => {
    testApp = await createTestApp();
    ({ labId, members } = await createLabWithMembers(testApp, ['pi', 'analyst', 'student'] as const));
  });
  afterAll(() => testApp.close());

  it('checks the groups, assigns the unknowns, opens Review, and lets the PI sign off', async () => {
    const agent = members.analyst.agent;
    const { reference, referenceData, steps, study } = await studyWithGroups(agent, agent);
    const sizes = await agent.get(`${base()}/studies/${study.id}/group-sizes`).expect(200);
    expect(sizes.body.groups.map((g: { n: number; p: number }) => [g.n, g.p])).toEqual([
      [14, 3],
      [14, 3],
      [14, 3],
    ]);

    await agent.post(`${steps}/assign/run`).expect(400);
    await agent.get(`${base()}/studies/${study.id}/check-results`).expect(404);
    const checking: Study = (await agent.post(`${steps}/check/run`).expect(201)).body;
    const check = checking.steps.find((s) => s.key === 'check')!;
    expect(check.status).toBe('running');
    await waitForRun(testApp, check.runId!, (run) => run.status === 'succeeded');
    const checked: Study = (await agent.get(`${base()}/studies/${study.id}`).expect(200)).body;
    expect(checked.steps.find((s) => s.key === 'check')!.status).toBe('current');
    const results = (await agent.get(`${base()}/studies/${study.id}/check-results`).expect(200)).body;
    expect(results).toMatchObject({ memberCount: 42, members: { total: 42 } });
    expect(results.pairs).toHaveLength(3);
    expect(results.kruskalWallis.map((k: { variable: string }) => k.variable)).toHaveLength(3);
    const confusionTotal = Object.values(results.confusion as Record<string, Record<string, number>>)
      .flatMap((row) => Object.values(row))
      .reduce((a, b) => a + b, 0);
    expect(confusionTotal).toBe(42);
    const north = (await agent.get(`${base()}/studies/${study.id}/check-results?group=North`).expect(200)).body;
    expect(north.members.total).toBe(14);
    expect(new Set(north.members.rows.map((m: { group: string }) => m.group))).toEqual(new Set(['North']));
    const short = (await agent.get(`${base()}/studies/${study.id}/check-results?page=3&pageSize=15`).expect(200)).body;
    expect(short.members).toMatchObject({ total: 42, page: 3, pageSize: 15 });
    expect(short.members.rows).toHaveLength(12);
    await agent.get(`${base()}/studies/${study.id}/check-results?pageSize=201`).expect(400);

    const assigning: Study = (await agent.post(`${steps}/assign/run`).expect(201)).body;
    const assignRun = assigning.steps.find((s) => s.key === 'assign')!.runId!;
    await waitForRun(testApp, assignRun, (run) => run.status === 'succeeded');
    const assigned: Study = (await members.pi.agent.get(`${base()}/studies/${study.id}`).expect(200)).body;
    expect(Object.fromEntries(assigned.steps.map((s) => [s.key, s.status]))).toMatchObject({
      check: 'current',
      assign: 'current',
      review: 'current',
    });
    expect(assigned.status).toBe('ready_for_review');

    const plot = (await agent.get(`${base()}/studies/${study.id}/scatter?space=measured&x=Zr&y=La`).expect(200)).body;
    expect(plot).toMatchObject({ space: 'measured', variables: ['Zr', 'Nb', 'La'], x: 'Zr', y: 'La' });
    expect(plot.reference).toHaveLength(42);
    expect(new Set(plot.reference.map((p: { group: string }) => p.group))).toEqual(new Set(['North', 'South', 'East']));
    expect(plot.unknowns).toHaveLength(9);
    expect(plot.unknowns.every((u: { verdict: string | null }) => u.verdict !== null)).toBe(true);
    expect(plot.truncated).toBe(false);
    const [, , zr, , la] = reference.csv
      .split('\n')
      .find((line) => line.startsWith('NN1,'))!
      .split(',');
    expect(plot.reference.find((p: { sampleId: string }) => p.sampleId === 'NN1')).toMatchObject({
      x: Number(zr),
      y: Number(la),
      group: 'North',
      belowDetection: false,
    });
    // The Prepare card's ln, as the natural logarithm defines it, on the same member.
    const prepared = (await agent.get(`${base()}/studies/${study.id}/scatter`).expect(200)).body;
    expect(prepared).toMatchObject({ space: 'prepared', variables: ['ln(Zr)', 'ln(Nb)', 'ln(La)'], x: 'ln(Zr)' });
    const lnPlot = (await agent.get(`${base()}/studies/${study.id}/scatter?x=ln(Zr)&y=ln(La)`).expect(200)).body;
    expect(lnPlot.reference).toHaveLength(42);
    expect(lnPlot.unknowns).toHaveLength(9);
    const nn1 = lnPlot.reference.find((p: { sampleId: string }) => p.sampleId === 'NN1');
    expect(nn1.x).toBeCloseTo(Math.log(Number(zr)), 12);
    expect(nn1.y).toBeCloseTo(Math.log(Number(la)), 12);
    const wrongSpace = await agent.get(`${base()}/studies/${study.id}/scatter?x=Zr&y=La`).expect(400);
    expect(wrongSpace.body.message).toMatch(/ln\(Zr\)/);
    await agent.get(`${base()}/studies/${study.id}/scatter?space=measured&x=Zr&y=Cu`).expect(400);
    const unknownSpace = await agent.get(`${base()}/studies/${study.id}/scatter?space=raw`).expect(400);
    expect(unknownSpace.body.errors[0]).toMatchObject({ path: 'space' });

    const page = await agent.get(`${base()}/runs/${assignRun}/assignments`).expect(200);
    expect(page.body.total).toBe(9);
    const second = await agent.get(`${base()}/runs/${assignRun}/assignments?page=2&pageSize=4`).expect(200);
    expect(second.body).toMatchObject({ total: 9, page: 2, pageSize: 4 });
    expect(second.body.rows.map((r: { sampleId: string }) => r.sampleId)).toEqual(
      page.body.rows.slice(4, 8).map((r: { sampleId: string }) => r.sampleId),
    );
    expect(page.body.groups.map((g: { name: string }) => g.name).sort()).toEqual(['East', 'North', 'South']);

    const overrides = `${base()}/studies/${study.id}/overrides`;
    const computed = page.body.rows.find((r: { sampleId: string }) => r.sampleId === 'UN1');
    const reason = 'Field log puts this core interval below the South fan outlet';
    await agent
      .post(overrides)
      .send({ sampleId: 'UN1', verdict: 'assigned', group: 'South', reason: 'short' })
      .expect(400);
    await agent.post(overrides).send({ sampleId: 'nope', verdict: 'assigned', group: 'South', reason }).expect(400);
    const overridden = await agent
      .post(overrides)
      .send({ sampleId: 'UN1', verdict: 'assigned', group: 'South', reason })
      .expect(201);
    expect(overridden.body.overrides).toEqual([
      expect.objectContaining({
        sampleId: 'UN1',
        computedVerdict: computed.verdict,
        verdict: 'assigned',
        group: 'South',
        reason,
        createdBy: members.analyst.user.displayName,
      }),
    ]);
    const withOverride = await agent.get(`${base()}/runs/${assignRun}/assignments?search=UN1`).expect(200);
    expect(withOverride.body.rows[0]).toMatchObject({
      sampleId: 'UN1',
      verdict: computed.verdict,
      override: { verdict: 'assigned', group: 'South', reason },
    });
    const finalAssigned = await agent.get(`${base()}/runs/${assignRun}/assignments?finalVerdict=assigned`).expect(200);
    const computedAssigned = page.body.rows.filter(
      (r: { sampleId: string; verdict: string }) => r.verdict === 'assigned' && r.sampleId !== 'UN1',
    );
    expect(finalAssigned.body.total).toBe(computedAssigned.length + 1);
    expect(finalAssigned.body.rows.map((r: { sampleId: string }) => r.sampleId)).toContain('UN1');
    for (const other of ['ambiguous', 'unassigned']) {
      const final = await agent.get(`${base()}/runs/${assignRun}/assignments?finalVerdict=${other}`).expect(200);
      expect(final.body.rows.map((r: { sampleId: string }) => r.sampleId)).not.toContain('UN1');
    }
    const byComputed = await agent
      .get(`${base()}/runs/${assignRun}/assignments?verdict=${computed.verdict}`)
      .expect(200);
    expect(byComputed.body.rows.map((r: { sampleId: string }) => r.sampleId)).toContain('UN1');

    await members.pi.agent.post(`${base()}/studies/${study.id}/sign-off`).send({}).expect(201);
    await agent.post(`${steps}/assign/run`).expect(409);
    await agent.post(overrides).send({ sampleId: 'UN1', verdict: 'unassigned', group: null, reason }).expect(409);
    const deletion = await members.pi.agent.delete(`${base()}/datasets/${referenceData.datasetId}`).expect(409);
    expect(deletion.body.errors[0].message).toBe('study "Synthetic core", signed off, uses this data');
  });

  it('lets a student check and assign against approved groups only, without excluding members', async () => {
    const student = members.student.agent;
    const { groups, steps, study } = await studyWithGroups(student, members.analyst.agent, 'student-');
    const refused = await student.post(`${steps}/check/run`).expect(403);
    expect(refused.body.message).toMatch(/not approved yet; students may use approved versions only/);
    for (const group of groups) {
      await members.analyst.agent.post(`${base()}/groups/${group.id}/versions/${group.versionId}/approve`).expect(201);
    }
    const checking: Study = (await student.post(`${steps}/check/run`).expect(201)).body;
    await waitForRun(testApp, checking.steps.find((s) => s.key === 'check')!.runId!, (r) => r.status === 'succeeded');
    await student
      .put(`${steps}/check`)
      .send({ parameters: { exclusions: [] } })
      .expect(403);
    const assigning: Study = (await student.post(`${steps}/assign/run`).expect(201)).body;
    const assignRun = assigning.steps.find((s) => s.key === 'assign')!.runId!;
    await waitForRun(testApp, assignRun, (r) => r.status === 'succeeded');
    const page = await student.get(`${base()}/runs/${assignRun}/assignments`).expect(200);
    expect(page.body.total).toBe(9);
    const done: Study = (await student.get(`${base()}/studies/${study.id}`).expect(200)).body;
    expect(done.status).toBe('ready_for_review');
  });
});
