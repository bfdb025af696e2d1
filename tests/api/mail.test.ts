// Mail through a real SMTP service on loopback: import notices, invitations, password
// resets, the admins' outbox, and a mail service that is down (nothing is lost).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startTestApp, type TestApp } from '../support/test-app';
import { anonymous, signIn, DEMO, type Caller } from '../support/api-client';
import { waitFor } from '../support/wait-for';
import { sinkMessages, tokenFrom, waitForMail } from '../support/mail-sink';
import { startSmtpSink } from '../../server/mail/local-smtp-sink';
import { freePort } from '../../scripts/lib/free-port';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
let app: TestApp;
let admin: Caller;
let sinkDir: string;

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100', MAIL_RETRY_SECONDS: '1' });
  admin = await signIn(app.url, DEMO.admin);
  sinkDir = app.server.mailSink!.dir;
});
afterAll(async () => {
  await app?.stop();
});

describe('mail on loopback', () => {
  it('tells the uploader when an import is checked, with the cautions', async () => {
    const engineer = await signIn(app.url, DEMO.engineer);
    const pid = (await engineer.call('get', '/api/projects')).body.projects[0].id;
    await engineer.agent.post(`/api/projects/${pid}/uploads`).set('X-CSRF-Token', engineer.csrf).attach('file', readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc')), 'shed.ifc');
    const mail = await waitForMail(sinkDir, DEMO.engineer, /^Checked: /, 90_000);
    expect(mail.text).toMatch(/Tension members found: \d+/);
    expect(mail.text).toMatch(/licensed/);
    expect(mail.from?.text).toMatch(/Gaugeline/);
  });

  it('sends the critical members with the CSV and PDF attached, refusing bad addresses by name', async () => {
    const engineer = await signIn(app.url, DEMO.engineer);
    const pid = (await engineer.call('get', '/api/projects')).body.projects[0].id;
    const models = (await engineer.call('get', `/api/projects/${pid}/models`)).body.models;
    const rid = models[0].latestRevision.id;
    const base = `/api/projects/${pid}/revisions/${rid}/send-critical`;
    const bad = await engineer.call('post', base, { recipients: ['site.team@example.test', 'not an address'], message: 'x', minUtilisation: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.message).toContain('not an address');
    const viewer = await signIn(app.url, DEMO.viewer);
    expect((await viewer.call('post', base, { recipients: ['a@example.test'], minUtilisation: 0 })).status).toBe(403);
    const ok = await engineer.call('post', base, { recipients: ['site.team@example.test', DEMO.viewer], message: 'Please look at these before Friday.', minUtilisation: 0 });
    expect(ok.status, JSON.stringify(ok.body)).toBe(202);
    expect(ok.body.members).toBeGreaterThan(0);
    const mail = await waitForMail(sinkDir, 'site.team@example.test', /^Critical members/);
    expect(mail.text).toMatch(/before Friday/);
    expect(mail.text).toMatch(/licensed/);
    expect(mail.attachments.map((a) => a.contentType).sort()).toEqual(['application/pdf', 'text/csv']);
    const csv = mail.attachments.find((a) => a.contentType === 'text/csv')!.content.toString('utf8');
    const rows = (await engineer.call('get', `/api/projects/${pid}/revisions/${rid}/members?pageSize=500&minUtilisation=0`)).body.members;
    for (const m of rows) expect(csv).toContain(m.globalId);
  });

  it('invites a new person by a one-time link that works once', async () => {
    const created = await admin.call('post', '/api/users', { email: 'new.person@example.test', name: 'New Person', role: 'viewer' });
    expect(created.status).toBe(201);
    const mail = await waitForMail(sinkDir, 'new.person@example.test', /account/);
    const token = tokenFrom(mail);
    const anon = await anonymous(app.url);
    expect((await anon.call('post', '/api/session/password-token', { token, newPassword: 'short' })).status).toBe(400);
    expect((await anon.call('post', '/api/session/password-token', { token, newPassword: 'chosen-password-1' })).status).toBe(204);
    await signIn(app.url, 'new.person@example.test', 'chosen-password-1');
    const again = await anon.call('post', '/api/session/password-token', { token, newPassword: 'another-password-2' });
    expect(again.status).toBe(400);
    expect(again.body.error).toBe('token.invalid');
  });

  it('resets a password by e-mail and says the same for unknown addresses', async () => {
    const anon = await anonymous(app.url);
    const before = (await sinkMessages(sinkDir)).length;
    const unknown = await anon.call('post', '/api/session/password-reset', { email: 'nobody@example.test' });
    const known = await anon.call('post', '/api/session/password-reset', { email: DEMO.viewer });
    expect(unknown.status).toBe(202);
    expect(known.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    const mail = await waitForMail(sinkDir, DEMO.viewer, /new Gaugeline password/);
    expect((await sinkMessages(sinkDir)).length).toBe(before + 1);
    expect((await anon.call('post', '/api/session/password-token', { token: tokenFrom(mail), newPassword: 'reset-password-9' })).status).toBe(204);
    await expect(signIn(app.url, DEMO.viewer)).rejects.toThrow(/401/);
    await signIn(app.url, DEMO.viewer, 'reset-password-9');
  });

  it('shows admins the outbox with each message and refuses others', async () => {
    const list = await admin.call('get', '/api/mail');
    expect(list.status).toBe(200);
    const invitation = list.body.messages.find((m: { kind: string }) => m.kind === 'invitation');
    expect(invitation).toMatchObject({ status: 'sent', to: ['new.person@example.test'] });
    const one = await admin.call('get', `/api/mail/${invitation.id}`);
    expect(one.body.text).toMatch(/set-password#token=\(hidden\)/);
    const engineer = await signIn(app.url, DEMO.engineer);
    expect((await engineer.call('get', '/api/mail')).status).toBe(403);
  });
});

describe('mail service down', () => {
  it('keeps the message, retries, and delivers once the service is back', async () => {
    const port = await freePort();
    await app.stop();
    app = await startTestApp({ SMTP_HOST: '127.0.0.1', SMTP_PORT: String(port), MAIL_RETRY_SECONDS: '1' });
    admin = await signIn(app.url, DEMO.admin);
    const created = await admin.call('post', '/api/users', { email: 'patient@example.test', name: 'Patient Person', role: 'engineer' });
    expect(created.status).toBe(201);
    const stuck = await waitFor(
      async () => (await admin.call('get', '/api/mail')).body.messages.find((m: { to: string[] }) => m.to.includes('patient@example.test')),
      (m) => m?.status === 'retrying',
      20_000,
    );
    expect(stuck.lastError).toBeTruthy();
    const sink = await startSmtpSink(path.join(app.server.config.dataDir, 'late-sink'), port);
    try {
      expect((await admin.call('post', `/api/mail/${stuck.id}/retry`)).status).toBe(200);
      const mail = await waitForMail(sink.dir, 'patient@example.test', /account/);
      expect(tokenFrom(mail).length).toBeGreaterThan(20);
      const sent = await waitFor(async () => (await admin.call('get', `/api/mail/${stuck.id}`)).body, (m) => m.status === 'sent', 20_000);
      expect(sent.attempts).toBeGreaterThanOrEqual(2);
    } finally {
      await sink.close();
    }
  });
});
