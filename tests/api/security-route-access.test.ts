// Every route the app registers, against every role and a signed-out caller: allowed and
// refused. The table is complete by construction: the app's router stack is listed and a
// registered route without a row here (or a row for a route that no longer exists) fails.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startTestApp, type TestApp } from '../support/test-app';
import { anonymous, signIn, DEMO, type Caller } from '../support/api-client';
import { importEnded, uploadFile } from '../support/imports';
import { registeredRoutes } from '../support/registered-routes';
import { waitFor } from '../support/wait-for';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));

type Who = 'anon' | 'viewer' | 'engineer' | 'admin';
const WHO: Who[] = ['anon', 'viewer', 'engineer', 'admin'];

interface Ids {
  projectId: number;
  userId: number;
  modelId: number;
  revisionId: number;
  globalId: string;
  format: string;
  mailId: number;
  splat: string;
}

interface RouteCase {
  /** The registered route, "METHOD /path/:param" exactly as the router has it. */
  route: string;
  /** The URL to call; by default the route's path with its parameters filled from the ids. */
  path?: (ids: Ids) => string;
  body?: (who: Who) => unknown;
  /** Runs before each caller's request (for routes whose success needs a precondition). */
  before?: (ids: Ids) => Promise<void>;
  /** Use a new caller of that role for this row (for routes that end the caller's session). */
  fresh?: boolean;
  /** Upload a file (multipart) instead of sending a JSON body. */
  upload?: () => { name: string; bytes: Buffer };
  expect: Record<Who, number>;
}

let app: TestApp;
let callers: Record<Who, Caller>;
const ids: Ids = { projectId: 0, userId: 0, modelId: 0, revisionId: 0, globalId: '', format: 'csv', mailId: 0, splat: 'projects' };
let counter = 0;

const all = (status: number): Record<Who, number> => ({ anon: status, viewer: status, engineer: status, admin: status });
const readers = { anon: 401, viewer: 200, engineer: 200, admin: 200 };
const writers = (ok: number) => ({ anon: 401, viewer: 403, engineer: ok, admin: ok });
const adminOnly = (ok: number) => ({ anon: 401, viewer: 403, engineer: 403, admin: ok });
const REV = '/api/projects/:projectId/revisions/:revisionId';

