// Secrets (SESSION_SECRET, DB_PASSWORD, SMTP_PASSWORD, S3_SECRET_ACCESS_KEY) and passwords
// people type never reach the logs or a response. The real entry point runs in a child
// process with request logging on, so its whole stdout and stderr can be read; every
// answer it gives (headers and body) is kept and searched too.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createServer } from 'node:http';
import { SMTPServer } from 'smtp-server';
import { createTestDatabase, testDbServer } from '../support/test-db';
import { runEntryPoint, spawnEntryPoint, type EntryPointProcess } from '../support/spawn-app';
import { waitFor } from '../support/wait-for';
import { DEMO } from '../support/api-client';
import { DEMO_PASSWORD } from '../../server/db/seed/demo-seed';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const tag = () => randomBytes(9).toString('hex');

const SMTP_USER = 'gaugeline-mailer';
const S3_ACCESS_KEY_ID = 'GAUGELINEKEYID';
const secrets = {
  SESSION_SECRET: `session-secret-${tag()}`,
  // The test database's real password: the app needs it to connect.
  DB_PASSWORD: testDbServer().password,
  SMTP_PASSWORD: `smtp-password-${tag()}`,
  S3_SECRET_ACCESS_KEY: `s3-secret-key-${tag()}`,
};
/** Passwords people type into the app. */
const typed = {
  demo: DEMO_PASSWORD,
  right: `Right-pass-${tag()}`,
  wrong: `Wrong-pass-${tag()}`,
  wrongCurrent: `Wrong-current-${tag()}`,
  changed: `Changed-pass-${tag()}`,
  // Shorter than the minimum, so it comes back as a validation error.
  tooShort: `s${tag().slice(0, 7)}`,
  badEmail: `Bad-email-pass-${tag()}`,
  noCsrf: `No-csrf-pass-${tag()}`,
  brokenJson: `Broken-json-pass-${tag()}`,
};

/** Each value as written, and as it would look base64-, hex- or URL-encoded (SMTP AUTH sends base64). */
function needles(values: Record<string, string>): Array<{ name: string; text: string }> {
  const out: Array<{ name: string; text: string }> = [];
  for (const [name, value] of Object.entries(values)) {
    expect(value.length, `${name} must be long enough to be distinctive`).toBeGreaterThanOrEqual(8);
    const b = Buffer.from(value, 'utf8');
    const forms = { raw: value, base64: b.toString('base64'), base64url: b.toString('base64url'), hex: b.toString('hex'), url: encodeURIComponent(value) };
    const seen = new Set<string>();
    for (const [form, text] of Object.entries(forms)) {
      if (!seen.has(text)) out.push({ name: `${name} (${form})`, text });
      seen.add(text);
    }
  }
  out.push({ name: 'SMTP AUTH PLAIN credentials', text: Buffer.from(`\u0000${SMTP_USER}\u0000${secrets.SMTP_PASSWORD}`).toString('base64') });
  return out;
}

/** Fails listing every secret found, with where and a little context. */
function expectNoneIn(haystacks: Array<{ where: string; text: string }>, values: Record<string, string>): void {
  const found: string[] = [];
  for (const n of needles(values)) {
    for (const h of haystacks) {
      const at = h.text.indexOf(n.text);
      if (at >= 0) found.push(`${n.name} in ${h.where}: …${h.text.slice(Math.max(0, at - 80), at + n.text.length + 40)}…`);
    }
  }
  expect(found).toEqual([]);
}

/** Every answer the app gave, as a caller sees it: status, headers, body. */
const answers: Array<{ where: string; text: string }> = [];
function record(res: request.Response): request.Response {
  const body = typeof res.text === 'string' && res.text.length ? res.text : Buffer.isBuffer(res.body) ? res.body.toString('latin1') : JSON.stringify(res.body ?? null);
  const { method, path: asked } = (res as unknown as { req: { method: string; path: string } }).req;
  answers.push({ where: `${res.status} answer to ${method} ${asked}`, text: `${JSON.stringify(res.headers)}\n${body}` });
  return res;
}

interface Client {
  agent: ReturnType<typeof request.agent>;
  csrf: string;
  call(method: 'get' | 'post' | 'put' | 'patch' | 'delete', url: string, body?: object): Promise<request.Response>;
}

async function client(url: string): Promise<Client> {
  const agent = request.agent(url);
  const c: Client = {
    agent,
    csrf: record(await agent.get('/api/session')).body.csrfToken,
    async call(method, p, body) {
      const req = agent[method](p).set('X-CSRF-Token', c.csrf);
      return record(await (body === undefined ? req : req.send(body)));
    },
  };
  return c;
}

async function signedIn(url: string, email: string, password: string): Promise<Client> {
  const c = await client(url);
  const res = await c.call('post', '/api/session', { email, password });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  c.csrf = res.body.csrfToken;
  return c;
}

