import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { API_PREFIX } from '../../src/app.factory';
import { declaredRoutes, type DeclaredRoute } from '../../src/auth/routes';
import { RunsService } from '../../src/runs/runs.service';
import { STUDY_SIGNED_OFF } from '../../src/studies/study-access';
import { type Agent, createLabWithMembers, type SignedInMember } from '../auth-helpers';
import { classifyRequest } from '../run-fixtures';
import { createTestApp, type TestApp } from '../test-app';

type Members = Record<'pi' | 'analyst' | 'student' | 'guest', SignedInMember>;

const referenceCsv = [
  'Sample,Group,Zr ppm,Nb ppm,La ppm,Th ppm',
  ...['N1', 'N2', 'N3', 'N4'].map((id, i) => `${id},North ridge,${210 + i},${12 + i * 2},${31 + i},${9 + i * 3}`),
].join('\n');
const prepare = {
  elements: ['Zr', 'Nb', 'La', 'Th'],
  transform: 'clr',
  alrDenominator: null,
  belowDetection: 'dl-half',
  covariance: 'classic',
  seed: 11,
};
const reason = 'Checked against the field notebook for this synthetic scenario';

/** Tables whose content a refused request must leave exactly as it was (sessions and the audit trail move on their own). */
const UNTOUCHED_EXCEPT = new Set(['sessions', 'audit_events', 'schema_migrations']);

const describeRoute = (route: DeclaredRoute) => `${route.method} ${route.path} (${route.handler})`;

async function call(agent: Agent, route: DeclaredRoute, url: string, body: object = {}) {
  const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  return agent[method](url).send(body);
}

