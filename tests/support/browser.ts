import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../server/db/seed/demo-seed';

/** Debian's Chromium, headless, with the flags this closed network needs (playwright gives it a fresh profile). */
export async function launchBrowser(): Promise<Browser> {
  const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  return chromium.launch({
    executablePath,
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--use-angle=swiftshader',
      '--enable-unsafe-swiftshader',
    ],
  });
}

/**
 * Signs in through the page in a fresh browser context, runs `run`, and fails the test on any
 * uncaught page error; the context is closed whatever happens.
 */
export async function inSignedInPage(browser: Browser, baseURL: string, email: string, run: (page: Page) => Promise<void>): Promise<void> {
  const context: BrowserContext = await browser.newContext({ baseURL, viewport: { width: 1400, height: 1000 } });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  try {
    await page.goto('/sign-in');
    const form = page.getByRole('form', { name: 'Sign in' });
    await form.getByLabel('E-mail address').fill(email);
    await form.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
    await form.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
    await run(page);
    if (problems.length) throw new Error(problems.join('\n'));
  } finally {
    await context.close();
  }
}