const ROUTES: RouteCase[] = [
  { route: 'GET /api/health', expect: all(200) },

  { route: 'GET /api/session', expect: all(200) },
  {
    route: 'POST /api/session',
    // A wrong password: reachable by everyone, and it grants nothing.
    body: (who) => ({ email: who === 'anon' ? DEMO.engineer : DEMO[who], password: 'not-the-password' }),
    expect: all(401),
  },
  { route: 'DELETE /api/session', fresh: true, expect: all(200) },
  // Reachable signed out (a forgotten password); the answer never says whether the account exists.
  { route: 'POST /api/session/password-reset', body: (who) => ({ email: `nobody-${who}-${++counter}@example.test` }), expect: all(202) },
  { route: 'POST /api/session/password-token', body: () => ({ token: 'x'.repeat(40), newPassword: 'a-new-password-123' }), expect: all(400) },
  {
    route: 'PUT /api/session/password',
    // A wrong current password: proves the route is reachable without changing demo passwords.
    body: () => ({ currentPassword: 'not-the-password', newPassword: 'a-new-password-123' }),
    expect: { anon: 401, viewer: 400, engineer: 400, admin: 400 },
  },

  { route: 'GET /api/users', expect: adminOnly(200) },
  {
    route: 'POST /api/users',
    body: (who) => ({ email: `made-by-${who}-${++counter}@example.test`, name: 'Made in a test', role: 'viewer', password: 'long-enough-password' }),
    expect: adminOnly(201),
  },
  { route: 'PATCH /api/users/:userId', body: () => ({ name: `Spare ${++counter}` }), expect: adminOnly(200) },
  { route: 'POST /api/users/:userId/invitation', expect: adminOnly(202) },

  { route: 'GET /api/mail', expect: adminOnly(200) },
  { route: 'GET /api/mail/:mailId', expect: adminOnly(200) },
  // The message was sent already (the local mail sink takes it at once): the admin is told so.
  { route: 'POST /api/mail/:mailId/retry', expect: adminOnly(409) },

  { route: 'GET /api/projects', expect: readers },
  { route: 'POST /api/projects', body: (who) => ({ name: `Access test ${who} ${++counter}` }), expect: writers(201) },
  { route: 'GET /api/projects/:projectId', expect: readers },
  { route: 'PATCH /api/projects/:projectId', body: () => ({ description: `changed ${++counter}` }), expect: writers(200) },
  { route: 'GET /api/projects/:projectId/members', expect: readers },
  { route: 'PUT /api/projects/:projectId/members/:userId', expect: adminOnly(204) },
  {
    route: 'DELETE /api/projects/:projectId/members/:userId',
    before: async (i) => {
      await callers.admin.call('put', `/api/projects/${i.projectId}/members/${i.userId}`);
    },
    expect: adminOnly(204),
  },

  // The project log: the project's engineers and admins; its viewers are refused.
  { route: 'GET /api/projects/:projectId/audit', expect: writers(200) },

  { route: 'GET /api/projects/:projectId/models', expect: readers },
  { route: 'GET /api/projects/:projectId/models/:modelId/revisions', expect: readers },
  { route: 'GET /api/projects/:projectId/revisions/:revisionId', expect: readers },
  {
    route: 'POST /api/projects/:projectId/uploads',
    // Distinct bytes each time, so each accepted upload is a new revision (its job fails fast).
    upload: () => ({ name: 'access.ifc', bytes: Buffer.from(`ISO-10303-21;\n/* access test ${++counter} */\n`) }),
    expect: writers(201),
  },

  { route: `GET ${REV}/members`, expect: readers },
  { route: `GET ${REV}/overview`, expect: readers },
  { route: `GET ${REV}/members/:globalId`, expect: readers },
  { route: `GET ${REV}/members/:globalId/audit`, expect: readers },
  {
    route: `PATCH ${REV}/members/:globalId/overrides`,
    body: () => ({ designForceN: 1000 * ++counter, reason: 'route access test' }),
    expect: writers(200),
  },
  {
    route: `POST ${REV}/forces`,
    body: () => ({ csv: `GlobalId,LoadCase,N [kN]\n${ids.globalId},Access ${++counter},12.5\n` }),
    expect: writers(200),
  },
  { route: `GET ${REV}/exports/:format`, expect: writers(200) },
  { route: `GET ${REV}/geometry`, expect: readers },
  { route: `GET ${REV}/member-columns`, expect: readers },
  { route: `GET ${REV}/comparison`, path: (i) => `/api/projects/${i.projectId}/revisions/${i.revisionId}/comparison?with=${i.revisionId}`, expect: readers },
  {
    route: `POST ${REV}/send-critical`,
    body: () => ({ recipients: ['route.test@example.test'], minUtilisation: 0, attach: ['csv'] }),
    expect: writers(202),
  },

  // The built client: any other GET serves the app shell (the client decides what to show).
  { route: 'GET /{*splat}', expect: all(200) },
];

/** Calls outside any registered API route: the API answers 404 in JSON, never the app shell. */
const UNREGISTERED: { method: 'get' | 'post'; path: string; expect: Record<Who, number> }[] = [
  { method: 'get', path: '/api/no-such-route', expect: all(404) },
  { method: 'post', path: '/api/no-such-route', expect: all(404) },
];

function fill(route: string, i: Ids): string {
  const pattern = route.slice(route.indexOf(' ') + 1);
  return pattern.replace(/\{\*(\w+)\}|:(\w+)/g, (_m, splat: string | undefined, key: string | undefined) => encodeURIComponent(String(i[(splat ?? key) as keyof Ids])));
}

