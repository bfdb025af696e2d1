import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app';
import { anonymous, signIn, DEMO } from '../support/api-client';

let app: TestApp;

beforeAll(async () => {
  // A low limit so the rate-limit test needs few attempts; other tests sign in successfully, which does not count.
  app = await startTestApp({ SIGN_IN_LIMIT: '4', SIGN_IN_WINDOW_SECONDS: '600' });
});
afterAll(async () => {
  await app?.stop();
});

function sessionCookie(res: request.Response): string | undefined {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  return cookies.find((c) => c.startsWith('gaugeline.sid='))?.split(';')[0];
}

describe('CSRF', () => {
  it('refuses a sign-in without the token', async () => {
    const agent = request.agent(app.url);
    await agent.get('/api/session').expect(200);
    const res = await agent.post('/api/session').send({ email: DEMO.engineer, password: 'gaugeline-demo' });
    expect(res.status).toBe(403);
    expect(res.body.error).toBe('auth.csrf');
  });

  it('refuses a state change with a wrong token and accepts the right one', async () => {
    const caller = await signIn(app.url, DEMO.engineer);
    const wrong = await caller.agent.post('/api/projects').set('X-CSRF-Token', 'x'.repeat(caller.csrf.length)).send({ name: 'Nope' });
    expect(wrong.status).toBe(403);
    expect(wrong.body.error).toBe('auth.csrf');
    const none = await caller.agent.post('/api/projects').send({ name: 'Nope' });
    expect(none.status).toBe(403);
    const right = await caller.call('post', '/api/projects', { name: 'CSRF accepted project' });
    expect(right.status).toBe(201);
  });

  it('refuses a request with no session at all', async () => {
    const res = await request(app.url).post('/api/session').set('X-CSRF-Token', 'anything').send({ email: DEMO.admin, password: 'gaugeline-demo' });
    expect(res.status).toBe(403);
  });
});

describe('sign-in', () => {
  it('gives a new session id and a new CSRF token at sign-in', async () => {
    const agent = request.agent(app.url);
    const first = await agent.get('/api/session');
    const before = sessionCookie(first);
    expect(before).toBeDefined();
    const res = await agent.post('/api/session').set('X-CSRF-Token', first.body.csrfToken).send({ email: DEMO.viewer, password: 'gaugeline-demo' });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: DEMO.viewer, role: 'viewer' });
    const after = sessionCookie(res);
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
    expect(res.body.csrfToken).not.toBe(first.body.csrfToken);
  });

  it('answers an unknown e-mail exactly as a wrong password', async () => {
    const a = await anonymous(app.url);
    const unknown = await a.call('post', '/api/session', { email: 'nobody@example.test', password: 'gaugeline-demo' });
    const b = await anonymous(app.url);
    const wrong = await b.call('post', '/api/session', { email: DEMO.admin, password: 'wrong-password' });
    expect(unknown.status).toBe(401);
    expect(wrong.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
    expect(wrong.body.error).toBe('auth.bad-credentials');
  });

  it('validates the request body with field messages', async () => {
    const a = await anonymous(app.url);
    const res = await a.call('post', '/api/session', { email: 'not-an-email' });
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('request.invalid');
    expect(Object.keys(res.body.fields)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('rate-limits repeated failures for one address and e-mail, and not others', async () => {
    const target = 'limited@example.test';
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const a = await anonymous(app.url);
      statuses.push((await a.call('post', '/api/session', { email: target, password: `guess-${i}` })).status);
    }
    expect(statuses.slice(0, 4)).toEqual([401, 401, 401, 401]);
    expect(statuses.slice(4)).toEqual([429, 429]);
    const a = await anonymous(app.url);
    const limited = await a.call('post', '/api/session', { email: target, password: 'x' });
    expect(limited.body.error).toBe('auth.rate-limited');
    // Another account from the same address still signs in.
    await signIn(app.url, DEMO.engineer);
  });

  it('keeps cookies httpOnly and SameSite', async () => {
    const res = await request(app.url).get('/api/session');
    const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('gaugeline.sid='));
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });
});

