// Results in a real browser: the demo architect browses a checked revision (overview,
// ledger, member sheet with its drawing and working) and finds no upload or override
// controls; the demo engineer uploads a model through the page and watches it reach
// "checked", then overrides a member's grade with a reason and sees the new utilisation
// in the ledger and on the sheet.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Browser, Page } from 'playwright-core';
import { JOB_STATUS_LABELS, type MemberRow } from '@shared/api';
import { startTestApp, type TestApp } from '../support/test-app';
import { inSignedInPage, launchBrowser } from '../support/browser';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { importSample } from '../support/imports';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));

let app: TestApp;
let browser: Browser;
let engineer: Caller;
let projectId: number;
let revisionId: number;
let rows: MemberRow[];

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  browser = await launchBrowser();
  engineer = await signIn(app.url, DEMO.engineer);
  ({ projectId, revisionId } = await importSample(engineer, SAMPLE));
  rows = (await engineer.call('get', `/api/projects/${projectId}/revisions/${revisionId}/members?pageSize=500`)).body.members;
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

const withPage = (email: string, run: (page: Page) => Promise<void>) => inSignedInPage(browser, app.url, email, run, { width: 1400, height: 900 });

const ledger = (page: Page) => page.getByRole('table', { name: /^Members of this revision/ });
const rowOf = (page: Page, globalId: string) => ledger(page).locator(`tr[data-global-id="${globalId}"]`);

/** Filters the ledger down to one member with the search box and returns its utilisation cell's text. */
async function utilisationInLedger(page: Page, globalId: string): Promise<string> {
  await page.getByRole('search').getByLabel('Search').fill(globalId);
  await page.waitForFunction(() => document.querySelectorAll('table[data-ledger] tbody tr').length === 1);
  const row = rowOf(page, globalId);
  await row.waitFor();
  return (await row.locator('td').nth(8).innerText()).replace(/\s+/g, ' ').trim();
}