/** A mail server on loopback that asks for a login and refuses it, so the password is really sent and the mail really fails. */
const passwordsOffered: string[] = [];
const smtp = new SMTPServer({
  secure: false,
  disabledCommands: ['STARTTLS'],
  allowInsecureAuth: true,
  authOptional: false,
  logger: false,
  onAuth(auth, _session, callback) {
    passwordsOffered.push(auth.password ?? '');
    callback(new Error('Invalid username or password'));
  },
});

/**
 * An object store on loopback that refuses every request as a real one refuses a bad
 * signature, so storing an upload fails with an error the app does not expect.
 */
const s3Requests: string[] = [];
const s3 = createServer((req, res) => {
  s3Requests.push(String(req.headers.authorization ?? ''));
  req.resume();
  res.writeHead(403, { 'Content-Type': 'application/xml' });
  res.end('<?xml version="1.0" encoding="UTF-8"?><Error><Code>SignatureDoesNotMatch</Code><Message>The request signature we calculated does not match the signature you provided.</Message></Error>');
});

let db: { name: string; drop(): Promise<void> };
let env: Record<string, string>;
let app: EntryPointProcess | undefined;

beforeAll(async () => {
  db = await createTestDatabase();
  await new Promise<void>((resolve, reject) => {
    smtp.server.once('error', reject);
    smtp.listen(0, '127.0.0.1', () => resolve());
  });
  const smtpPort = (smtp.server.address() as { port: number }).port;
  await new Promise<void>((resolve) => s3.listen(0, '127.0.0.1', () => resolve()));
  const s3Port = (s3.address() as { port: number }).port;
  const s = testDbServer();
  env = {
    NODE_ENV: 'test',
    HOST: '127.0.0.1',
    PORT: '0',
    DB_HOST: s.host,
    DB_PORT: String(s.port),
    DB_NAME: db.name,
    DB_USER: s.user,
    DB_PASSWORD: secrets.DB_PASSWORD,
    SESSION_SECRET: secrets.SESSION_SECRET,
    DATA_DIR: path.join(root, '.test-data', db.name),
    CLIENT_DIST: path.join(root, 'client/dist'),
    DEMO_SEED: 'on',
    DEMO_MODELS: 'off',
    LOG_REQUESTS: 'on',
    // No import would get far with the store refusing everything; the runner is not what this suite is about.
    IMPORT_WORKERS: '0',
    MAIL_RETRY_SECONDS: '1',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    SMTP_USER,
    SMTP_PASSWORD: secrets.SMTP_PASSWORD,
    STORAGE: 's3',
    S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
    S3_BUCKET: 'gaugeline-secrets-test',
    S3_ACCESS_KEY_ID,
    S3_SECRET_ACCESS_KEY: secrets.S3_SECRET_ACCESS_KEY,
  };
  app = await spawnEntryPoint(env);
});
afterAll(async () => {
  await app?.stop();
  await new Promise<void>((resolve) => smtp.close(() => resolve()));
  await new Promise<void>((resolve) => s3.close(() => resolve()));
  await db?.drop();
});

