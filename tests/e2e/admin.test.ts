// Admin pages in a real browser: add a person, change their role, deactivate and
// reactivate them, give and take away project access.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startTestApp } from '../support/test-app';
import { launchBrowser } from '../support/browser';

let app: { url: string; stop(): Promise<void> } | undefined;
let browser: Browser | undefined;
let page: Page;
const problems: string[] = [];

beforeAll(async () => {
  app = await startTestApp();
  browser = await launchBrowser();
  const context = await browser.newContext({ baseURL: app.url });
  page = await context.newPage();
  page.on('pageerror', (error) => problems.push(error.message));
  await page.goto('/admin/people');
  await page.waitForURL((url) => url.pathname === '/sign-in');
  const form = page.getByRole('form', { name: 'Sign in' });
  await form.getByLabel('E-mail address').fill('admin@demo.gaugeline.test');
  await form.getByLabel('Password', { exact: true }).fill('gaugeline-demo');
  await form.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { level: 1, name: 'People' }).waitFor();
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

const NAME = 'Noor Haddad';
const EMAIL = 'noor.haddad@example.test';
const focused = () => page.evaluate(() => document.activeElement?.getAttribute('name') ?? document.activeElement?.getAttribute('role') ?? '');

describe('admin pages', () => {
  it('adds a person, checking the form first and showing the server refusal for a duplicate', async () => {
    const form = page.getByRole('form', { name: 'Add a person' });
    await form.getByLabel('E-mail address').fill(EMAIL);
    await form.getByLabel('Name').fill(NAME);
    await form.getByLabel('Role').selectOption('viewer');
    // Typing a too-short password and pressing the button straight away must still submit
    // (and so be refused on the spot, with focus on the password).
    await form.getByLabel('Starting password').fill('short');
    await form.getByRole('button', { name: 'Add person' }).click();
    await page.waitForFunction(() => document.activeElement?.getAttribute('name') === 'password');
    expect(await form.getByLabel('Starting password').getAttribute('aria-invalid')).toBe('true');

    await form.getByLabel('Starting password').fill('a-long-enough-password');
    await form.getByRole('button', { name: 'Add person' }).click();
    await form.getByRole('status').getByText(`${NAME} added as Viewer`).waitFor();
    await page.getByRole('table', { name: /^People/ }).getByText(EMAIL).waitFor();

    await form.getByLabel('E-mail address').fill(EMAIL);
    await form.getByLabel('Name').fill('Someone Else');
    await form.getByRole('button', { name: 'Add person' }).click();
    const alert = form.getByRole('alert');
    await alert.waitFor();
    expect((await alert.innerText()).length).toBeGreaterThan(0);
    await page.waitForFunction(() => document.activeElement?.getAttribute('role') === 'alert');
    expect(await focused()).toBe('alert');
  });

  it('changes a role, and deactivates only after confirming', async () => {
    const row = page.getByRole('row', { name: new RegExp(NAME) });
    await row.getByLabel(`Role of ${NAME}`).selectOption('engineer');
    await row.getByRole('button', { name: 'Change role' }).click();
    await page.getByText(`${NAME} is now Engineer.`).waitFor();

    await row.getByRole('button', { name: `Deactivate ${NAME}` }).click();
    const dialog = page.getByRole('dialog', { name: `Deactivate ${NAME}?` });
    await dialog.waitFor();
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });
    expect(await row.getByText('Active', { exact: true }).count()).toBe(1);

    await row.getByRole('button', { name: `Deactivate ${NAME}` }).click();
    await dialog.getByRole('button', { name: 'Deactivate' }).click();
    await row.getByText('Deactivated', { exact: true }).waitFor();

    await row.getByRole('button', { name: `Reactivate ${NAME}` }).click();
    await row.getByText('Active', { exact: true }).waitFor();
  });

  it('gives and takes away project access', async () => {
    await page.locator('nav[aria-label="Main"]').getByRole('link', { name: 'Project access' }).click();
    await page.getByRole('heading', { level: 1, name: 'Project access' }).waitFor();
    await page.getByLabel('Project', { exact: true }).selectOption({ index: 1 });

    const person = page.getByLabel('Give access to', { exact: true });
    await person.locator('option', { hasText: NAME }).waitFor({ state: 'attached' });
    await person.selectOption({ label: await person.locator('option', { hasText: NAME }).innerText() });
    await page.getByRole('button', { name: 'Give access' }).click();
    const members = page.getByRole('table', { name: /^People with access/ });
    await members.getByText(EMAIL).waitFor();

    await members.getByRole('button', { name: new RegExp(`^Remove ${NAME}`) }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Remove access' }).click();
    await members.getByText(EMAIL).waitFor({ state: 'detached' });
    expect(problems).toEqual([]);
  });
});
