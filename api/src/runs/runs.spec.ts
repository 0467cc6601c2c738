import { DataSource } from 'typeorm';
import { applyTransform, fitGroup, squaredDistance, type RunEvent } from '@provenote/shared';
import { createLabWithMembers, mailTo, type SignedInMember } from '../../test/auth-helpers';
import { classifyRequest, FIXTURE_ELEMENTS } from '../../test/run-fixtures';
import { waitForRun } from '../../test/run-waits';
import { createTestApp, type TestApp } from '../../test/test-app';
import { RunEventsRelay } from './run-events.relay';
import { RunsService } from './runs.service';

describe('runs over HTTP with embedded workers (real PostgreSQL and Redis)', () => {
  let testApp: TestApp;
  let labId: string;
  let members: Record<'pi' | 'analyst' | 'student' | 'guest', SignedInMember>;

  beforeAll(async () => {
    testApp = await createTestApp({ QUEUE_LOCK_MS: '2000' });
    ({ labId, members } = await createLabWithMembers(testApp));
  });
  afterAll(() => testApp.close());

  const runs = () => `/api/labs/${labId}/runs`;

  it('runs a classification to the end, with progress events, and pages its results', async () => {
    const request = classifyRequest(900);
    const res = await members.student.agent.post(runs()).send(request).expect(201);
    expect(res.body).toMatchObject({ kind: 'classify', status: 'queued', attempt: 0, error: null });
    const runId: string = res.body.id;

    const stream = await members.guest.agent
      .get(`${runs()}/${runId}/events`)
      .buffer(true)
      .parse((response, done) => {
        let text = '';
        response.on('data', (chunk: Buffer) => (text += chunk.toString()));
        response.on('end', () => done(null, text));
      });
    const events = (stream.body as string)
      .split('\n')
      .filter((line) => line.startsWith('data: '))
      .map((line) => JSON.parse(line.slice(6)) as RunEvent);
    expect(events.at(-1)).toMatchObject({ status: 'succeeded', progress: 1, attempt: 1 });
    const progress = events.filter((e) => e.status === 'running').map((e) => e.progress);
    expect(progress.length).toBeGreaterThan(0);
    expect(progress).toEqual([...progress].sort((a, b) => a - b));

    // The person who started the run is told, in the lab's outbox, with a link back to the lab.
    const mail = await mailTo(testApp, members.student.user.email, /assignment run has finished/);
    expect(mail.text).toContain(`${testApp.config.PUBLIC_URL}/labs/${labId}`);
    expect(mail.text).toContain('not proof of its origin');

    const page = await members.guest.agent
      .get(`${runs()}/${runId}/assignments?sort=probability&order=desc`)
      .expect(200);
    expect(page.body.total).toBe(900);
    expect(page.body.rows).toHaveLength(50);
    expect(page.body.groups.map((g: { name: string }) => g.name)).toEqual(['north-pit', 'river-terrace', 'upland']);
    const probabilities = page.body.rows.map((row: { probability: number }) => row.probability);
    expect(probabilities).toEqual([...probabilities].sort((a, b) => b - a));

    // The stored row of one unknown holds its own distances: recomputed here from the same inputs.
    const target = request.unknowns[417];
    const found = await members.guest.agent.get(`${runs()}/${runId}/assignments?search=${target.sampleId}`).expect(200);
    expect(found.body.total).toBe(1);
    const row = found.body.rows[0];
    const ln = (rows: number[][]) => applyTransform(rows, FIXTURE_ELEMENTS, { transform: 'ln' });
    const groupName = 'river-terrace';
    const members_ = request.reference.filter((s) => s.group === groupName).map((s) => s.values);
    const model = fitGroup(groupName, ln(members_).values, ln(members_).variables);
    const expected = squaredDistance(model.cholesky.lower, ln([target.values]).values[0], model.mean);
    expect(row.d2[1]).toBeCloseTo(expected, 9);
    expect(row.contributions.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(
      row.d2[page.body.groups.findIndex((g: { name: string }) => g.name === row.group)],
      9,
    );

    const filtered = await members.guest.agent
      .get(`${runs()}/${runId}/assignments?verdict=assigned&page=2`)
      .expect(200);
    expect(filtered.body.rows.every((r: { verdict: string }) => r.verdict === 'assigned')).toBe(true);
  });

  it('fails a run whose group is too small with a reason naming the group, without retrying', async () => {
    const request = classifyRequest(10);
    request.reference = request.reference
      .filter((s) => s.group !== 'upland')
      .concat(request.reference.filter((s) => s.group === 'upland').slice(0, 3));
    const res = await members.analyst.agent.post(runs()).send(request).expect(201);
    const run = await waitForRun(testApp, res.body.id, (r) => r.status === 'failed');
    expect(run.attempt).toBe(1);
    const body = (await members.analyst.agent.get(`${runs()}/${res.body.id}`).expect(200)).body;
    expect(body.error).toMatch(/group "upland" has n = 3 members on p = 3 variables/);
  });

  it('cancels a running classification at a checkpoint and keeps no results', async () => {
    const relay = testApp.app.get(RunEventsRelay);
    // Too large for a JSON body: created through the service, as the data-import path will.
    const created = await testApp.app
      .get(RunsService)
      .create(labId, members.pi.user.id, 'pi', classifyRequest(200_000));
    const runId = created.id;
    const seen: RunEvent[] = [];
    const subscription = relay.events(runId).subscribe((event) => seen.push(event));
    await waitForRun(testApp, runId, (r) => r.status === 'running', 20_000);
    await members.pi.agent.post(`${runs()}/${runId}/cancel`).expect(201);
    await waitForRun(testApp, runId, (r) => r.status === 'cancelled');
    subscription.unsubscribe();
    expect(seen.at(-1)?.status).toBe('cancelled');
    const [{ count }] = await testApp.app
      .get(DataSource)
      .query(`SELECT count(*)::int AS count FROM run_assignments WHERE run_id = $1`, [runId]);
    expect(count).toBe(0);
    await members.pi.agent.post(`${runs()}/${runId}/cancel`).expect(409);
  });

  it('lets students assign and check groups, guests only read, and validates the inputs', async () => {
    const { reference, parameters } = classifyRequest(1);
    await members.student.agent.post(runs()).send({ kind: 'group-check', parameters, reference }).expect(201);
    await members.guest.agent.post(runs()).send({ kind: 'group-check', parameters, reference }).expect(403);
    await members.guest.agent.post(runs()).send(classifyRequest(1)).expect(403);
    const bad = classifyRequest(2);
    bad.unknowns[1].values = [1, 2];
    const res = await members.analyst.agent.post(runs()).send(bad).expect(400);
    expect(res.body.errors[0].message).toMatch(/needs exactly 3 values/);
    const list = await members.guest.agent.get(runs()).expect(200);
    expect(list.body.runs.length).toBeGreaterThanOrEqual(3);
  });

  it('runs a group check: leave-one-out members and pairwise separation', async () => {
    const { reference, parameters } = classifyRequest(1);
    const res = await members.analyst.agent
      .post(runs())
      .send({ kind: 'group-check', parameters, reference })
      .expect(201);
    await waitForRun(testApp, res.body.id, (r) => r.status === 'succeeded');
    const dataSource = testApp.app.get(DataSource);
    const [{ count }] = await dataSource.query(
      `SELECT count(*)::int AS count FROM run_check_members WHERE run_id = $1`,
      [res.body.id],
    );
    expect(count).toBe(reference.length);
    const pairs = await dataSource.query(
      `SELECT group_a, group_b, p FROM run_check_pairs WHERE run_id = $1 ORDER BY 1, 2`,
      [res.body.id],
    );
    expect(pairs).toHaveLength(3);
  });
});
