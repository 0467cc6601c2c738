import request from 'supertest';
import { createTestApp, type TestApp } from '../../test/test-app';

describe('GET /api/health', () => {
  let testApp: TestApp;

  beforeAll(async () => {
    testApp = await createTestApp();
  });
  afterAll(() => testApp.close());

  it('reports the database and the queue as reachable', async () => {
    const res = await request(testApp.app.getHttpServer()).get('/api/health').expect(200);
    expect(res.body).toMatchObject({ status: 'ok', database: { ok: true }, queue: { ok: true } });
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });

  it('answers 503 and names the failing service when the database is gone', async () => {
    const broken = await createTestApp();
    await broken.database.drop().catch(() => undefined);
    const res = await request(broken.app.getHttpServer()).get('/api/health').expect(503);
    expect(res.body.status).toBe('degraded');
    expect(res.body.database.ok).toBe(false);
    expect(res.body.queue.ok).toBe(true);
    await broken.app.close();
  });

  it('serves the OpenAPI description', async () => {
    const res = await request(testApp.app.getHttpServer()).get('/api/docs/openapi.json').expect(200);
    expect(res.body.info.title).toBe('Provenote API');
    expect(Object.keys(res.body.paths)).toContain('/api/health');
  });
});
