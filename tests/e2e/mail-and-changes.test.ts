// Mail and revision changes in a real browser: a forgotten password is reset from the
// e-mailed link; the admin reads that message in the outbox; the engineer sends a
// revision's critical members to a typed address (a bad address is refused by name and
// nothing typed is lost); a second revision with one member's section changed shows that
// member on the changes page.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { MAIL_STATUS_LABELS } from '@shared/api';
import { startTestApp, type TestApp } from '../support/test-app';
import { launchBrowser, signInThroughPage } from '../support/browser';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { waitFor } from '../support/wait-for';
import { sinkMessages, tokenFrom, waitForMail } from '../support/mail-sink';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
const PASSWORD = 'gaugeline-demo';
const NEW_PASSWORD = 'copper-gauge-line-42';
const MODEL = 'Kestrel shed';
const INVITEE = { email: 'rua.tane@example.test', name: 'Rua Tane' };
/** Set E2E_SHOTS to a directory to keep a screenshot of each page visited. */
const SHOTS = process.env.E2E_SHOTS;

let app: TestApp;
let browser: Browser;
let engineer: Caller;
let sinkDir: string;
let projectId: number;
let r1: number;

async function uploadAndWait(bytes: Buffer): Promise<number> {
  const up = await engineer.agent
    .post(`/api/projects/${projectId}/uploads`)
    .set('X-CSRF-Token', engineer.csrf)
    .attach('file', bytes, 'kestrel-yard-shed.ifc')
    .field('modelName', MODEL);
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  const done = await waitFor(
    () => engineer.call('get', `/api/projects/${projectId}/revisions/${up.body.revision.id}`),
    (r) => r.body.status === 'done' || r.body.status === 'failed',
    90_000,
  );
  expect(done.body.status).toBe('done');
  return up.body.revision.id;
}

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100', MAIL_RETRY_SECONDS: '1' });
  sinkDir = app.server.mailSink!.dir;
  browser = await launchBrowser();
  engineer = await signIn(app.url, DEMO.engineer);
  projectId = (await engineer.call('get', '/api/projects')).body.projects[0].id;
  r1 = await uploadAndWait(SAMPLE);
  if (SHOTS) mkdirSync(SHOTS, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

async function shot(page: Page, name: string, fullPage = true): Promise<void> {
  if (SHOTS) await page.screenshot({ path: path.join(SHOTS, `${name}.png`), fullPage });
}

/** A fresh browser context; signs in first when an e-mail is given. */
async function withPage(email: string | null, run: (page: Page) => Promise<void>, password = PASSWORD): Promise<void> {
  const context: BrowserContext = await browser.newContext({ baseURL: app.url, viewport: { width: 1400, height: 900 } });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  try {
    if (email) await signInThroughPage(page, email, password);
    await run(page);
    expect(problems).toEqual([]);
  } catch (error) {
    const file = path.join(os.tmpdir(), `gaugeline-e2e-mail-${Date.now()}.png`);
    await page.screenshot({ path: file, fullPage: true }).catch(() => undefined);
    console.error(`screenshot of the failing page: ${file}; page problems: ${problems.join('; ') || 'none'}`);
    throw error;
  } finally {
    await context.close();
  }
}


describe('forgotten password', () => {
  it('asks for a link from the sign-in page, chooses a new password from the e-mail, and signs in with it', async () => {
    await withPage(null, async (page) => {
      await page.goto('/sign-in');
      await page.getByRole('link', { name: 'Forgot your password?' }).click();
      await page.getByRole('heading', { level: 1, name: 'Forgotten password' }).waitFor();
      const ask = page.getByRole('form', { name: 'Ask for a password link' });
      await ask.getByLabel('E-mail address').fill('not-an-address');
      await ask.getByRole('button', { name: 'Send me a link' }).click();
      expect(await ask.getByLabel('E-mail address').getAttribute('aria-invalid')).toBe('true');
      await ask.getByLabel('E-mail address').fill(DEMO.viewer);
      await ask.getByRole('button', { name: 'Send me a link' }).click();
      await ask.getByRole('status').getByText(/If an account uses that address/).waitFor();
      await shot(page, 'forgot-password');

      const mail = await waitForMail(sinkDir, DEMO.viewer, /new Gaugeline password/);
      const token = tokenFrom(mail);
      await page.goto(`/set-password#token=${token}`);
      await page.getByRole('heading', { level: 1, name: 'Choose a password' }).waitFor();
      // The token is taken out of the address bar once read.
      await page.waitForFunction(() => window.location.hash === '');
      const choose = page.getByRole('form', { name: 'Choose a password' });
      await choose.getByLabel('New password', { exact: true }).fill(NEW_PASSWORD);
      await choose.getByLabel('New password again').fill('something-else-entirely');
      await choose.getByRole('button', { name: 'Set password' }).click();
      await choose.getByText('Type the same password again').waitFor();
      await shot(page, 'set-password-form');
      await choose.getByLabel('New password again').fill(NEW_PASSWORD);
      await choose.getByRole('button', { name: 'Set password' }).click();
      await page.getByRole('status').getByRole('link', { name: 'Password set — sign in' }).click();
      await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();

      // The same link works once only: the server's message and a way to ask again.
      await page.goto(`/set-password#token=${token}`);
      const again = page.getByRole('form', { name: 'Choose a password' });
      await again.getByLabel('New password', { exact: true }).fill('yet-another-password');
      await again.getByLabel('New password again').fill('yet-another-password');
      await again.getByRole('button', { name: 'Set password' }).click();
      const dead = page.getByRole('alert');
      await dead.getByText(/not valid any more/).waitFor();
      await shot(page, 'set-password-used-link');
      await dead.getByRole('link', { name: 'Ask for a new link' }).click();
      await page.getByRole('heading', { level: 1, name: 'Forgotten password' }).waitFor();
    });

    await withPage(
      DEMO.viewer,
      async (page) => {
        // Architects browse results but are not offered to send them.
        await page.goto(`/projects/${projectId}/revisions/${r1}`);
        await page.getByRole('heading', { level: 1, name: /revision 1/ }).waitFor();
        await page.getByRole('region', { name: 'Member ledger' }).waitFor();
        expect(await page.getByRole('button', { name: 'Send critical members' }).count()).toBe(0);
      },
      NEW_PASSWORD,
    );
  });
});

describe('invitations and the outbox', () => {
  it('invites a person added without a password, sends the invitation again, and shows the messages in the outbox', async () => {
    await withPage(DEMO.admin, async (page) => {
      await page.locator('nav[aria-label="Main"]').getByRole('link', { name: 'People' }).click();
      const add = page.getByRole('form', { name: 'Add a person' });
      await add.getByLabel('E-mail address').fill(INVITEE.email);
      await add.getByLabel('Name').fill(INVITEE.name);
      await add.getByRole('button', { name: 'Add person' }).click();
      await add.getByRole('status').getByText(`An invitation is on its way to ${INVITEE.email}`).waitFor();
      const first = await waitForMail(sinkDir, INVITEE.email, /account/);
      const row = page.getByRole('row', { name: new RegExp(INVITEE.name) });
      await row.getByRole('button', { name: `Send ${INVITEE.name} the invitation again` }).click();
      await page.getByText(`An invitation is on its way to ${INVITEE.email}.`).waitFor();
      await shot(page, 'people-invite-again');
      // The second link replaces the first.
      const second = await waitFor(
        async () => (await sinkMessages(sinkDir)).filter((m) => m.to && !Array.isArray(m.to) && m.to.text.includes(INVITEE.email)),
        (list) => list.length >= 2,
        30_000,
      );
      expect(second.length).toBe(2);
      expect(new Set(second.map(tokenFrom)).size).toBe(2);
      expect(second.map(tokenFrom)).toContain(tokenFrom(first));
      // People who have signed in are not offered an invitation.
      expect(await page.getByRole('row', { name: /Ewan Marsh/ }).getByRole('button', { name: /invitation again/ }).count()).toBe(0);

      await page.locator('nav[aria-label="Main"]').getByRole('link', { name: 'Outgoing mail' }).click();
      await page.getByRole('heading', { level: 1, name: 'Outgoing mail' }).waitFor();
      const invitations = page.getByRole('table', { name: /^Outgoing mail/ }).getByRole('row').filter({ hasText: INVITEE.email });
      await waitFor(() => invitations.count(), (n) => n === 2, 10_000);
      expect(await invitations.count()).toBe(2);
    });
  });

  it('shows the admin the password message, its state and its text', async () => {
    await withPage(DEMO.admin, async (page) => {
      await page.locator('nav[aria-label="Main"]').getByRole('link', { name: 'Outgoing mail' }).click();
      await page.getByRole('heading', { level: 1, name: 'Outgoing mail' }).waitFor();
      const table = page.getByRole('table', { name: /^Outgoing mail/ });
      const row = table.getByRole('row').filter({ hasText: DEMO.viewer }).filter({ hasText: 'Choose a new Gaugeline password' });
      await row.getByText(MAIL_STATUS_LABELS.sent).waitFor();
      expect(await row.getByRole('button', { name: /Try again/ }).count()).toBe(0);
      await shot(page, 'outbox');
      await row.getByRole('link', { name: 'Choose a new Gaugeline password' }).click();
      await page.getByRole('heading', { level: 1, name: 'Choose a new Gaugeline password' }).waitFor();
      await page.getByText(/set-password#token=\(hidden\)/).waitFor();
      await shot(page, 'outbox-message');
    });
  });
});

describe('send critical members', () => {
  it('refuses a bad address by name keeping what was typed, then sends with both files attached', async () => {
    await withPage(DEMO.engineer, async (page) => {
      await page.goto(`/projects/${projectId}/revisions/${r1}`);
      await page.getByRole('heading', { level: 1, name: /revision 1/ }).waitFor();
      await page.getByRole('button', { name: 'Send critical members' }).click();
      const dialog = page.getByRole('dialog', { name: /Send the critical members of revision 1/ });
      await dialog.waitFor();
      const form = dialog.getByRole('form', { name: 'Send critical members' });
      // The project's people are offered as checkboxes.
      await form.getByRole('checkbox', { name: /Demo Architect|architect/i }).first().waitFor();
      const typed = 'site.team@example.test, not an address';
      await form.getByLabel('Other addresses').fill(typed);
      await form.getByLabel('Message').fill('Please look at these before Friday.');
      await form.getByLabel('Members from utilisation').fill('0');
      await form.getByRole('button', { name: /^Send revision 1/ }).click();
      const alert = form.getByRole('alert');
      await alert.getByText(/not an address/).waitFor();
      await form.getByText(/Not an e-mail address: not an address/).first().waitFor();
      expect(await form.getByLabel('Other addresses').inputValue()).toBe(typed);
      expect(await form.getByLabel('Message').inputValue()).toBe('Please look at these before Friday.');
      expect(await form.getByLabel('Members from utilisation').inputValue()).toBe('0');
      await shot(page, 'send-critical-refused', false);

      await form.getByLabel('Other addresses').fill('site.team@example.test');
      await form.getByRole('button', { name: /^Send revision 1/ }).click();
      const done = dialog.getByRole('status');
      await done.getByText(/queued for sending/).waitFor();
      await shot(page, 'send-critical-sent', false);
      await dialog.getByRole('button', { name: 'Done' }).click();
      await dialog.waitFor({ state: 'hidden' });
    });
    const mail = await waitForMail(sinkDir, 'site.team@example.test', /^Critical members/);
    expect(mail.text).toMatch(/before Friday/);
    expect(mail.attachments.map((a) => a.contentType).sort()).toEqual(['application/pdf', 'text/csv']);
  });
});

describe('changes between revisions', () => {
  it('lists the member whose section changed in the next revision', async () => {
    const text = SAMPLE.toString('latin1');
    const profile = /'(FL\d+x\d+)'/.exec(text)![1];
    const r2 = await uploadAndWait(Buffer.from(text.replace(`'${profile}'`, `'${profile}B'`), 'latin1'));
    const comparison = (await engineer.call('get', `/api/projects/${projectId}/revisions/${r2}/comparison?with=${r1}`)).body;
    const resized = (comparison.changes as { globalId: string; kinds: string[] }[]).filter((c) => c.kinds.includes('resized'));
    expect(resized.length).toBeGreaterThan(0);

    await withPage(DEMO.engineer, async (page) => {
      // From the model's entry on the project page.
      await page.goto(`/projects/${projectId}`);
      const model = page.getByRole('article', { name: MODEL });
      await model.getByRole('button', { name: 'Revision history' }).click();
      await model.getByRole('table', { name: `Revisions of ${MODEL}` }).getByRole('link', { name: 'Changes in revision 2 since the previous one' }).waitFor();
      await shot(page, 'project-models');
      await model.getByRole('link', { name: `Compare with previous revision: what changed in revision 2 of ${MODEL}` }).click();
      await page.getByRole('heading', { level: 1, name: 'What changed in revision 2' }).waitFor();
      expect(new URL(page.url()).pathname).toBe(`/projects/${projectId}/revisions/${r2}/changes`);
      const table = page.getByRole('table', { name: /^Changed members, revision 1 to 2/ });
      for (const c of resized) {
        const row = table.locator(`tr:has([data-global-id="${c.globalId}"])`);
        await row.getByText('section changed').waitFor();
        await row.getByText(`${profile}B`).waitFor();
        expect(await row.getByRole('link', { name: c.globalId }).getAttribute('href')).toBe(`/projects/${projectId}/revisions/${r2}/members/${c.globalId}`);
      }
      // The counts filter the table.
      // (The 3D view's key below has a line of the same name; these are the counts above the table.)
      const byKind = page.getByRole('group', { name: /Changes by kind/ });
      await byKind.getByRole('button', { name: /Section changed/ }).click();
      expect(await byKind.getByRole('button', { name: /Section changed/ }).getAttribute('aria-pressed')).toBe('true');
      expect(await table.locator('tbody tr').count()).toBe(resized.length);
      const csv = await page.getByRole('link', { name: 'Download the changes (CSV)' }).getAttribute('href');
      expect(csv).toBe(`/api/projects/${projectId}/revisions/${r2}/comparison?with=${r1}&format=csv`);
      expect(await page.locator('[data-cautions]').count()).toBe(1);
      await shot(page, 'changes');

      // And from the revision page.
      await page.goto(`/projects/${projectId}/revisions/${r2}`);
      await page.getByRole('link', { name: 'What changed since the previous revision' }).click();
      await page.getByRole('heading', { level: 1, name: 'What changed in revision 2' }).waitFor();
      await table.waitFor();
    });
  });
});