describe('accounts', () => {
  it('changes a password, then signs in only with the new one', async () => {
    const admin = await signIn(app.url, DEMO.admin);
    const made = await admin.call('post', '/api/users', { email: 'changer@example.test', name: 'Changer', role: 'engineer', password: 'first-password-1' });
    expect(made.status).toBe(201);
    const me = await signIn(app.url, 'changer@example.test', 'first-password-1');
    const short = await me.call('put', '/api/session/password', { currentPassword: 'first-password-1', newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.fields.newPassword).toBeDefined();
    const ok = await me.call('put', '/api/session/password', { currentPassword: 'first-password-1', newPassword: 'second-password-2' });
    expect(ok.status).toBe(204);
    await expect(signIn(app.url, 'changer@example.test', 'first-password-1')).rejects.toThrow(/401/);
    await signIn(app.url, 'changer@example.test', 'second-password-2');
  });

  it('signs out a deactivated person at once and refuses their sign-in', async () => {
    const admin = await signIn(app.url, DEMO.admin);
    const created = await admin.call('post', '/api/users', { email: 'leaver@example.test', name: 'Leaver', role: 'engineer', password: 'leaver-password-1' });
    expect(created.status).toBe(201);
    const leaver = await signIn(app.url, 'leaver@example.test', 'leaver-password-1');
    expect((await leaver.call('get', '/api/projects')).status).toBe(200);
    const off = await admin.call('patch', `/api/users/${created.body.id}`, { active: false });
    expect(off.status).toBe(200);
    expect(off.body.active).toBe(false);
    expect((await leaver.call('get', '/api/projects')).status).toBe(401);
    await expect(signIn(app.url, 'leaver@example.test', 'leaver-password-1')).rejects.toThrow(/401/);
  });

  it('does not let an admin lock themselves out', async () => {
    const admin = await signIn(app.url, DEMO.admin);
    const me = (await admin.call('get', '/api/session')).body.user;
    const res = await admin.call('patch', `/api/users/${me.id}`, { role: 'viewer' });
    expect(res.status).toBe(400);
  });

  it('refuses a second account with the same e-mail', async () => {
    const admin = await signIn(app.url, DEMO.admin);
    const res = await admin.call('post', '/api/users', { email: DEMO.engineer, name: 'Twin', role: 'viewer' });
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('resource.conflict');
  });
});

describe('project visibility', () => {
  it('shows a project only to its members (and admins); others get 404', async () => {
    const engineer = await signIn(app.url, DEMO.engineer);
    const created = await engineer.call('post', '/api/projects', { name: 'Engineer-only project' });
    expect(created.status).toBe(201);
    const id = created.body.id;
    const viewer = await signIn(app.url, DEMO.viewer);
    expect((await viewer.call('get', `/api/projects/${id}`)).status).toBe(404);
    expect((await viewer.call('get', '/api/projects')).body.projects.map((p: { id: number }) => p.id)).not.toContain(id);
    const admin = await signIn(app.url, DEMO.admin);
    expect((await admin.call('get', `/api/projects/${id}`)).status).toBe(200);
    const viewerId = (await viewer.call('get', '/api/session')).body.user.id;
    expect((await admin.call('put', `/api/projects/${id}/members/${viewerId}`)).status).toBe(204);
    expect((await viewer.call('get', `/api/projects/${id}`)).status).toBe(200);
    const members = await viewer.call('get', `/api/projects/${id}/members`);
    expect(members.body.members.map((m: { email: string }) => m.email).sort()).toEqual([DEMO.engineer, DEMO.viewer].sort());
    // Still read-only for the viewer.
    expect((await viewer.call('patch', `/api/projects/${id}`, { name: 'Renamed' })).status).toBe(403);
  });

  it('answers 404 for ids that are not numbers or do not exist', async () => {
    const admin = await signIn(app.url, DEMO.admin);
    expect((await admin.call('get', '/api/projects/abc')).status).toBe(404);
    expect((await admin.call('get', '/api/projects/999999')).status).toBe(404);
  });
});
