import bcrypt from 'bcryptjs';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { BCRYPT_ROUNDS } from '../../src/auth/passwords';
import { UPLOADS_PER_USER_PER_HOUR } from '../../src/datasets/dataset-files.service';
import { anonymousAgent, createLabWithMembers, mailTo, tokenFromLink } from '../auth-helpers';
import { createTestApp, type TestApp } from '../test-app';

// Plain http: the session and CSRF cookies are Secure under https, and supertest speaks http.
const PUBLIC_URL = 'http://provenote.lab.test:8080';
const unique = () => Math.random().toString(36).slice(2, 10);

describe('passwords at rest, security headers, CORS and rate limits', () => {
  let testApp: TestApp;

  beforeAll(async () => {
    testApp = await createTestApp({ PUBLIC_URL, WORKERS: 'external' });
  });
  afterAll(() => testApp.close());

  it('stores a signed-up password only as a bcrypt hash, in no table as plain text', async () => {
    const email = `hash-${unique()}@test.provenote.test`;
    const password = `plain secret ${unique()}`;
    const agent = await anonymousAgent(testApp);
    await agent.post('/api/auth/sign-up').send({ email, displayName: 'Ana Ruiz', password, labName: 'Tuff lab' });
    const token = tokenFromLink(testApp, await mailTo(testApp, email, /Confirm/), '/confirm-sign-up');
    await agent.post('/api/auth/sign-up/confirm').send({ token }).expect(200);

    const dataSource = testApp.app.get(DataSource);
    const [user] = (await dataSource.query(`SELECT password_hash FROM users WHERE email = $1`, [email])) as {
      password_hash: string;
    }[];
    expect(user.password_hash).toMatch(/^\$2[aby]\$\d{2}\$/);
    expect(bcrypt.getRounds(user.password_hash)).toBe(BCRYPT_ROUNDS);
    expect(await bcrypt.compare(password, user.password_hash)).toBe(true);

    const tables = (
      (await dataSource.query(`SELECT table_name FROM information_schema.tables WHERE table_schema = 'public'`)) as {
        table_name: string;
      }[]
    ).map((row) => row.table_name);
    for (const table of tables) {
      const [hit] = (await dataSource.query(
        `SELECT count(*)::int AS n FROM "${table}" t WHERE strpos(t::text, $1) > 0`,
        [password],
      )) as { n: number }[];
      expect([table, hit.n]).toEqual([table, 0]);
    }
  });

  it('sends helmet’s security headers and a strict content security policy', async () => {
    const res = await request(testApp.app.getHttpServer()).get('/api/health').expect(200);
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    expect(res.headers['cross-origin-opener-policy']).toBe('same-origin');
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
  });

  it('allows cross-origin calls from the app’s own origin only', async () => {
    const server = testApp.app.getHttpServer();
    const preflight = (origin: string) =>
      request(server)
        .options('/api/me')
        .set('Origin', origin)
        .set('Access-Control-Request-Method', 'GET')
        .set('Access-Control-Request-Headers', 'x-csrf-token');
    const own = await preflight(PUBLIC_URL);
    expect(own.headers['access-control-allow-origin']).toBe(PUBLIC_URL);
    expect(own.headers['access-control-allow-credentials']).toBe('true');
    // The allowed origin is fixed, never the caller's reflected back nor "*": a browser on any other
    // origin sees a header that does not name it, and refuses the answer to the page.
    for (const origin of ['https://evil.example', 'http://provenote.lab.test', 'http://provenote.lab.test:8080.evil']) {
      const other = await preflight(origin);
      expect([origin, other.headers['access-control-allow-origin']]).toEqual([origin, PUBLIC_URL]);
    }
    const get = await request(server).get('/api/health').set('Origin', 'https://evil.example');
    expect(get.headers['access-control-allow-origin']).toBe(PUBLIC_URL);
  });

  it('limits sign-ups per address', async () => {
    const agent = await anonymousAgent(testApp);
    const email = `again-${unique()}@test.provenote.test`;
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      const res = await agent
        .post('/api/auth/sign-up')
        .send({ email, displayName: 'Repeat', password: 'a long enough secret', labName: `Lab ${i}` });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([202, 202, 202, 429]);
  });

  it('limits uploads per person, and a limited person’s uploads write nothing', async () => {
    const { labId, members } = await createLabWithMembers(testApp, ['student', 'analyst']);
    const url = `/api/labs/${labId}/dataset-files`;
    const csv = Buffer.from('Sample,Zr ppm\nR-1,5\n');
    for (let i = 0; i < UPLOADS_PER_USER_PER_HOUR; i++) {
      await members.student.agent.post(url).attach('file', csv, `r${i}.csv`).expect(201);
    }
    const dataSource = testApp.app.get(DataSource);
    const count = async () =>
      (
        (await dataSource.query(`SELECT count(*)::int AS n FROM dataset_files WHERE lab_id = $1`, [labId])) as {
          n: number;
        }[]
      )[0].n;
    const before = await count();
    const blocked = await members.student.agent.post(url).attach('file', csv, 'one-more.csv');
    expect(blocked.status).toBe(429);
    expect(blocked.body.message).toMatch(/Too many attempts/);
    expect(await count()).toBe(before);
    // The limit is the person's, not the lab's.
    await members.analyst.agent.post(url).attach('file', csv, 'colleague.csv').expect(201);
  }, 60_000);
});
