// Every API route against every role and a signed-out caller: allowed and refused.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app';
import { anonymous, signIn, DEMO, type Caller } from '../support/api-client';

type Who = 'anon' | 'viewer' | 'engineer' | 'admin';
const WHO: Who[] = ['anon', 'viewer', 'engineer', 'admin'];

interface RouteCase {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: (ids: Ids) => string;
  body?: (who: Who) => unknown;
  /** Runs before each caller's request (for routes whose success needs a precondition). */
  before?: (ids: Ids) => Promise<void>;
  expect: Record<Who, number>;
}
interface Ids {
  demoProject: number;
  spareUser: number;
}

let app: TestApp;
let callers: Record<Who, Caller>;
const ids: Ids = { demoProject: 0, spareUser: 0 };
let counter = 0;

const ROUTES: RouteCase[] = [
  { method: 'get', path: () => '/api/health', expect: { anon: 200, viewer: 200, engineer: 200, admin: 200 } },
  { method: 'get', path: () => '/api/session', expect: { anon: 200, viewer: 200, engineer: 200, admin: 200 } },
  {
    method: 'put',
    path: () => '/api/session/password',
    // A wrong current password: proves the route is reachable without changing demo passwords.
    body: () => ({ currentPassword: 'not-the-password', newPassword: 'a-new-password-123' }),
    expect: { anon: 401, viewer: 400, engineer: 400, admin: 400 },
  },
  { method: 'get', path: () => '/api/projects', expect: { anon: 401, viewer: 200, engineer: 200, admin: 200 } },
  {
    method: 'post',
    path: () => '/api/projects',
    body: (who) => ({ name: `Access test ${who} ${++counter}` }),
    expect: { anon: 401, viewer: 403, engineer: 201, admin: 201 },
  },
  { method: 'get', path: (i) => `/api/projects/${i.demoProject}`, expect: { anon: 401, viewer: 200, engineer: 200, admin: 200 } },
  {
    method: 'patch',
    path: (i) => `/api/projects/${i.demoProject}`,
    body: () => ({ description: `changed ${++counter}` }),
    expect: { anon: 401, viewer: 403, engineer: 200, admin: 200 },
  },
  { method: 'get', path: (i) => `/api/projects/${i.demoProject}/members`, expect: { anon: 401, viewer: 200, engineer: 200, admin: 200 } },
  {
    method: 'put',
    path: (i) => `/api/projects/${i.demoProject}/members/${i.spareUser}`,
    expect: { anon: 401, viewer: 403, engineer: 403, admin: 204 },
  },
  {
    method: 'delete',
    path: (i) => `/api/projects/${i.demoProject}/members/${i.spareUser}`,
    before: async (i) => {
      await callers.admin.call('put', `/api/projects/${i.demoProject}/members/${i.spareUser}`);
    },
    expect: { anon: 401, viewer: 403, engineer: 403, admin: 204 },
  },
  { method: 'get', path: () => '/api/users', expect: { anon: 401, viewer: 403, engineer: 403, admin: 200 } },
  {
    method: 'post',
    path: () => '/api/users',
    body: (who) => ({ email: `made-by-${who}-${++counter}@example.test`, name: 'Made in a test', role: 'viewer', password: 'long-enough-password' }),
    expect: { anon: 401, viewer: 403, engineer: 403, admin: 201 },
  },
  {
    method: 'patch',
    path: (i) => `/api/users/${i.spareUser}`,
    body: () => ({ name: `Spare ${++counter}` }),
    expect: { anon: 401, viewer: 403, engineer: 403, admin: 200 },
  },
  { method: 'get', path: () => '/api/no-such-route', expect: { anon: 404, viewer: 404, engineer: 404, admin: 404 } },
];

beforeAll(async () => {
  app = await startTestApp();
  callers = {
    anon: await anonymous(app.url),
    viewer: await signIn(app.url, DEMO.viewer),
    engineer: await signIn(app.url, DEMO.engineer),
    admin: await signIn(app.url, DEMO.admin),
  };
  const projects = await callers.admin.call('get', '/api/projects');
  ids.demoProject = projects.body.projects[0].id;
  const spare = await callers.admin.call('post', '/api/users', { email: 'spare@example.test', name: 'Spare person', role: 'viewer' });
  ids.spareUser = spare.body.id;
});

afterAll(async () => {
  await app?.stop();
});

describe('route access by role', () => {
  for (const route of ROUTES) {
    for (const who of WHO) {
      const label = `${route.method.toUpperCase()} ${route.path({ demoProject: 1, spareUser: 2 }).replace(/\d+/g, ':id')} as ${who} → ${route.expect[who]}`;
      it(label, async () => {
        await route.before?.(ids);
        const res = await callers[who].call(route.method, route.path(ids), route.body?.(who));
        expect(res.status, JSON.stringify(res.body)).toBe(route.expect[who]);
        if (res.status >= 400) {
          expect(typeof res.body.error).toBe('string');
          expect(typeof res.body.message).toBe('string');
        }
      });
    }
  }

  it('DELETE /api/session signs out every role', async () => {
    for (const email of Object.values(DEMO)) {
      const caller = await signIn(app.url, email);
      const out = await caller.call('delete', '/api/session');
      expect(out.status).toBe(200);
      expect(out.body.user).toBeNull();
      const after = await caller.agent.get('/api/projects');
      expect(after.status).toBe(401);
    }
  });
});