describe('results in the browser', () => {
  it('the architect opens the project, the revision, the ledger and a member sheet with its drawing and working', async () => {
    // A member with bolt holes and a result: its sheet has a drawing with a fracture chain.
    const member = rows.find((m) => m.holeCount >= 2 && m.utilisation !== null);
    expect(member).toBeDefined();

    await withPage(DEMO.viewer, async (page) => {
      await page.getByRole('link', { name: /Kestrel Yard/ }).first().click();
      await page.getByRole('heading', { level: 2, name: 'Models' }).waitFor();
      await page.getByRole('link', { name: /Open the results of revision/ }).first().click();
      await page.waitForURL((url) => url.pathname === `/projects/${projectId}/revisions/${revisionId}`);

      // Overview: counts per band, the histogram, the most critical members.
      await page.getByRole('img', { name: 'Members by utilisation' }).waitFor();
      expect(await page.locator('[data-band-count]').count()).toBe(5);
      expect(await page.getByRole('list', { name: 'Most critical members' }).getByRole('listitem').count()).toBeGreaterThan(0);

      // The ledger: every tension member, more than one band among them.
      await ledger(page).waitFor();
      const shown = await ledger(page).locator('tbody tr').count();
      expect(shown).toBe(rows.length);
      const bands = new Set(await ledger(page).locator('tbody [data-band]').evaluateAll((els) => els.map((e) => e.getAttribute('data-band'))));
      expect(bands.size).toBeGreaterThan(1);

      // Sorting by a header says so to assistive technology.
      await ledger(page).getByRole('button', { name: /^Tag/ }).click();
      await page.waitForFunction(() => document.querySelector('th[aria-sort]')?.textContent?.includes('Tag'));
      expect(await ledger(page).locator('th[aria-sort="ascending"]').count()).toBe(1);

      // A viewer gets no exports.
      expect(await page.getByRole('navigation', { name: 'Export the members shown' }).count()).toBe(0);

      // Open the member's sheet from the ledger by its GlobalId.
      await rowOf(page, member!.globalId).getByRole('link', { name: member!.globalId }).click();
      await page.waitForURL((url) => url.pathname.endsWith(`/members/${encodeURIComponent(member!.globalId)}`));
      const drawing = page.locator('svg[data-end-drawing]').first();
      await drawing.waitFor();
      expect(await drawing.locator('[data-hole] circle').count()).toBeGreaterThanOrEqual(2);
      expect(await page.locator('svg[data-end-drawing] polyline[data-chain="governing"]').count()).toBe(1);
      expect(await page.getByRole('list', { name: 'Fracture chains' }).getByRole('listitem').count()).toBeGreaterThan(1);
      const steps = page.getByRole('list', { name: 'Steps of the check' }).getByRole('listitem');
      expect(await steps.count()).toBeGreaterThan(3);
      expect(await page.locator('[data-step="An"]').innerText()).toMatch(/mm²/);
      await page.getByRole('table', { name: 'Assumed values and their sources' }).waitFor();
      expect(await page.locator('[data-cautions] li').count()).toBeGreaterThanOrEqual(5);

      // Pointing at a next chain draws it on the plate.
      await page.locator('[data-chain-item="a0"]').hover();
      await page.locator('svg[data-end-drawing] polyline[data-chain="a0"]').waitFor({ state: 'attached' });

      // No override controls for a viewer, anywhere on the sheet.
      expect(await page.getByRole('form', { name: 'Override inputs' }).count()).toBe(0);
      expect(await page.getByRole('button', { name: /Save and check again/ }).count()).toBe(0);
      expect(await page.getByLabel('Reason').count()).toBe(0);

      // …nor upload or forces controls on the project page.
      await page.goto(`/projects/${projectId}`);
      await page.getByRole('heading', { level: 2, name: 'Models' }).waitFor();
      await page.getByRole('list', { name: 'Models' }).waitFor();
      expect(await page.getByRole('form', { name: 'Upload a model' }).count()).toBe(0);
      expect(await page.locator('input[type="file"]').count()).toBe(0);
      expect(await page.getByRole('button', { name: /forces file/i }).count()).toBe(0);
      // …nor the project log, which the server refuses to viewers.
      expect(await page.getByRole('region', { name: 'Project log' }).count()).toBe(0);
    });
  });

  it('the engineer uploads a model through the page and watches it reach "checked"', async () => {
    await withPage(DEMO.engineer, async (page) => {
      await page.goto(`/projects/${projectId}`);
      const form = page.getByRole('form', { name: 'Upload a model' });
      await form.getByLabel('IFC file').setInputFiles({ name: 'kestrel-yard-shed.ifc', mimeType: 'application/octet-stream', buffer: SAMPLE });
      await form.getByLabel(/Model name/).fill('Shed uploaded in the browser');
      await form.getByRole('button', { name: 'Upload and check' }).click();
      const progress = page.getByRole('region', { name: 'Import progress' });
      await progress.waitFor();
      await progress.locator('[data-job-status="done"]').waitFor({ timeout: 90_000 });
      expect(await progress.innerText()).toContain(JOB_STATUS_LABELS.done);
      await progress.getByRole('link', { name: /Open the results of revision 1/ }).waitFor();
      // The new model is listed with its checked revision.
      await page.getByRole('article', { name: 'Shed uploaded in the browser' }).waitFor();

      // The project log names the upload, who made it, and (filtered to uploads) only uploads.
      const log = page.getByRole('region', { name: 'Project log' });
      const entry = log.getByRole('table', { name: /^Project log/ }).locator('tbody tr', { hasText: 'Shed uploaded in the browser, revision 1' });
      await entry.waitFor();
      expect(await entry.innerText()).toContain('Ewan Marsh (demo engineer)');
      expect(await entry.innerText()).toContain('Uploaded a model');
      await log.getByLabel('Show').selectOption('upload');
      await log.getByRole('table', { name: /^Project log: \d+ uploads,/ }).waitFor();
      const actions = await log.locator('tbody th[scope="row"]').allInnerTexts();
      expect(actions.length).toBeGreaterThan(0);
      expect(new Set(actions)).toEqual(new Set(['Uploaded a model']));
      await log.getByLabel('Show').selectOption('export');
      await log.getByText('Nothing logged yet').waitFor();

      // The same bytes again under the same name: said plainly, nothing re-checked.
      await form.getByLabel('IFC file').setInputFiles({ name: 'kestrel-yard-shed.ifc', mimeType: 'application/octet-stream', buffer: SAMPLE });
      await form.getByLabel(/Model name/).fill('Shed uploaded in the browser');
      await form.getByRole('button', { name: 'Upload and check' }).click();
      await page.getByText('Already uploaded').waitFor();

      // A file that is not IFC: the server's refusal is shown.
      await form.getByLabel('IFC file').setInputFiles({ name: 'notes.ifc', mimeType: 'application/octet-stream', buffer: Buffer.from('not a model at all') });
      await form.getByRole('button', { name: 'Upload and check' }).click();
      const alert = form.getByRole('alert');
      await alert.waitFor();
      expect((await alert.innerText()).length).toBeGreaterThan(20);
    });
  });

  it("the engineer overrides a member's grade with a reason and sees the utilisation change in the ledger and on the sheet", async () => {
    // Governed by yield or fracture, so a different grade must move the result.
    const target = rows.find((m) => m.utilisation !== null && /yield|fracture/.test(m.governing ?? '') && !/355/.test(m.grade ?? ''));
    expect(target).toBeDefined();
    const newGrade = 'S355J2';

    await withPage(DEMO.engineer, async (page) => {
      await page.goto(`/projects/${projectId}/revisions/${revisionId}`);
      await ledger(page).waitFor();
      const before = await utilisationInLedger(page, target!.globalId);
      expect(before).toBe(target!.utilisation!.toFixed(2));

      await rowOf(page, target!.globalId).getByRole('link', { name: target!.globalId }).click();
      const form = page.getByRole('form', { name: 'Override inputs' });
      await form.waitFor();
      const summaryUtilisation = page.locator('dl[aria-label="Result"] dd').first();
      expect((await summaryUtilisation.innerText()).trim()).toBe(before);

      // Without a reason the form refuses and puts focus on the reason.
      await form.getByLabel(/^Grade/).fill(newGrade);
      await form.getByRole('button', { name: 'Save and check again' }).click();
      await page.waitForFunction(() => document.activeElement?.getAttribute('name') === 'reason');

      await form.getByLabel('Reason').fill('Mill certificates show S355J2 for this delivery.');
      await form.getByRole('button', { name: 'Save and check again' }).click();
      await form.getByRole('status').getByText('Override saved').waitFor();

      // The sheet shows the new result, the override with who and why, and the trail.
      await page.waitForFunction((old) => document.querySelector('dl[aria-label="Result"] dd')?.textContent?.trim() !== old, before);
      const after = (await summaryUtilisation.innerText()).trim();
      expect(after).not.toBe(before);
      const active = page.locator('[data-override="grade"]');
      await active.waitFor();
      expect(await active.innerText()).toContain(newGrade);
      expect(await active.innerText()).toContain('Mill certificates');
      await page.getByRole('table', { name: /^Changes to this member/ }).getByText('Mill certificates show S355J2 for this delivery.').waitFor();

      // Back in the ledger, the same member carries the new figure.
      await page.getByRole('link', { name: '← Member ledger' }).click();
      await ledger(page).waitFor();
      expect(await utilisationInLedger(page, target!.globalId)).toBe(after);
    });
  });
});
