import os from 'node:os';
import path from 'node:path';
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
 * uncaught page error; on failure a full-page screenshot is kept (its path is printed) for
 * whoever reads the failure. The context is closed whatever happens.
 */
export async function inSignedInPage(
  browser: Browser,
  baseURL: string,
  email: string,
  run: (page: Page) => Promise<void>,
  viewport = { width: 1400, height: 1000 },
): Promise<void> {
  const context: BrowserContext = await browser.newContext({ baseURL, viewport });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  try {
    await signInThroughPage(page, email, DEMO_PASSWORD);
    await run(page);
    if (problems.length) throw new Error(problems.join('\n'));
  } catch (error) {
    const shot = path.join(os.tmpdir(), `gaugeline-e2e-${Date.now()}.png`);
    await page.screenshot({ path: shot, fullPage: true }).catch(() => undefined);
    console.error(`screenshot of the failing page: ${shot}; page problems: ${problems.join('; ') || 'none'}`);
    throw error;
  } finally {
    await context.close();
  }
}

/** Signs in through the sign-in page and waits for the project list. */
export async function signInThroughPage(page: Page, email: string, password: string): Promise<void> {
  await page.goto('/sign-in');
  const form = page.getByRole('form', { name: 'Sign in' });
  await form.getByLabel('E-mail address').fill(email);
  await form.getByLabel('Password', { exact: true }).fill(password);
  await form.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
}
