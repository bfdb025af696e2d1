// Security headers on every kind of response (API data, API errors, the app shell, static
// assets), and the session guarantees session-security.test.ts does not already cover:
// a signed-out session cookie is dead on the server, and a pre-sign-in cookie gains nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app';
import { anonymous, signIn, DEMO } from '../support/api-client';
import { DEMO_PASSWORD } from '../../server/db/seed/demo-seed';
import { ERROR_IDS } from '@shared/api/errors';
import { loadConfig } from '../../server/config/config';

let app: TestApp;

beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app?.stop();
});

/** CSP directives by name, each a list of sources. */
function csp(header: string | undefined): Map<string, string[]> {
  const out = new Map<string, string[]>();
  for (const part of (header ?? '').split(';')) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name) out.set(name.toLowerCase(), sources);
  }
  return out;
}

function expectSecurityHeaders(res: request.Response, what: string) {
  const h = res.headers;
  expect(h['x-powered-by'], what).toBeUndefined();
  expect(h['x-content-type-options'], what).toBe('nosniff');
  expect(h['x-frame-options'], what).toBe('SAMEORIGIN');
  expect(h['referrer-policy'], what).toBe('no-referrer');
  expect(h['strict-transport-security'], what).toMatch(/max-age=\d+/);
  expect(h['cross-origin-opener-policy'], what).toBe('same-origin');
  const policy = csp(h['content-security-policy']);
  // Scripts: this origin, plus WebAssembly compilation for web-ifc and three; nothing wider.
  expect(policy.get('script-src'), what).toEqual(["'self'", "'wasm-unsafe-eval'"]);
  expect(policy.get('default-src'), what).toEqual(["'self'"]);
  expect(policy.get('object-src'), what).toEqual(["'none'"]);
  expect(policy.get('base-uri'), what).toEqual(["'self'"]);
  expect(policy.get('form-action'), what).toEqual(["'self'"]);
  expect(policy.get('frame-ancestors'), what).toEqual(["'self'"]);
  expect(policy.get('script-src-attr'), what).toEqual(["'none'"]);
  for (const [name, sources] of policy) {
    if (/^(script|default|worker)-src/.test(name)) {
      expect(sources, `${what}: ${name}`).not.toContain("'unsafe-inline'");
      expect(sources, `${what}: ${name}`).not.toContain("'unsafe-eval'");
      expect(sources, `${what}: ${name}`).not.toContain('*');
      expect(sources.some((s) => /^(https?:|data:|blob:)$/.test(s) && name !== 'worker-src'), `${what}: ${name}`).toBe(false);
    }
  }
}

describe('security headers', () => {
  it('are on API data, API errors and the health probe', async () => {
    const caller = await signIn(app.url, DEMO.viewer);
    expectSecurityHeaders(await caller.agent.get('/api/projects'), 'GET /api/projects');
    expectSecurityHeaders(await request(app.url).get('/api/projects'), '401');
    expectSecurityHeaders(await request(app.url).post('/api/projects').send({}), '403 csrf');
    expectSecurityHeaders(await caller.agent.get('/api/no-such-route'), '404');
    expectSecurityHeaders(await caller.call('post', '/api/projects', '{not json'), '400');
    expectSecurityHeaders(await request(app.url).get('/api/health'), 'health');
  });

  it('are on the app shell and on static assets', async () => {
    const shell = await request(app.url).get('/projects/1');
    expect(shell.status).toBe(200);
    expect(shell.headers['content-type']).toMatch(/^text\/html/);
    expectSecurityHeaders(shell, 'app shell');
    // The shell loads its scripts from files only (no inline script the policy would have to allow).
    expect(shell.text).not.toMatch(/<script(?![^>]*\bsrc=)[^>]*>/i);
    const asset = /<script[^>]*src="([^"]+)"/i.exec(shell.text)?.[1];
    expect(asset).toBeDefined();
    const js = await request(app.url).get(asset!);
    expect(js.status).toBe(200);
    expect(js.headers['content-type']).toMatch(/javascript/);
    expectSecurityHeaders(js, 'asset');
  });

  it('API responses are JSON, also for errors, so a browser never renders them as a page', async () => {
    const anon = await anonymous(app.url);
    for (const res of [await anon.agent.get('/api/session'), await anon.agent.get('/api/projects'), await anon.agent.get('/api/users/1')]) {
      expect(res.headers['content-type']).toMatch(/^application\/json/);
    }
  });
});

