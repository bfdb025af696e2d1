// Sign-in in a real browser: each demo account sees the navigation its role allows,
// signs out again; a wrong password shows the server's own message.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { startTestApp } from '../support/test-app';
import { launchBrowser } from '../support/browser';

const DEMO_PASSWORD = 'gaugeline-demo';

interface Account {
  email: string;
  role: 'admin' | 'engineer' | 'viewer';
  /** Link names in nav[aria-label="Main"], in order. */
  links: string[];
  canCreateProjects: boolean;
}

const ACCOUNTS: Account[] = [
  { email: 'admin@demo.gaugeline.test', role: 'admin', links: ['Projects', 'Account', 'People', 'Project access', 'Outgoing mail'], canCreateProjects: true },
  { email: 'engineer@demo.gaugeline.test', role: 'engineer', links: ['Projects', 'Account'], canCreateProjects: true },
  { email: 'architect@demo.gaugeline.test', role: 'viewer', links: ['Projects', 'Account'], canCreateProjects: false },
];

let app: { url: string; stop(): Promise<void> } | undefined;
let browser: Browser | undefined;

beforeAll(async () => {
  app = await startTestApp();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

function baseUrl(): string {
  if (!app) throw new Error('test app did not start');
  return app.url;
}

async function withPage(run: (page: Page) => Promise<void>): Promise<void> {
  if (!browser) throw new Error('browser did not start');
  const context: BrowserContext = await browser.newContext({ baseURL: baseUrl() });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  try {
    await run(page);
    expect(problems).toEqual([]);
  } finally {
    await context.close();
  }
}

function pathOf(page: Page): string {
  const url = new URL(page.url());
  return url.pathname + url.search;
}

async function fillSignIn(page: Page, email: string, password: string): Promise<void> {
  const form = page.getByRole('form', { name: 'Sign in' });
  await form.getByLabel('E-mail address').fill(email);
  await form.getByLabel('Password', { exact: true }).fill(password);
  await form.getByRole('button', { name: 'Sign in' }).click();
}

const mainNav = (page: Page) => page.locator('nav[aria-label="Main"]');

describe('signing in through the browser', () => {
  for (const account of ACCOUNTS) {
    it(`${account.role} (${account.email}) sees the right navigation, then signs out`, async () => {
      await withPage(async (page) => {
        // Signed out, the app sends people to sign in.
        await page.goto('/');
        await page.waitForURL((url) => url.pathname === '/sign-in');
        expect(await mainNav(page).count()).toBe(0);

        await fillSignIn(page, account.email, DEMO_PASSWORD);
        await mainNav(page).waitFor();
        await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
        expect(pathOf(page)).toBe('/');

        const links = (await mainNav(page).getByRole('link').allInnerTexts()).map((t) => t.trim());
        expect(links).toEqual(account.links);
        expect(await mainNav(page).getByRole('button', { name: 'Sign out' }).isVisible()).toBe(true);

        // The create-project form is there for admins and engineers only.
        expect(await page.getByRole('form', { name: 'New project' }).count()).toBe(account.canCreateProjects ? 1 : 0);

        // Admin pages: admins get them, everyone else gets a plain "not allowed".
        if (account.role === 'admin') {
          await mainNav(page).getByRole('link', { name: 'People' }).click();
          await page.getByRole('heading', { level: 1, name: 'People' }).waitFor();
          const table = page.getByRole('table', { name: /^People/ });
          await table.waitFor();
          for (const other of ACCOUNTS) {
            expect(await table.getByText(other.email, { exact: true }).count()).toBe(1);
          }
        } else {
          await page.goto('/admin/people');
          await page.getByRole('heading', { level: 1, name: 'Not allowed' }).waitFor();
          expect(await page.getByRole('table').count()).toBe(0);
        }

        await mainNav(page).getByRole('button', { name: 'Sign out' }).click();
        await page.waitForURL((url) => url.pathname === '/sign-in');
        await page.getByRole('form', { name: 'Sign in' }).waitFor();
        expect(await mainNav(page).count()).toBe(0);

        // Really signed out: the server says so, and protected pages send us to sign in.
        const session = await page.evaluate(async () => (await fetch('/api/session')).json());
        expect(session.user).toBeNull();
        await page.goto('/account');
        await page.waitForURL((url) => url.pathname === '/sign-in');
        expect(pathOf(page)).toBe('/sign-in?next=%2Faccount');
      });
    });
  }

  it('returns to the page asked for, and an engineer can create a project right after signing in', async () => {
    await withPage(async (page) => {
      await page.goto('/account');
      await page.waitForURL((url) => url.pathname === '/sign-in');
      await fillSignIn(page, 'engineer@demo.gaugeline.test', DEMO_PASSWORD);
      await page.getByRole('heading', { level: 1, name: 'Account' }).waitFor();
      expect(pathOf(page)).toBe('/account');

      // The first write after sign-in uses the new session's CSRF token.
      await mainNav(page).getByRole('link', { name: 'Projects' }).click();
      const form = page.getByRole('form', { name: 'New project' });
      await form.getByLabel('Project name').fill('E2E warehouse bracing');
      await form.getByRole('button', { name: 'Create project' }).click();
      await page.getByRole('heading', { level: 1, name: 'E2E warehouse bracing' }).waitFor();
      expect(pathOf(page)).toMatch(/^\/projects\/\d+$/);
      await page.getByText('Nothing has been uploaded yet').waitFor();
    });
  });

  it('a wrong password shows the server message and stays on the sign-in page', async () => {
    await withPage(async (page) => {
      await page.goto('/sign-in');
      const answer = page.waitForResponse((r) => new URL(r.url()).pathname === '/api/session' && r.request().method() === 'POST');
      await fillSignIn(page, 'engineer@demo.gaugeline.test', 'not-the-password');
      const response = await answer;
      expect(response.status()).toBe(401);
      const body = (await response.json()) as { error: string; message: string };
      expect(body.error).toBe('auth.bad-credentials');
      expect(body.message.length).toBeGreaterThan(0);

      const alert = page.getByRole('form', { name: 'Sign in' }).getByRole('alert');
      await alert.waitFor();
      expect(await alert.innerText()).toContain(body.message);
      // Focus moves to the message so screen readers read it and keyboard users start there.
      await page.waitForFunction(() => document.activeElement?.getAttribute('role') === 'alert');

      expect(new URL(page.url()).pathname).toBe('/sign-in');
      expect(await mainNav(page).count()).toBe(0);
    });
  });

  it('checks the form before sending it and puts focus on the first problem', async () => {
    await withPage(async (page) => {
      await page.goto('/sign-in');
      let posted = false;
      page.on('request', (r) => {
        if (r.method() === 'POST') posted = true;
      });
      const form = page.getByRole('form', { name: 'Sign in' });
      await form.getByRole('button', { name: 'Sign in' }).click();
      const email = form.getByLabel('E-mail address');
      await page.waitForFunction(() => document.activeElement?.getAttribute('type') === 'email');
      expect(await email.getAttribute('aria-invalid')).toBe('true');
      const describedBy = (await email.getAttribute('aria-describedby')) ?? '';
      expect(describedBy).not.toBe('');
      expect(await page.locator(`[id="${describedBy.split(' ').pop()}"]`).innerText()).toContain('Enter a valid e-mail address');
      expect(posted).toBe(false);
    });
  });
});