describe('lab scope and signed-off work, with real ids of real things', () => {
  let testApp: TestApp;
  let routes: DeclaredRoute[];
  let labId: string;
  let members: Members;
  let outsider: { labId: string; members: Record<'pi', SignedInMember> };
  /** A real id of this lab's thing for each route parameter name. */
  const ids: Record<string, string> = {};

  /** A digest of every row of every table: equal digests mean nothing was written. */
  async function digest(): Promise<Record<string, string>> {
    const dataSource = testApp.app.get(DataSource);
    const tables = (
      (await dataSource.query(
        `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' ORDER BY 1`,
      )) as { table_name: string }[]
    )
      .map((row) => row.table_name)
      .filter((name) => !UNTOUCHED_EXCEPT.has(name));
    const entries = await Promise.all(
      tables.map(async (table) => {
        const [row] = (await dataSource.query(
          `SELECT md5(coalesce(string_agg(t::text, '|' ORDER BY t::text), '')) AS d FROM "${table}" t`,
        )) as { d: string }[];
        return [table, row.d] as const;
      }),
    );
    return Object.fromEntries(entries);
  }

  const urlFor = (route: DeclaredRoute, lab: string, overrides: Record<string, string> = {}) =>
    route.path.replace(/:(\w+)/g, (_match, name: string) => {
      if (name === 'labId') return lab;
      const value = overrides[name] ?? ids[name];
      if (value === undefined) throw new Error(`No test id for :${name} in ${describeRoute(route)}; add one`);
      return value;
    });

  beforeAll(async () => {
    testApp = await createTestApp({ WORKERS: 'external' });
    routes = declaredRoutes(testApp.app, API_PREFIX);
    ({ labId, members } = await createLabWithMembers(testApp, ['pi', 'analyst', 'student', 'guest'] as const));
    outsider = await createLabWithMembers(testApp, ['pi'] as const);
    const pi = members.pi.agent;
    const base = `/api/labs/${labId}`;

    const layout = (
      await pi.post(`${base}/dataset-files`).attach('file', Buffer.from(referenceCsv), 'reference.csv').expect(201)
    ).body;
    const dataset = (
      await pi
        .post(`${base}/datasets`)
        .send({ name: 'Reference', kind: 'reference', fileId: layout.file.id, mapping: layout.mapping })
        .expect(201)
    ).body;
    const group = (
      await pi
        .post(`${base}/groups`)
        .send({ name: 'North ridge', datasetVersionId: dataset.versions[0].id, memberIds: ['N1', 'N2', 'N3', 'N4'] })
        .expect(201)
    ).body;
    const study = (await pi.post(`${base}/studies`).send({ name: 'Signed core' }).expect(201)).body;
    await pi
      .put(`${base}/studies/${study.id}/steps/data`)
      .send({ parameters: { referenceVersionId: dataset.versions[0].id, unknownsVersionId: null } })
      .expect(200);
    const run = await testApp.app.get(RunsService).create(labId, members.pi.user.id, 'pi', classifyRequest(5));
    await pi.post(`${base}/invitations`).send({ email: 'invitee@test.provenote.test', role: 'guest' }).expect(204);
    const invitations = (await pi.get(`${base}/invitations`).expect(200)).body;
    const memberships = (await pi.get(`${base}/members`).expect(200)).body;
    Object.assign(ids, {
      fileId: layout.file.id,
      referenceVersionId: dataset.versions[0].id,
      datasetId: dataset.id,
      number: '1',
      groupId: group.id,
      versionId: group.versions[0].id,
      studyId: study.id,
      stepKey: 'prepare',
      runId: run.id,
      // A bundle needs a finished assign run; an unknown id still has to get the same 404.
      bundleId: randomUUID(),
      invitationId: (invitations as { id: string }[])[0].id,
      membershipId: (memberships as { membershipId: string; userId: string }[]).find(
        (m) => m.userId === members.guest.user.id,
      )!.membershipId,
    });
  }, 60_000);
  afterAll(() => testApp.close());

  it('answers 404 to a member of another lab who uses its own lab id with this lab’s ids, on every route', async () => {
    const scoped = routes.filter((route) => route.rule.kind === 'roles' && /:\w+.*:\w+/.test(route.path));
    expect(scoped.length).toBeGreaterThan(20);
    const before = await digest();
    const problems: string[] = [];
    for (const route of scoped) {
      const res = await call(outsider.members.pi.agent, route, urlFor(route, outsider.labId));
      // A write whose body fails validation is refused before any lookup, which reveals nothing either.
      const refusedBody = res.status === 400 && route.method !== 'GET' && route.method !== 'DELETE';
      if (res.status !== 404 && !refusedBody) problems.push(`${describeRoute(route)}: ${res.status}`);
    }
    expect(problems).toEqual([]);
    expect(await digest()).toEqual(before);
  });

  it('lets a student neither approve a group version nor sign off, with the real ids', async () => {
    const student = members.student.agent;
    const approve = await student.post(`/api/labs/${labId}/groups/${ids.groupId}/versions/${ids.versionId}/approve`);
    expect(approve.status).toBe(403);
    const signOff = await student.post(`/api/labs/${labId}/studies/${ids.studyId}/sign-off`).send({ statement: '' });
    expect(signOff.status).toBe(403);
    const [version] = await testApp.app
      .get(DataSource)
      .query(`SELECT approved_at FROM reference_group_versions WHERE id = $1`, [ids.versionId]);
    expect(version.approved_at).toBeNull();
    const [study] = await testApp.app
      .get(DataSource)
      .query(`SELECT signed_off_at FROM studies WHERE id = $1`, [ids.studyId]);
    expect(study.signed_off_at).toBeNull();
  });

  it('changes nothing of a signed-off study through any write route, nor deletes the data it pinned', async () => {
    // Stands in for a finished sign-off (the flow itself is tested with real runs in study-runs.spec).
    await testApp.app
      .get(DataSource)
      .query(`UPDATE studies SET signed_off_at = now(), signed_off_by = $2 WHERE id = $1`, [
        ids.studyId,
        members.pi.user.id,
      ]);
    const stepBodies: Record<string, object> = {
      data: { parameters: { referenceVersionId: ids.referenceVersionId, unknownsVersionId: null } },
      prepare: { parameters: prepare },
    };
    const bodies: Record<string, object> = {
      'StudiesController.update': { name: 'Renamed after sign-off' },
      'StudiesController.override': { sampleId: 'N1', verdict: 'unassigned', group: null, reason },
      'StudiesController.signOff': { statement: 'Again' },
    };
    // Copying is how a signed-off study is worked on further, and a bundle is how it is exported: both
    // write something new and leave the study be.
    const byDesign = new Set(['StudiesController.copy', 'BundlesController.build']);
    const stepKeysOf: Record<string, string[]> = {
      'StudiesController.editStep': ['data', 'prepare'],
      'StudiesController.startRun': ['check', 'assign'],
    };
    const writes = routes.filter(
      (route) =>
        route.rule.kind === 'roles' &&
        route.method !== 'GET' &&
        route.path.includes(':studyId') &&
        !byDesign.has(route.handler),
    );
    expect(writes.length).toBeGreaterThanOrEqual(5);
    const before = await digest();
    const problems: string[] = [];
    for (const route of writes) {
      for (const stepKey of stepKeysOf[route.handler] ?? ['prepare']) {
        const body = route.handler === 'StudiesController.editStep' ? stepBodies[stepKey] : bodies[route.handler];
        const res = await call(members.pi.agent, route, urlFor(route, labId, { stepKey }), body);
        if (res.status !== 409 || res.body.message !== STUDY_SIGNED_OFF) {
          problems.push(`${describeRoute(route)} [${stepKey}]: ${res.status} ${res.body.message}`);
        }
      }
    }
    for (const url of [
      `/api/labs/${labId}/datasets/${ids.datasetId}`,
      `/api/labs/${labId}/datasets/${ids.datasetId}/versions/1`,
    ]) {
      const res = await members.pi.agent.delete(url);
      if (res.status !== 409) problems.push(`DELETE ${url}: ${res.status} ${res.body.message}`);
    }
    expect(problems).toEqual([]);
    expect(await digest()).toEqual(before);
  });
});