describe('session cookies', () => {
  function sessionCookie(res: request.Response): string | undefined {
    return ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('gaugeline.sid='))?.split(';')[0];
  }

  it('after sign-out, replaying the old session cookie gets 401', async () => {
    const agent = request.agent(app.url);
    const first = await agent.get('/api/session');
    const signedIn = await agent.post('/api/session').set('X-CSRF-Token', first.body.csrfToken).send({ email: DEMO.engineer, password: DEMO_PASSWORD });
    const cookie = sessionCookie(signedIn)!;
    expect(cookie).toBeDefined();
    // The cookie works on its own (no agent, no jar)…
    expect((await request(app.url).get('/api/projects').set('Cookie', cookie)).status).toBe(200);
    const out = await agent.delete('/api/session').set('X-CSRF-Token', signedIn.body.csrfToken);
    expect(out.status).toBe(200);
    // …and not after sign-out: the server has dropped that session, whatever the browser kept.
    const replay = await request(app.url).get('/api/projects').set('Cookie', cookie);
    expect(replay.status).toBe(401);
    expect(replay.body.error).toBe(ERROR_IDS.unauthenticated);
    const who = await request(app.url).get('/api/session').set('Cookie', cookie);
    expect(who.body.user).toBeNull();
  });

  it('a session cookie from before sign-in does not become signed in (no fixation)', async () => {
    const agent = request.agent(app.url);
    const first = await agent.get('/api/session');
    const before = sessionCookie(first)!;
    await agent.post('/api/session').set('X-CSRF-Token', first.body.csrfToken).send({ email: DEMO.admin, password: DEMO_PASSWORD }).expect(200);
    const replay = await request(app.url).get('/api/users').set('Cookie', before);
    expect(replay.status).toBe(401);
    expect((await request(app.url).get('/api/session').set('Cookie', before)).body.user).toBeNull();
  });

  it('a forged or tampered session cookie is ignored', async () => {
    const caller = await signIn(app.url, DEMO.admin);
    const res = await caller.agent.get('/api/session');
    expect(res.body.user).not.toBeNull();
    const forged = 'gaugeline.sid=s%3Aforged-session-id.AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA';
    expect((await request(app.url).get('/api/users').set('Cookie', forged)).status).toBe(401);
  });

  it('the CSRF token of a signed-out session is refused for a new sign-in', async () => {
    const agent = request.agent(app.url);
    const first = await agent.get('/api/session');
    const signedIn = await agent.post('/api/session').set('X-CSRF-Token', first.body.csrfToken).send({ email: DEMO.viewer, password: DEMO_PASSWORD });
    const cookie = sessionCookie(signedIn)!;
    await agent.delete('/api/session').set('X-CSRF-Token', signedIn.body.csrfToken).expect(200);
    const res = await request(app.url).post('/api/projects').set('Cookie', cookie).set('X-CSRF-Token', signedIn.body.csrfToken).send({ name: 'After sign-out' });
    expect(res.status).toBe(403);
  });
});

describe('production settings', () => {
  it('marks the session cookie Secure in production and not in development', () => {
    const prod = loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'p'.repeat(32), SMTP_HOST: 'mail.example.test' });
    expect(prod.session.secureCookie).toBe(true);
    expect(prod.demoSeed).toBe(false);
    expect(loadConfig({ NODE_ENV: 'development' }).session.secureCookie).toBe(false);
  });

  it('the test app (not production) sends the cookie HttpOnly and SameSite=Lax with a bounded lifetime', async () => {
    const res = await request(app.url).get('/api/session');
    const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('gaugeline.sid='))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const expires = /Expires=([^;]+)/i.exec(cookie)?.[1];
    expect(expires).toBeDefined();
    expect(new Date(expires!).getTime() - Date.now()).toBeLessThanOrEqual(app.server.config.session.maxAgeMs + 60_000);
  });
});