describe('secrets in logs and responses', () => {
  it('a realistic session logs requests but never a secret or a typed password', async () => {
    const url = app!.url;
    const email = 'keeper@example.test';

    const admin = await signedIn(url, DEMO.admin, typed.demo);
    expect((await admin.call('post', '/api/users', { email, name: 'Key Keeper', role: 'engineer', password: typed.right })).status).toBe(201);

    // Sign-in, wrong and right.
    const stranger = await client(url);
    expect((await stranger.call('post', '/api/session', { email, password: typed.wrong })).status).toBe(401);
    const keeper = await signedIn(url, email, typed.right);

    // Password change: wrong current password, too short a new one, then the real change.
    expect((await keeper.call('put', '/api/session/password', { currentPassword: typed.wrongCurrent, newPassword: typed.changed })).status).toBe(400);
    expect((await keeper.call('put', '/api/session/password', { currentPassword: typed.right, newPassword: typed.tooShort })).status).toBe(400);
    expect((await keeper.call('put', '/api/session/password', { currentPassword: typed.right, newPassword: typed.changed })).status).toBe(204);
    const again = await signedIn(url, email, typed.changed);

    // Reset requests, for an account and for no account.
    const resetter = await client(url);
    expect((await resetter.call('post', '/api/session/password-reset', { email })).status).toBe(202);
    expect((await resetter.call('post', '/api/session/password-reset', { email: 'nobody@example.test' })).status).toBe(202);

    // Not found, on the API and as a client route (the app shell).
    expect((await again.call('get', '/api/projects/999999')).status).toBe(404);
    expect((await again.call('get', '/api/no-such-route')).status).toBe(404);
    expect((await again.call('get', '/no/such/page')).status).toBe(200);

    // Validation errors, including a body that is not JSON at all.
    expect((await stranger.call('post', '/api/session', { email: 'not-an-email', password: typed.badEmail })).status).toBe(400);
    const broken = record(await stranger.agent.post('/api/session').set('X-CSRF-Token', stranger.csrf).set('Content-Type', 'application/json').send(`{"email":"${email}","password":"${typed.brokenJson}"`));
    expect(broken.status).toBe(400);

    // CSRF refusals: no token, and a wrong one.
    const noToken = record(await request.agent(url).post('/api/session').send({ email, password: typed.noCsrf }));
    expect(noToken.status).toBe(403);
    expect(noToken.body.error).toBe('auth.csrf');
    expect((await again.agent.post('/api/projects').set('X-CSRF-Token', 'x'.repeat(again.csrf.length)).send({ name: 'Nope' }).then(record)).status).toBe(403);

    // Uploads: a file that is not a model is refused; a real model fails at the refusing store (an unexpected error).
    const project = await again.call('post', '/api/projects', { name: 'Secrets project' });
    expect(project.status).toBe(201);
    const uploads = `/api/projects/${project.body.id}/uploads`;
    const bad = record(await again.agent.post(uploads).set('X-CSRF-Token', again.csrf).attach('file', Buffer.from('this is not a model\n'), 'notes.ifc'));
    expect(bad.status).toBe(422);
    const model = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
    const failed = record(await again.agent.post(uploads).set('X-CSRF-Token', again.csrf).attach('file', model, 'shed.ifc'));
    expect(failed.status).toBe(500);
    expect(failed.body.error).toBe('server.internal');
    // The store was asked with a signature made from the secret key, so there was something to leak.
    expect(s3Requests.some((a) => a.includes(`Credential=${S3_ACCESS_KEY_ID}/`))).toBe(true);

    // The reset mail fails at the mail server's login; its error is kept and shown to admins.
    const stuck = await waitFor(
      async () => (await admin.call('get', '/api/mail')).body.messages.find((m: { to: string[]; kind: string }) => m.kind === 'password-reset' && m.to.includes(email)),
      (m) => m?.status === 'retrying' && Boolean(m.lastError),
      20_000,
    );
    expect(stuck?.lastError).toMatch(/535|login/i);
    expect((await admin.call('get', `/api/mail/${stuck.id}`)).status).toBe(200);
    // The password really went to the mail server, so there was something to leak.
    expect(passwordsOffered).toContain(secrets.SMTP_PASSWORD);

    expect((await again.call('delete', '/api/session')).status).toBe(200);
    expect((await admin.call('delete', '/api/session')).status).toBe(200);

    const output = await app!.stop();
    app = undefined;

    // The logs were on and saw every path above, so the search below is not of an empty log.
    for (const line of ['POST /api/session 401', 'POST /api/session 200', 'PUT /api/session/password 400', 'PUT /api/session/password 204', 'POST /api/session/password-reset 202', 'GET /api/no-such-route 404', 'POST /api/session 403', `POST ${uploads} 422`, `POST ${uploads} 500`]) {
      expect(output).toContain(line);
    }
    expect(output).toMatch(/error: unexpected error/);
    expect(output).toMatch(/warning: mail \d+ not sent/);
    expect(answers.length).toBeGreaterThan(25);

    expectNoneIn([{ where: 'the server log', text: output }, ...answers], { ...secrets, ...typed });
  }, 90_000);

  it('a start-up with bad values names the variables, never the secret values', async () => {
    // Bad values, among them a secret that is itself bad (too short); secrets given as half of
    // a pair (checked once the values themselves are valid); a wrong database password, which
    // gets through the configuration and is refused by the database. Independent, so run together.
    const shortSecret = `tiny-${tag().slice(0, 6)}`;
    const wrongDbPassword = `wrong-db-password-${tag()}`;
    const [first, halfPairs, refused] = await Promise.all([
      runEntryPoint({ ...env, PORT: 'not-a-port', DB_POOL_MAX: '0', LOG_REQUESTS: 'loud', SESSION_SECRET: shortSecret }),
      runEntryPoint({ ...env, S3_ACCESS_KEY_ID: '', SMTP_USER: '' }),
      runEntryPoint({ ...env, DB_PASSWORD: wrongDbPassword }),
    ]);
    expect(first.code).toBe(78);
    for (const key of ['Configuration is not valid', 'PORT', 'DB_POOL_MAX', 'LOG_REQUESTS', 'SESSION_SECRET']) expect(first.output).toContain(key);
    expect(halfPairs.code).toBe(78);
    expect(halfPairs.output).toContain('S3_ACCESS_KEY_ID / S3_SECRET_ACCESS_KEY');
    expect(halfPairs.output).toContain('SMTP_USER / SMTP_PASSWORD');
    expect(refused.code).not.toBe(0);
    expect(refused.output).toMatch(/Access denied/);

    expectNoneIn(
      [
        { where: 'bad values', text: first.output },
        { where: 'half pairs', text: halfPairs.output },
        { where: 'wrong database password', text: refused.output },
      ],
      { ...secrets, shortSecret, wrongDbPassword },
    );
  }, 90_000);
});
