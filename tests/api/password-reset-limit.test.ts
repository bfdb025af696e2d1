// The password-reset form cannot be used to flood a mailbox: requests are limited per
// client address and e-mail (SIGN_IN_LIMIT per SIGN_IN_WINDOW_SECONDS, shared with sign-in),
// and the limit answers alike whether or not the address has an account.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app';
import { anonymous, signIn, DEMO } from '../support/api-client';
import { sinkMessages } from '../support/mail-sink';
import { waitFor } from '../support/wait-for';

const LIMIT = 3;
const ATTEMPTS = LIMIT + 2;
const RESET_SUBJECT = /new Gaugeline password/;

let app: TestApp;

beforeAll(async () => {
  app = await startTestApp({ SIGN_IN_LIMIT: String(LIMIT), SIGN_IN_WINDOW_SECONDS: '600', MAIL_RETRY_SECONDS: '1' });
});
afterAll(async () => {
  await app?.stop();
});

/** One reset request from a fresh session: the limit is per address and e-mail, not per session. */
async function requestReset(email: string): Promise<request.Response> {
  const caller = await anonymous(app.url);
  return caller.call('post', '/api/session/password-reset', { email });
}

/**
 * What a caller can observe of an answer, minus what differs per request anyway: the date,
 * the new session's cookie, the seconds left in the window (each key's window starts at
 * its own first request, milliseconds apart) and the policy's partition key (a hash of the
 * caller's own address and e-mail, so it differs for any two e-mails alike).
 */
function observable(res: request.Response) {
  const headers: Record<string, unknown> = {};
  for (const [name, value] of Object.entries(res.headers)) {
    if (name === 'date' || name === 'set-cookie') continue;
    if (name === 'ratelimit' || name === 'retry-after') headers[name] = String(value).replace(/\d+$/, 'N');
    else if (name === 'ratelimit-policy') headers[name] = String(value).replace(/pk=:[^:]*:/, 'pk=:…:');
    else headers[name] = value;
  }
  return { status: res.status, body: res.body as unknown, headers };
}

async function resetMailsTo(address: string): Promise<number> {
  const messages = await sinkMessages(app.server.mailSink!.dir);
  return messages.filter((m) => (m.to && !Array.isArray(m.to) ? m.to.text : '').includes(address) && RESET_SUBJECT.test(m.subject ?? '')).length;
}

interface OutboxRow {
  kind: string;
  to: string[];
  status: string;
}

describe('password-reset rate limit', () => {
  it('limits reset requests per address and e-mail, answers alike for unknown e-mails, and sends only the allowed mails', async () => {
    const known = DEMO.viewer;
    const unknown = 'nobody-here@example.test';

    const knownAnswers: request.Response[] = [];
    const unknownAnswers: request.Response[] = [];
    for (let i = 0; i < ATTEMPTS; i++) {
      knownAnswers.push(await requestReset(known));
      unknownAnswers.push(await requestReset(unknown));
    }

    const expected = [...Array(LIMIT).fill(202), ...Array(ATTEMPTS - LIMIT).fill(429)];
    expect(knownAnswers.map((r) => r.status)).toEqual(expected);
    expect(unknownAnswers.map((r) => r.status)).toEqual(expected);
    for (const refused of [...knownAnswers, ...unknownAnswers].filter((r) => r.status === 429)) {
      expect(refused.body.error).toBe('auth.rate-limited');
      expect(refused.body.message).toMatch(/reset link/);
      expect(refused.headers['content-type']).toMatch(/application\/json/);
    }

    // No account probing: every answer, accepted or refused, is the same for both addresses.
    for (let i = 0; i < ATTEMPTS; i++) expect(observable(unknownAnswers[i])).toEqual(observable(knownAnswers[i]));

    // Another e-mail from the same client is not affected by the first one's limit.
    const other = await requestReset(DEMO.engineer);
    expect(other.status).toBe(202);
    expect(other.body).toEqual(knownAnswers[0].body);

    // Exactly the allowed number reached the outbox, and all of them (no more) reached the mail service.
    const admin = await signIn(app.url, DEMO.admin);
    const outbox = await waitFor(
      async () => (await admin.call('get', '/api/mail')).body.messages as OutboxRow[],
      (rows) => rows.filter((m) => m.kind === 'password-reset').every((m) => m.status === 'sent') && rows.some((m) => m.kind === 'password-reset'),
      20_000,
    );
    const resets = outbox.filter((m) => m.kind === 'password-reset');
    expect(resets.filter((m) => m.to.includes(known))).toHaveLength(LIMIT);
    expect(resets.filter((m) => m.to.includes(DEMO.engineer))).toHaveLength(1);
    expect(resets.filter((m) => m.to.includes(unknown))).toHaveLength(0);
    expect(resets).toHaveLength(LIMIT + 1);
    expect(resets.every((m) => m.status === 'sent')).toBe(true);
    expect(await resetMailsTo(known)).toBe(LIMIT);
    expect(await resetMailsTo(DEMO.engineer)).toBe(1);
  });
});
