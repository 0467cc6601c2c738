import { createHash } from 'node:crypto';
import type { Response } from 'supertest';
import { DataSource } from 'typeorm';
import {
  bundleListSchema,
  bundleSummarySchema,
  checkResultsSchema,
  openedBundleSchema,
  type Study,
} from '@provenote/shared';
import {
  CONTRIBUTIONS_COLUMNS,
  CONTRIBUTIONS_PATH,
  MANIFEST_PATH,
  MEMBERS_COLUMNS,
  MEMBERS_PATH,
  parseCsv,
  readZipEntries,
  SEPARATION_COLUMNS,
  SEPARATION_PATH,
  verifyBundle,
} from '@provenote/workers';
import { rewriteZip, renameEntryBytes } from '../../../workers/src/bundles/__fixtures__/zip-tools';
import { createLabWithMembers, type Agent, type SignedInMember } from '../../test/auth-helpers';
import { waitForRun } from '../../test/run-waits';
import { createTestApp, type TestApp } from '../../test/test-app';
import { OVERRIDE_REASON, signedOffStudy } from '../../test/signed-off-study';

type Role = 'pi' | 'analyst' | 'guest';

const binary = (res: Response, done: (error: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

describe('result bundles over HTTP (PostgreSQL, Redis, the bundle job)', () => {
  let testApp: TestApp;
  let labId: string;
  let members: Record<Role, SignedInMember>;
  let studyId: string;
  let assignRunId: string;
  let zip: Buffer;
  const base = () => `/api/labs/${labId}`;

  const counts = async () => {
    const db = testApp.app.get(DataSource);
    const [row] = (await db.query(
      `SELECT (SELECT count(*) FROM studies)::int AS studies, (SELECT count(*) FROM bundles)::int AS bundles,
         (SELECT count(*) FROM runs)::int AS runs`,
    )) as { studies: number; bundles: number; runs: number }[];
    return row;
  };
  const csvOf = async (bytes: Buffer, path: string, columns: string[]) => {
    const entry = (await readZipEntries(bytes)).find((e) => e.name === path);
    if (!entry) throw new Error(`${path} is not in the bundle`);
    return parseCsv(entry.bytes.toString('utf8'), path, columns).rows;
  };
  const open = (agent: Agent, bytes: Buffer) =>
    agent.post(`${base()}/bundles/open`).attach('file', bytes, 'bundle.zip');

  beforeAll(async () => {
    testApp = await createTestApp();
    ({ labId, members } = await createLabWithMembers(testApp, ['pi', 'analyst', 'guest'] as const));
    ({ studyId, assignRunId } = await signedOffStudy(testApp, labId, members.analyst.agent, members.pi.agent));
  }, 60_000);
  afterAll(() => testApp.close());

  it('builds a bundle for the signed-off study that downloads and verifies', async () => {
    const built = bundleSummarySchema.parse(
      (await members.pi.agent.post(`${base()}/studies/${studyId}/bundles`).expect(201)).body,
    );
    expect(built).toMatchObject({ origin: 'built', studyId, sha256: null });
    await waitForRun(testApp, built.runId!, (run) => run.status === 'succeeded');

    const list = bundleListSchema.parse(
      (await members.guest.agent.get(`${base()}/studies/${studyId}/bundles`).expect(200)).body,
    );
    expect(list.bundles).toHaveLength(1);
    const [listed] = list.bundles;
    expect(listed).toMatchObject({ id: built.id, status: 'succeeded', error: null });
    expect(listed.filename).toMatch(/^provenote-bundle-synthetic-sediment-sources-\d{4}-\d{2}-\d{2}\.zip$/);

    const res = await members.guest.agent
      .get(`${base()}/bundles/${built.id}/download`)
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(res.headers['content-type']).toBe('application/zip');
    zip = res.body as Buffer;
    expect(zip.byteLength).toBe(listed.sizeBytes);
    expect(createHash('sha256').update(zip).digest('hex')).toBe(listed.sha256);

    const verification = await verifyBundle(zip);
    expect(verification.problems).toEqual([]);
    expect(verification.ok).toBe(true);
    expect(verification.valuesCompared).toBeGreaterThan(100);
    expect(verification.manifest).toMatchObject({
      runId: assignRunId,
      study: { id: studyId, title: 'Synthetic sediment sources' },
      lab: { id: labId },
      createdBy: { id: members.pi.user.id, name: members.pi.user.displayName },
      parameters: { elements: ['Zr', 'Nb', 'La'], transform: 'ln' },
    });
    expect(verification.manifest!.groups.map((g) => [g.name, g.version, g.n])).toEqual([
      ['North', 1, 12],
      ['South', 1, 12],
      ['East', 1, 12],
    ]);
    const names = (await readZipEntries(zip)).map((entry) => entry.name);
    expect(names).toEqual(
      expect.arrayContaining(['inputs/raw/reference.csv', 'inputs/raw/unknowns.csv', 'results/assignments.csv']),
    );
    const assignments = (await readZipEntries(zip)).find((e) => e.name === 'results/assignments.csv')!;
    expect(assignments.bytes.toString('utf8')).toContain(OVERRIDE_REASON);
    const { signedOffAt } = (
      await testApp.app
        .get(DataSource)
        .query(`SELECT signed_off_at AS "signedOffAt" FROM studies WHERE id = $1`, [studyId])
    )[0] as {
      signedOffAt: Date;
    };
    expect(verification.manifest!.signOff).toMatchObject({
      by: { id: members.pi.user.id, name: members.pi.user.displayName },
      at: signedOffAt.toISOString(),
    });
    const report = (await readZipEntries(zip)).find((e) => e.name === 'report.html')!.bytes.toString('utf8');
    expect(report).toContain(
      `<strong>Signed off</strong> by ${members.pi.user.displayName} on ${signedOffAt.toISOString()}`,
    );
    expect(report).toContain(`${OVERRIDE_REASON} (overridden by ${members.analyst.user.displayName}, `);

    const actions = (await testApp.app
      .get(DataSource)
      .query(`SELECT action FROM audit_events WHERE lab_id = $1 AND action LIKE 'export.%' ORDER BY created_at`, [
        labId,
      ])) as { action: string }[];
    expect(actions.map((a) => a.action)).toEqual(['export.bundle_requested', 'export.bundle_downloaded']);
  });

  it('lets only the PI of the lab build, and only for a signed-off study', async () => {
    await members.analyst.agent.post(`${base()}/studies/${studyId}/bundles`).expect(403);
    const other = await createLabWithMembers(testApp, ['pi'] as const);
    await other.members.pi.agent.post(`${base()}/studies/${studyId}/bundles`).expect(404);
    await other.members.pi.agent.get(`${base()}/studies/${studyId}/bundles`).expect(404);
    const draft: Study = (await members.pi.agent.post(`${base()}/studies`).send({ name: 'Unsigned draft' }).expect(201))
      .body;
    const refused = await members.pi.agent.post(`${base()}/studies/${draft.id}/bundles`).expect(409);
    expect(refused.body.message).toMatch(/Sign the study off first/);
  });

  describe('opening a bundle', () => {
    const tampered: [string, () => Promise<Buffer>, RegExp, string][] = [
      [
        'one digit changed in a result',
        () =>
          rewriteZip(zip, (entries) =>
            entries.map((e) =>
              e.name === 'results/distances.csv'
                ? {
                    ...e,
                    bytes: Buffer.from(
                      e.bytes
                        .toString('utf8')
                        .replace(
                          /(\r\n[^,]+,[^,]+,\d*\.\d)(\d)/,
                          (_, a: string, d: string) => `${a}${(Number(d) + 1) % 10}`,
                        ),
                    ),
                  }
                : e,
            ),
          ),
        /^checksum: changed/,
        'results/distances.csv',
      ],
      [
        'a removed file',
        () => rewriteZip(zip, (entries) => entries.filter((e) => e.name !== 'results/members.csv')),
        /^missing: listed in the manifest/,
        'results/members.csv',
      ],
      [
        'an added file',
        () =>
          rewriteZip(zip, (entries) => [...entries, { name: 'results/extra.csv', bytes: Buffer.from('a\r\n1\r\n') }]),
        /^unexpected: in the archive but not listed/,
        'results/extra.csv',
      ],
      [
        'a path-traversal entry',
        async () => renameEntryBytes(zip, 'README.txt', '../DME.txt'),
        /^unsafe-path: refused/,
        '../DME.txt',
      ],
    ];

    it.each(tampered)('refuses %s with 422 naming the file, and stores nothing', async (_, make, message, path) => {
      const before = await counts();
      const res = await open(members.analyst.agent, await make()).expect(422);
      expect(res.body.message).toMatch(/^The bundle does not verify \(\d+ problems?\); nothing was restored$/);
      expect(res.body.errors).toEqual(expect.arrayContaining([{ path, message: expect.stringMatching(message) }]));
      expect(await counts()).toEqual(before);
    });

    it('refuses a file that is not a zip, and a guest', async () => {
      const res = await open(members.analyst.agent, Buffer.from('not,a,zip\n')).expect(422);
      expect(res.body.errors[0]).toMatchObject({ path: '(archive)', message: expect.stringMatching(/^unreadable/) });
      await open(members.guest.agent, zip).expect(403);
    });

    it('restores a bundle made before results/contributions.csv with empty contributions', async () => {
      const older = await rewriteZip(zip, (entries) =>
        entries
          .filter((e) => e.name !== CONTRIBUTIONS_PATH)
          .map((e) => {
            if (e.name !== MANIFEST_PATH) return e;
            const manifest = JSON.parse(e.bytes.toString('utf8')) as { files: { path: string }[] };
            const files = manifest.files.filter((f) => f.path !== CONTRIBUTIONS_PATH);
            return { ...e, bytes: Buffer.from(JSON.stringify({ ...manifest, files })) };
          }),
      );
      const opened = openedBundleSchema.parse((await open(members.analyst.agent, older).expect(201)).body);
      const restored: Study = (await members.guest.agent.get(`${base()}/studies/${opened.studyId}`).expect(200)).body;
      const runId = restored.steps.find((s) => s.key === 'assign')!.runId;
      const page = (await members.guest.agent.get(`${base()}/runs/${runId}/assignments`).expect(200)).body;
      expect(page.total).toBe(9);
      expect((page.rows as { contributions: number[] }[]).map((row) => row.contributions)).toEqual(
        Array.from({ length: 9 }, () => []),
      );
      await members.guest.agent.get(`${base()}/studies/${opened.studyId}/check-results`).expect(200);
    });

    it('restores a verified bundle as a read-only study that no write route changes', async () => {
      const opened = openedBundleSchema.parse((await open(members.analyst.agent, zip).expect(201)).body);
      expect(opened.verification).toMatchObject({ ok: true, problems: [] });
      expect(opened.studyName).toBe('Synthetic sediment sources (restored bundle)');
      const study = `${base()}/studies/${opened.studyId}`;
      const restored: Study = (await members.guest.agent.get(study).expect(200)).body;
      expect(restored.status).toBe('signed_off');
      const [{ statement }] = await testApp.app
        .get(DataSource)
        .query(`SELECT sign_off_statement AS statement FROM studies WHERE id = $1`, [opened.studyId]);
      // The restored copy is locked by whoever restored it, and quotes the original sign-off.
      expect(statement).toContain(`Signed off there by ${members.pi.user.displayName} at `);
      const assign = restored.steps.find((s) => s.key === 'assign')!;
      expect(assign.status).toBe('current');

      const page = (await members.guest.agent.get(`${base()}/runs/${assign.runId}/assignments`).expect(200)).body;
      const original = (await members.guest.agent.get(`${base()}/runs/${assignRunId}/assignments`).expect(200)).body;
      const strip = (rows: Record<string, unknown>[]) => rows.map(({ contributions: _, ...row }) => row);
      expect(page.total).toBe(9);
      expect(strip(page.rows)).toEqual(strip(original.rows));
      expect(page.groups).toEqual(original.groups);
      const overrides = (await members.guest.agent.get(`${study}/overrides`).expect(200)).body.overrides;
      expect(overrides).toEqual([
        expect.objectContaining({ sampleId: 'UN1', verdict: 'unassigned', reason: OVERRIDE_REASON }),
      ]);
      const bundles = bundleListSchema.parse((await members.guest.agent.get(`${study}/bundles`).expect(200)).body);
      expect(bundles.bundles.map((b) => [b.origin, b.sha256])).toEqual([
        ['uploaded', createHash('sha256').update(zip).digest('hex')],
      ]);

      // The Group check card of the restored study shows the bundle's leave-one-out results and separation.
      expect(restored.steps.find((s) => s.key === 'check')).toMatchObject({ status: 'current' });
      const checked = checkResultsSchema.parse(
        (await members.guest.agent.get(`${study}/check-results?pageSize=200`).expect(200)).body,
      );
      const memberRows = await csvOf(zip, MEMBERS_PATH, MEMBERS_COLUMNS);
      expect(checked.members.total).toBe(36);
      expect(checked.memberCount).toBe(36);
      expect(
        checked.members.rows.map((m) => [
          m.sampleId,
          m.group,
          m.d2,
          m.d2LeaveOneOut,
          m.pHotellingLeaveOneOut,
          m.outcome,
        ]),
      ).toEqual(
        memberRows.map(([id, group, d2, d2Loo, pLoo, verdict]) => [
          id,
          group,
          Number(d2),
          Number(d2Loo),
          Number(pLoo),
          verdict,
        ]),
      );
      const separation = await csvOf(zip, SEPARATION_PATH, SEPARATION_COLUMNS);
      expect(separation).toHaveLength(3);
      // The card names each pair and lists the pairs in name order; the bundle as the check met them.
      const byNames = (a: { groupA: string; groupB: string }, b: { groupA: string; groupB: string }) =>
        a.groupA.localeCompare(b.groupA) || a.groupB.localeCompare(b.groupB);
      expect(checked.pairs).toEqual(
        separation
          .map(([first, second, t2, f, df1, df2, p]) => ({
            groupA: [first, second].sort()[0],
            groupB: [first, second].sort()[1],
            t2: Number(t2),
            f: Number(f),
            df1: Number(df1),
            df2: Number(df2),
            p: Number(p),
          }))
          .sort(byNames),
      );
      // What the CSVs do not carry comes from the engine; it must agree with the original study's check.
      const originalCheck = checkResultsSchema.parse(
        (await members.guest.agent.get(`${base()}/studies/${studyId}/check-results?pageSize=200`).expect(200)).body,
      );
      const { runId: _r, ...restoredRest } = checked;
      const { runId: _o, ...originalRest } = originalCheck;
      expect(restoredRest).toEqual(originalRest);

      // Each unknown carries its contributions to D² to its best group, as results/contributions.csv lists them.
      const contributions = await csvOf(zip, CONTRIBUTIONS_PATH, CONTRIBUTIONS_COLUMNS);
      const un2 = (page.rows as { sampleId: string; group: string; contributions: number[] }[]).find(
        (row) => row.sampleId === 'UN2',
      )!;
      const listed = contributions.filter(([id]) => id === 'UN2');
      expect(listed.map(([, group]) => group)).toEqual(listed.map(() => un2.group));
      expect(un2.contributions).toEqual(listed.map(([, , , value]) => Number(value)));
      expect(un2.contributions).toHaveLength(3);

      const analyst = members.analyst.agent;
      const before = await counts();
      await analyst.patch(study).send({ name: 'Renamed' }).expect(409);
      await analyst
        .put(`${study}/steps/assign`)
        .send({ parameters: { probability: 'chi2', alpha: 0.01 } })
        .expect(409);
      await analyst.post(`${study}/steps/assign/run`).expect(409);
      await analyst
        .post(`${study}/overrides`)
        .send({ sampleId: 'UN2', verdict: 'unassigned', group: null, reason: OVERRIDE_REASON })
        .expect(409);
      await members.pi.agent.post(`${study}/sign-off`).send({}).expect(409);
      await members.pi.agent.delete(study).expect(409);
      expect(await counts()).toEqual(before);
      const after: Study = (await members.guest.agent.get(study).expect(200)).body;
      expect(after).toEqual(restored);
    });
  });
});
