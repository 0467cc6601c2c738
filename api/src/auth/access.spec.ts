import { randomUUID } from 'node:crypto';
import { labRoles } from '@provenote/shared';
import { API_PREFIX } from '../app.factory';
import { createTestApp, type TestApp } from '../../test/test-app';
import { anonymousAgent, createLabWithMembers, type Agent } from '../../test/auth-helpers';
import { LAB_NOT_FOUND } from './access.guard';
import { declaredRoutes, type DeclaredRoute } from './routes';

/** A concrete URL for a route: the lab's id for :labId, fresh uuids for other ids. */
function urlFor(route: DeclaredRoute, labId: string): string {
  return route.path.replace(/:(\w+)/g, (_match, name: string) => (name === 'labId' ? labId : randomUUID()));
}

async function call(agent: Agent, route: DeclaredRoute, url: string) {
  const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  return agent[method](url).send({});
}

/** Answers that mean the guard stopped the request (500: a route without a rule). */
const GUARD_REFUSALS = [401, 403, 500];

const describeRoute = (route: DeclaredRoute) => `${route.method} ${route.path} (${route.handler})`;

describe('access rules of every route, read from the routes themselves', () => {
  let testApp: TestApp;
  let routes: DeclaredRoute[];

  beforeAll(async () => {
    testApp = await createTestApp();
    routes = declaredRoutes(testApp.app, API_PREFIX);
  });
  afterAll(() => testApp.close());

  it('finds the routes, and every one declares @Public(), @SignedIn() or @Roles()', () => {
    expect(routes.map((route) => `${route.method} ${route.path}`)).toEqual(
      expect.arrayContaining(['GET /api/me', 'POST /api/auth/sign-in']),
    );
    expect(routes.filter((route) => route.rule.kind === 'none').map(describeRoute)).toEqual([]);
  });

  it('refuses callers without a session on every route that is not public', async () => {
    const anonymous = await anonymousAgent(testApp);
    const { labId } = await createLabWithMembers(testApp, ['pi']);
    const problems: string[] = [];
    for (const route of routes.filter((r) => r.rule.kind === 'signed-in' || r.rule.kind === 'roles')) {
      const res = await call(anonymous, route, urlFor(route, labId));
      if (res.status !== 401) problems.push(`${describeRoute(route)}: ${res.status} without a session`);
    }
    expect(problems).toEqual([]);
  });

  it('lets a signed-in person past the guard on @SignedIn() routes', async () => {
    const { members } = await createLabWithMembers(testApp, ['guest']);
    const problems: string[] = [];
    for (const route of routes.filter((r) => r.rule.kind === 'signed-in')) {
      const res = await call(members.guest.agent, route, urlFor(route, randomUUID()));
      if (GUARD_REFUSALS.includes(res.status)) problems.push(`${describeRoute(route)}: ${res.status}`);
    }
    expect(problems).toEqual([]);
  });

  it('gives each role exactly the lab-scoped routes it is allowed, and 404 for other labs', async () => {
    const other = await createLabWithMembers(testApp, ['pi']);
    const problems: string[] = [];
    const scoped = routes.filter((r) => r.rule.kind === 'roles');
    expect(scoped.length).toBeGreaterThan(0);
    for (const route of scoped) {
      const allowed = route.rule.kind === 'roles' ? route.rule.roles : [];
      // A lab of its own per route, so that what one route's handler does cannot change the next check.
      const { labId, members } = await createLabWithMembers(testApp);
      for (const role of labRoles) {
        const res = await call(members[role].agent, route, urlFor(route, labId));
        const refusedByGuard =
          GUARD_REFUSALS.includes(res.status) || (res.status === 404 && res.body?.message === LAB_NOT_FOUND);
        if (allowed.includes(role) && refusedByGuard) {
          problems.push(`${describeRoute(route)}: ${role} is allowed but got ${res.status} ${res.body?.message}`);
        }
        if (!allowed.includes(role) && res.status !== 403) {
          problems.push(`${describeRoute(route)}: ${role} is not allowed but got ${res.status}`);
        }
      }
      const outsider = await call(other.members.pi.agent, route, urlFor(route, labId));
      if (outsider.status !== 404 || outsider.body?.message !== LAB_NOT_FOUND) {
        problems.push(`${describeRoute(route)}: a PI of another lab got ${outsider.status}`);
      }
      const malformed = await call(members.pi.agent, route, urlFor(route, 'not-a-lab-id'));
      if (malformed.status !== 404)
        problems.push(`${describeRoute(route)}: a malformed lab id got ${malformed.status}`);
    }
    expect(problems).toEqual([]);
  });

  it('refuses unsafe requests without the CSRF header, even with a valid session', async () => {
    const { members } = await createLabWithMembers(testApp, ['pi']);
    const res = await members.pi.agent.post('/api/auth/sign-out').unset('x-csrf-token');
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/CSRF/);
    await members.pi.agent.get('/api/me').expect(200);
  });
});