async function freshCaller(who: Who): Promise<Caller> {
  return who === 'anon' ? anonymous(app.url) : signIn(app.url, DEMO[who]);
}

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  callers = {
    anon: await anonymous(app.url),
    viewer: await signIn(app.url, DEMO.viewer),
    engineer: await signIn(app.url, DEMO.engineer),
    admin: await signIn(app.url, DEMO.admin),
  };
  const projects = await callers.admin.call('get', '/api/projects');
  ids.projectId = projects.body.projects[0].id;
  const spare = await callers.admin.call('post', '/api/users', { email: 'spare@example.test', name: 'Spare person', role: 'viewer' });
  ids.userId = spare.body.id;
  // Creating a person without a password sends an invitation: a message in the outbox.
  const outbox = await callers.admin.call('get', '/api/mail');
  if (outbox.status === 200 && outbox.body.messages.length) {
    ids.mailId = outbox.body.messages[0].id;
    await waitFor(() => callers.admin.call('get', `/api/mail/${ids.mailId}`), (r) => r.body.status === 'sent', 20_000);
  }
  const up = await uploadFile(callers.engineer, ids.projectId, SAMPLE, 'kestrel-yard-shed.ifc', 'Access shed');
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  ids.revisionId = up.body.revision.id;
  const done = await importEnded(callers.engineer, ids.projectId, ids.revisionId);
  expect(done.body.status, JSON.stringify(done.body.failure)).toBe('done');
  ids.modelId = (await callers.engineer.call('get', `/api/projects/${ids.projectId}/models`)).body.models[0].id;
  const members = await callers.engineer.call('get', `/api/projects/${ids.projectId}/revisions/${ids.revisionId}/members?pageSize=1`);
  ids.globalId = members.body.members[0].globalId;
}, 120_000);

afterAll(async () => {
  await app?.stop();
});

describe('the route table is complete', () => {
  it('has a row for every registered route, and no row for a route that does not exist', () => {
    const registered = registeredRoutes(app.server.config);
    const tabled = new Set(ROUTES.map((r) => r.route));
    const missing = registered.filter((r) => !tabled.has(r));
    const stale = [...tabled].filter((r) => !registered.includes(r));
    // A new route? Add a row to ROUTES above with the status each role should get.
    expect(missing, 'registered routes without a row in the access table').toEqual([]);
    expect(stale, 'rows for routes the app does not register').toEqual([]);
    expect(registered.length).toBeGreaterThanOrEqual(30);
  });
});

describe('route access by role', () => {
  for (const route of ROUTES) {
    for (const who of WHO) {
      it(`${route.route} as ${who} → ${route.expect[who]}`, async () => {
        await route.before?.(ids);
        const caller = route.fresh ? await freshCaller(who) : callers[who];
        const url = route.path?.(ids) ?? fill(route.route, ids);
        const method = route.route.slice(0, route.route.indexOf(' ')).toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
        let res;
        if (route.upload) {
          const file = route.upload();
          res = await caller.agent.post(url).set('X-CSRF-Token', caller.csrf).attach('file', file.bytes, file.name);
        } else {
          res = await caller.call(method, url, route.body?.(who));
        }
        expect(res.status, `${url}: ${JSON.stringify(res.body)}`).toBe(route.expect[who]);
        if (res.status >= 400) {
          expect(res.headers['content-type']).toMatch(/^application\/json/);
          expect(typeof res.body.error).toBe('string');
          expect(typeof res.body.message).toBe('string');
        }
      });
    }
  }

  for (const call of UNREGISTERED) {
    for (const who of WHO) {
      it(`${call.method.toUpperCase()} ${call.path} (not a route) as ${who} → ${call.expect[who]}`, async () => {
        const res = await callers[who].call(call.method, call.path, call.method === 'post' ? {} : undefined);
        expect(res.status).toBe(call.expect[who]);
        expect(res.headers['content-type']).toMatch(/^application\/json/);
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
