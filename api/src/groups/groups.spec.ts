import type { FileLayout, ReferenceGroup } from '@provenote/shared';
import { auditPageSchema, referenceGroupSchema } from '@provenote/shared';
import { createLabWithMembers, type Agent, type SignedInMember } from '../../test/auth-helpers';
import { createTestApp, type TestApp } from '../../test/test-app';

/** A small synthetic reference file (invented values). */
const CSV = ['Sample,Group,Zr ppm,Nb ppm', 'N1,North,200,12', 'N2,North,210,13', 'N3,North,190,11', 'N4,North,205,12']
  .join('\n')
  .concat('\n');

describe('editing reference groups (HTTP, PostgreSQL)', () => {
  let testApp: TestApp;
  let labId: string;
  let members: Record<'pi' | 'analyst' | 'student' | 'guest', SignedInMember>;
  let datasetVersionId: string;
  const base = () => `/api/labs/${labId}/groups`;

  async function newGroup(agent: Agent, name: string): Promise<ReferenceGroup> {
    const res = await agent
      .post(base())
      .send({ name, description: 'Synthetic outcrop', datasetVersionId, memberIds: ['N1', 'N2', 'N3'] })
      .expect(201);
    return referenceGroupSchema.parse(res.body);
  }

  beforeAll(async () => {
    testApp = await createTestApp();
    ({ labId, members } = await createLabWithMembers(testApp, ['pi', 'analyst', 'student', 'guest'] as const));
    const analyst = members.analyst.agent;
    const layout: FileLayout = (
      await analyst.post(`/api/labs/${labId}/dataset-files`).attach('file', Buffer.from(CSV), 'ref.csv').expect(201)
    ).body;
    const dataset = await analyst
      .post(`/api/labs/${labId}/datasets`)
      .send({ name: 'Synthetic reference', kind: 'reference', fileId: layout.file.id, mapping: layout.mapping })
      .expect(201);
    datasetVersionId = dataset.body.versions[0].id;
  });
  afterAll(() => testApp.close());

  it('lets an analyst rename a group and edit its description, keeping its versions and approvals', async () => {
    const analyst = members.analyst.agent;
    const group = await newGroup(analyst, 'North ridge');
    await analyst.post(`${base()}/${group.id}/versions/${group.versions[0].id}/approve`).expect(201);
    const renamed = referenceGroupSchema.parse(
      (
        await analyst
          .patch(`${base()}/${group.id}`)
          .send({ name: 'North ridge, upper', description: 'Upper slope only' })
          .expect(200)
      ).body,
    );
    expect(renamed.name).toBe('North ridge, upper');
    expect(renamed.description).toBe('Upper slope only');
    expect(renamed.versions).toHaveLength(1);
    expect(renamed.versions[0].approvedAt).not.toBeNull();
  });

  it('refuses a rename to a name the lab already uses, and an empty change, with reasons', async () => {
    const analyst = members.analyst.agent;
    await newGroup(analyst, 'South fan');
    const other = await newGroup(analyst, 'East terrace');
    const taken = await analyst.patch(`${base()}/${other.id}`).send({ name: 'South fan' }).expect(409);
    expect(taken.body.message).toMatch(/already has a group named "South fan"/);
    const empty = await analyst.patch(`${base()}/${other.id}`).send({}).expect(400);
    expect(JSON.stringify(empty.body)).toMatch(/Change the name or description/);
    await analyst.patch(`${base()}/${other.id}`).send({ name: '   ' }).expect(400);
  });

  it('makes a new hand-made version that needs approval again, leaving the approved one as it was', async () => {
    const analyst = members.analyst.agent;
    const group = await newGroup(analyst, 'West bench');
    await analyst.post(`${base()}/${group.id}/versions/${group.versions[0].id}/approve`).expect(201);
    const edited = referenceGroupSchema.parse(
      (
        await analyst
          .post(`${base()}/${group.id}/versions`)
          .send({ datasetVersionId, memberIds: ['N1', 'N2', 'N4'], note: 'N3 removed, N4 added' })
          .expect(201)
      ).body,
    );
    const [v2, v1] = edited.versions;
    expect(v2).toMatchObject({ number: 2, source: 'manual', memberIds: ['N1', 'N2', 'N4'], approvedAt: null });
    expect(v2.note).toBe('N3 removed, N4 added');
    expect(v1).toMatchObject({ number: 1, memberIds: ['N1', 'N2', 'N3'] });
    expect(v1.approvedAt).not.toBeNull();
    const approved = await members.pi.agent.post(`${base()}/${group.id}/versions/${v2.id}/approve`).expect(201);
    expect(approved.body.versions[0].approvedAt).not.toBeNull();
  });

  it('refuses members that are not samples of the dataset version, naming them', async () => {
    const analyst = members.analyst.agent;
    const group = await newGroup(analyst, 'Quarry');
    const res = await analyst
      .post(`${base()}/${group.id}/versions`)
      .send({ datasetVersionId, memberIds: ['N1', 'X9'] })
      .expect(400);
    expect(res.body.message).toBe('Not samples of this dataset version: X9');
  });

  it('lets students and guests read but not edit groups', async () => {
    const group = await newGroup(members.analyst.agent, 'Spring');
    for (const role of ['student', 'guest'] as const) {
      const agent = members[role].agent;
      await agent.get(`${base()}/${group.id}`).expect(200);
      await agent
        .patch(`${base()}/${group.id}`)
        .send({ name: `Renamed by ${role}` })
        .expect(403);
      await agent
        .post(`${base()}/${group.id}/versions`)
        .send({ datasetVersionId, memberIds: ['N1', 'N2'] })
        .expect(403);
    }
    const unchanged = await members.pi.agent.get(`${base()}/${group.id}`).expect(200);
    expect(unchanged.body.name).toBe('Spring');
    expect(unchanged.body.versions).toHaveLength(1);
  });

  it('records renames and new versions in the audit log with who made them', async () => {
    const analyst = members.analyst.agent;
    const group = await newGroup(analyst, 'Delta');
    await analyst.patch(`${base()}/${group.id}`).send({ description: 'Delta front' }).expect(200);
    await analyst
      .post(`${base()}/${group.id}/versions`)
      .send({ datasetVersionId, memberIds: ['N4'] })
      .expect(201);
    const page = auditPageSchema.parse((await members.pi.agent.get(`/api/labs/${labId}/audit`).expect(200)).body);
    const mine = page.events.filter((e) => e.target?.id === group.id);
    const updated = mine.find((e) => e.action === 'group.updated');
    expect(updated?.details).toEqual({ description: 'Delta front' });
    expect(updated?.actor.id).toBe(members.analyst.user.id);
    expect(mine.find((e) => e.action === 'group.version_created')?.details).toMatchObject({ version: 2, members: 1 });
  });
});
