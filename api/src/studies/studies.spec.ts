import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import type { StepKey, StepStatus, Study } from '@provenote/shared';
import { createLabWithMembers, type SignedInMember } from '../../test/auth-helpers';
import { createTestApp, type TestApp } from '../../test/test-app';
import { StudyStepEntity } from './study-step.entity';

type Members = Record<'pi' | 'analyst' | 'student' | 'guest', SignedInMember>;

const prepare = {
  elements: ['Zr', 'Nb', 'La', 'Th'],
  transform: 'clr',
  alrDenominator: null,
  belowDetection: 'dl-half',
  covariance: 'classic',
  seed: 11,
};

describe('studies and their step cards (HTTP, PostgreSQL)', () => {
  let testApp: TestApp;
  let labId: string;
  let members: Members;
  let otherLab: { labId: string; members: Record<'analyst', SignedInMember> };
  let referenceVersionId: string;
  let unknownsVersionId: string;
  let otherReferenceVersionId: string;

  /** A small synthetic lab file, imported through the datasets API. */
  async function importCsv(name: string, kind: 'reference' | 'unknowns', csv: string): Promise<string> {
    const agent = members.analyst.agent;
    const layout = (
      await agent.post(`/api/labs/${labId}/dataset-files`).attach('file', Buffer.from(csv), name).expect(201)
    ).body;
    const res = await agent
      .post(`/api/labs/${labId}/datasets`)
      .send({ name, kind, fileId: layout.file.id, mapping: layout.mapping })
      .expect(201);
    return res.body.versions[0].id;
  }
  const referenceCsv = [
    'Sample,Group,Zr ppm,Nb ppm,La ppm,Th ppm',
    ...['N1', 'N2', 'N3'].map((id, i) => `${id},North ridge,${210 + i},${12 + i},${31 + i},${9 + i}`),
    ...['S1', 'S2', 'S3'].map((id, i) => `${id},South fan,${95 + i},${24 + i},${44 + i},${14 + i}`),
    'N4,North ridge,<5,13,30,10',
  ].join('\n');

  const base = () => `/api/labs/${labId}/studies`;
  const statuses = (study: Study) => Object.fromEntries(study.steps.map((s) => [s.key, s.status]));

  /** Stands in for a finished run of a computed card (the run itself is the queue's business). */
  async function markRun(studyId: string, key: StepKey, status: StepStatus) {
    await testApp.app
      .get(DataSource)
      .getRepository(StudyStepEntity)
      .update({ studyId, key }, { status, runId: randomUUID() });
  }

  async function createStudy(member: SignedInMember, name = 'Reservoir core 2') {
    const res = await member.agent.post(base()).send({ name, description: 'Synthetic demo' }).expect(201);
    return res.body as Study;
  }

  async function createGroup(name: string, memberIds: string[]) {
    const res = await members.analyst.agent
      .post(`/api/labs/${labId}/groups`)
      .send({ name, datasetVersionId: referenceVersionId, memberIds })
      .expect(201);
    return res.body as { id: string; versions: { id: string }[] };
  }

  /** A study whose Data, Prepare and Reference groups cards are current. */
  async function studyWithGroups(member: SignedInMember, versionIds: string[]) {
    const study = await createStudy(member);
    const step = (key: string) => `${base()}/${study.id}/steps/${key}`;
    await member.agent
      .put(step('data'))
      .send({ parameters: { referenceVersionId, unknownsVersionId: null } })
      .expect(200);
    await member.agent.put(step('prepare')).send({ parameters: prepare }).expect(200);
    const res = await member.agent
      .put(step('groups'))
      .send({ parameters: { groupVersionIds: versionIds } })
      .expect(200);
    return res.body.study as Study;
  }

  let north: { id: string; versions: { id: string }[] };
  let south: { id: string; versions: { id: string }[] };

  beforeAll(async () => {
    testApp = await createTestApp();
    ({ labId, members } = await createLabWithMembers(testApp, ['pi', 'analyst', 'student', 'guest'] as const));
    otherLab = await createLabWithMembers(testApp, ['analyst'] as const);
    referenceVersionId = await importCsv('reference.csv', 'reference', referenceCsv);
    otherReferenceVersionId = await importCsv('reference-2.csv', 'reference', referenceCsv);
    unknownsVersionId = await importCsv(
      'unknowns.csv',
      'unknowns',
      'Sample,Zr ppm,Nb ppm,La ppm,Th ppm\nU1,150,18,40,12\n',
    );
    north = await createGroup('North ridge', ['N1', 'N2', 'N3']);
    south = await createGroup('South fan', ['S1', 'S2', 'S3']);
  });
  afterAll(() => testApp.close());

  it('creates a study with its seven cards, all not run, owned by its creator', async () => {
    const study = await createStudy(members.analyst);
    expect(study.steps.map((s) => s.key)).toEqual(['data', 'prepare', 'groups', 'check', 'assign', 'review', 'export']);
    expect(new Set(study.steps.map((s) => s.status))).toEqual(new Set(['not_run']));
    expect(study).toMatchObject({ status: 'draft', owner: { id: members.analyst.user.id } });

    const list = await members.guest.agent.get(base()).expect(200);
    expect(list.body.studies.map((s: Study) => s.id)).toContain(study.id);
  });

  it('lets guests read but not create, and hides the lab from outsiders', async () => {
    await members.guest.agent.post(base()).send({ name: 'Nope' }).expect(403);
    await otherLab.members.analyst.agent.get(base()).expect(404);
    const study = await createStudy(members.analyst);
    await otherLab.members.analyst.agent.get(`/api/labs/${otherLab.labId}/studies/${study.id}`).expect(404);
  });

  it('pins only dataset versions of this lab, each of the right kind', async () => {
    const study = await createStudy(members.analyst);
    const url = `${base()}/${study.id}/steps/data`;
    const wrongKind = await members.analyst.agent
      .put(url)
      .send({ parameters: { referenceVersionId: unknownsVersionId, unknownsVersionId: null } })
      .expect(400);
    expect(wrongKind.body.message).toBe('That dataset version holds unknowns, not reference');
    await members.analyst.agent
      .put(url)
      .send({ parameters: { referenceVersionId: randomUUID(), unknownsVersionId: null } })
      .expect(400);
  });

  it('refuses group members that are not samples of the dataset version', async () => {
    const res = await members.analyst.agent
      .post(`/api/labs/${labId}/groups`)
      .send({ name: 'Ghosts', datasetVersionId: referenceVersionId, memberIds: ['N1', 'Q7'] })
      .expect(400);
    expect(res.body.message).toBe('Not samples of this dataset version: Q7');
  });

  it('builds groups from the group column, and a new version only when the members change', async () => {
    const res = await members.analyst.agent
      .post(`/api/labs/${labId}/groups/from-column`)
      .send({ datasetVersionId: otherReferenceVersionId })
      .expect(201);
    const northRidge = res.body.groups.find((g: { name: string }) => g.name === 'North ridge');
    expect(northRidge.versions[0]).toMatchObject({
      source: 'column',
      memberIds: ['N1', 'N2', 'N3', 'N4'],
      approvedAt: null,
    });
    const again = await members.analyst.agent
      .post(`/api/labs/${labId}/groups/from-column`)
      .send({ datasetVersionId: otherReferenceVersionId })
      .expect(201);
    const versions = again.body.groups.find((g: { name: string }) => g.name === 'North ridge').versions;
    expect(versions).toHaveLength(northRidge.versions.length);
    await members.student.agent
      .post(`/api/labs/${labId}/groups/from-column`)
      .send({ datasetVersionId: otherReferenceVersionId })
      .expect(403);
  });

  it('summarises each element of the reference data for the Prepare card', async () => {
    const study = await createStudy(members.analyst);
    await members.analyst.agent
      .put(`${base()}/${study.id}/steps/data`)
      .send({ parameters: { referenceVersionId, unknownsVersionId: null } })
      .expect(200);
    const res = await members.guest.agent.get(`${base()}/${study.id}/element-summary`).expect(200);
    expect(res.body.samples).toBe(7);
    const zr = res.body.elements.find((e: { element: string }) => e.element === 'Zr');
    // Quartiles by linear interpolation between order statistics, as PostgreSQL's percentile_cont
    // defines them (PostgreSQL 15 manual, "Ordered-Set Aggregate Functions"): of 95, 96, 97, 210, 211, 212.
    expect(zr).toEqual({ element: 'Zr', withValue: 7, fractionDetected: 6 / 7, median: 153.5, q1: 96.25, q3: 210.75 });
    // Reference values from scipy.stats.kruskal 1.17 (tie-corrected H, chi-square p): Nb 12,13,14,13 against
    // 24,25,26 gives H = 4.581818, p = 0.032313; Zr leaves out N4's detection limit: 210,211,212 against 95,96,97
    // gives H = 3.857143, p = 0.049535.
    expect(res.body.screening.groups).toEqual(['North ridge', 'South fan']);
    const screened = (name: string) => res.body.screening.elements.find((e: { element: string }) => e.element === name);
    expect(screened('Nb').h).toBeCloseTo(4.581818, 5);
    expect(screened('Nb').p).toBeCloseTo(0.032313, 5);
    expect(screened('Zr')).toMatchObject({ df: 1 });
    expect(screened('Zr').h).toBeCloseTo(3.857143, 5);
    expect(screened('Zr').p).toBeCloseTo(0.049535, 5);
  });

  it('answers invalid settings with the field to fix', async () => {
    const study = await createStudy(members.analyst);
    const res = await members.analyst.agent
      .put(`${base()}/${study.id}/steps/data`)
      .send({ parameters: { referenceVersionId: 'not-a-version', unknownsVersionId: null } })
      .expect(400);
    expect(res.body.errors[0]).toMatchObject({ path: 'parameters.referenceVersionId' });

    await members.analyst.agent
      .put(`${base()}/${study.id}/steps/data`)
      .send({ parameters: { referenceVersionId, unknownsVersionId: null } })
      .expect(200);
    const alr = await members.analyst.agent
      .put(`${base()}/${study.id}/steps/prepare`)
      .send({ parameters: { ...prepare, transform: 'alr', alrDenominator: 'Cu' } })
      .expect(400);
    expect(alr.body.errors[0]).toMatchObject({ path: 'parameters.alrDenominator' });
  });

  it('refuses a card whose cards above are not complete', async () => {
    const study = await createStudy(members.analyst);
    const res = await members.analyst.agent
      .put(`${base()}/${study.id}/steps/prepare`)
      .send({ parameters: prepare })
      .expect(400);
    expect(res.body.message).toBe('Complete "Data" first.');
  });

  it('marks every saved or computed card below an edit stale and names them', async () => {
    const study = await studyWithGroups(members.analyst, [north.versions[0].id, south.versions[0].id]);
    expect(statuses(study)).toMatchObject({ data: 'current', prepare: 'current', groups: 'current', check: 'not_run' });
    await markRun(study.id, 'check', 'current');
    await markRun(study.id, 'assign', 'current');

    const res = await members.analyst.agent
      .put(`${base()}/${study.id}/steps/prepare`)
      .send({ parameters: { ...prepare, transform: 'ilr' } })
      .expect(200);
    expect(res.body.staleSteps).toEqual(['groups', 'check', 'assign']);
    expect(statuses(res.body.study)).toEqual({
      data: 'current',
      prepare: 'current',
      groups: 'stale',
      check: 'stale',
      assign: 'stale',
      review: 'not_run',
      export: 'not_run',
    });
    expect(res.body.study.status).toBe('needs_rerun');
    const stored = await members.guest.agent.get(`${base()}/${study.id}`).expect(200);
    expect(stored.body.steps[1].parameters.transform).toBe('ilr');
  });

  it('keeps a member exclusion with its reason, and only for members of a chosen group', async () => {
    const study = await studyWithGroups(members.analyst, [north.versions[0].id, south.versions[0].id]);
    const url = `${base()}/${study.id}/steps/check`;
    const reason = 'Sample N2 was taken from a road cut, not natural bedrock';
    await members.analyst.agent
      .put(url)
      .send({ parameters: { exclusions: [{ sampleId: 'X9', group: 'North ridge', reason }] } })
      .expect(400);
    const res = await members.analyst.agent
      .put(url)
      .send({ parameters: { exclusions: [{ sampleId: 'N2', group: 'North ridge', reason }] } })
      .expect(200);
    expect(res.body.study.steps[3].parameters.exclusions).toEqual([{ sampleId: 'N2', group: 'North ridge', reason }]);
    await members.pi.agent
      .put(url)
      .send({ parameters: { exclusions: [] } })
      .expect(200);
  });

  it('lets students assign only against approved group versions, and only in their own studies', async () => {
    const study = await createStudy(members.student);
    const step = (key: string) => `${base()}/${study.id}/steps/${key}`;
    await members.student.agent
      .put(step('data'))
      .send({ parameters: { referenceVersionId, unknownsVersionId: null } })
      .expect(200);
    await members.student.agent.put(step('prepare')).send({ parameters: prepare }).expect(200);
    const groups = { parameters: { groupVersionIds: [north.versions[0].id, south.versions[0].id] } };
    const refused = await members.student.agent.put(step('groups')).send(groups).expect(403);
    expect(refused.body.message).toMatch(/not approved yet/);

    for (const group of [north, south]) {
      await members.student.agent
        .post(`/api/labs/${labId}/groups/${group.id}/versions/${group.versions[0].id}/approve`)
        .expect(403);
      await members.analyst.agent
        .post(`/api/labs/${labId}/groups/${group.id}/versions/${group.versions[0].id}/approve`)
        .expect(201);
    }
    await members.student.agent.put(step('groups')).send(groups).expect(200);
    await members.student.agent
      .put(step('check'))
      .send({ parameters: { exclusions: [] } })
      .expect(403);

    const analystsStudy = await createStudy(members.analyst);
    await members.student.agent
      .put(`${base()}/${analystsStudy.id}/steps/data`)
      .send({ parameters: { referenceVersionId, unknownsVersionId: null } })
      .expect(403);
  });

  it('signs off only complete studies, by the PI, and then refuses every change', async () => {
    const study = await studyWithGroups(members.analyst, [north.versions[0].id, south.versions[0].id]);
    const signOff = `${base()}/${study.id}/sign-off`;
    const early = await members.pi.agent.post(signOff).send({}).expect(400);
    expect(early.body.message).toMatch(/Group check/);

    for (const key of ['check', 'assign', 'review'] as const) await markRun(study.id, key, 'current');
    await members.analyst.agent.post(signOff).send({}).expect(403);
    const signed = await members.pi.agent.post(signOff).send({ statement: 'Checked against field notes' }).expect(201);
    expect(signed.body).toMatchObject({ status: 'signed_off', signedOffBy: members.pi.user.displayName });

    const locked = await members.analyst.agent
      .put(`${base()}/${study.id}/steps/prepare`)
      .send({ parameters: prepare })
      .expect(409);
    expect(locked.body.message).toMatch(/signed off/);
    await members.analyst.agent.patch(`${base()}/${study.id}`).send({ name: 'Renamed' }).expect(409);
    await members.pi.agent.delete(`${base()}/${study.id}`).expect(409);
    await members.pi.agent.post(signOff).send({}).expect(409);

    const audit = await members.pi.agent.get(`/api/labs/${labId}/audit?action=study.signed_off`).expect(200);
    expect(audit.body.events.map((e: { target: { id: string } }) => e.target.id)).toContain(study.id);
  });

  it('copies a study with new data: settings carried over, nothing computed', async () => {
    const upper = await createGroup('Upper terrace', ['N1', 'N2']);
    const lower = await createGroup('Lower terrace', ['S1', 'S2']);
    const source = await studyWithGroups(members.analyst, [upper.versions[0].id, lower.versions[0].id]);
    await markRun(source.id, 'check', 'current');
    const copyAsStudent = () =>
      members.student.agent
        .post(`${base()}/${source.id}/copy`)
        .send({ name: 'Core 3', data: { referenceVersionId, unknownsVersionId } });
    expect((await copyAsStudent().expect(403)).body.message).toMatch(/not approved yet/);
    for (const group of [upper, lower]) {
      await members.analyst.agent
        .post(`/api/labs/${labId}/groups/${group.id}/versions/${group.versions[0].id}/approve`)
        .expect(201);
    }

    const same = await copyAsStudent().expect(201);
    expect(same.body).toMatchObject({ copiedFromId: source.id, owner: { id: members.student.user.id } });
    expect(statuses(same.body)).toMatchObject({
      data: 'current',
      prepare: 'current',
      groups: 'current',
      check: 'not_run',
    });
    expect(same.body.steps[0].parameters).toEqual({ referenceVersionId, unknownsVersionId });
    expect(same.body.steps[2].parameters).toEqual(source.steps[2].parameters);
    expect(same.body.steps[3].runId).toBeNull();

    const other = await members.analyst.agent
      .post(`${base()}/${source.id}/copy`)
      .send({ name: 'New reference', data: { referenceVersionId: otherReferenceVersionId, unknownsVersionId } })
      .expect(201);
    expect(statuses(other.body)).toMatchObject({ prepare: 'current', groups: 'not_run' });
    expect(other.body.steps[2].parameters).toBeNull();
  });
});
