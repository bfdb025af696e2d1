// The 3D model view in a real browser (SwiftShader WebGL): the demo architect opens a
// checked revision with forces applied and sees members drawn in several band colours;
// clicking a member shows its card with the GlobalId, and the ledger shares the selection.
// Prints the draw calls and the time to the first coloured frame.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Browser, Page } from 'playwright-core';
import { BAND_STYLE, RESULT_BANDS, type MemberRow, type ResultBand } from '@shared/api';
import { startTestApp, type TestApp } from '../support/test-app';
import { inSignedInPage, launchBrowser } from '../support/browser';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { importSample } from '../support/imports';
import { censusOfCanvas } from '../support/canvas-census';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
const FORCES = readFileSync(path.join(root, 'samples/kestrel-yard-forces.csv'), 'utf8');
const SHOTS = path.join(root, '.test-data', 'screenshots');

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
  const forces = await engineer.call('post', `/api/projects/${projectId}/revisions/${revisionId}/forces`, { csv: FORCES });
  expect(forces.status, JSON.stringify(forces.body)).toBe(200);
  rows = (await engineer.call('get', `/api/projects/${projectId}/revisions/${revisionId}/members?scope=all&pageSize=500`)).body.members;
  mkdirSync(SHOTS, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

const asArchitect = (run: (page: Page) => Promise<void>) => inSignedInPage(browser, app.url, DEMO.viewer, run);

describe('3D model view', () => {
  it('shows members in several band colours, and a click picks a member into the card and the ledger', async () => {
    const expectedBands = new Set(rows.filter((r) => r.isTension).map((r) => r.band));
    expect(expectedBands.size, `bands in the data: ${[...expectedBands].join(', ')}`).toBeGreaterThan(1);

    await asArchitect(async (page) => {
      await page.goto(`/projects/${projectId}/revisions/${revisionId}`);
      await page.getByTestId('model-view-canvas').locator('canvas').waitFor();
      await page.waitForFunction(() => window.__gaugelineView !== undefined, undefined, { timeout: 60_000 });
      const stats = await page.evaluate(() => window.__gaugelineView!);
      console.log(`model view (sample): ${stats.memberCount} steel elements, ${stats.drawCalls} draw calls, first coloured frame ${stats.firstColouredFrameMs} ms after navigation (${stats.sinceMountMs} ms after the view mounted)`);
      expect(stats.drawCalls).toBeGreaterThan(0);
      expect(stats.drawCalls).toBeLessThan(100);

      // Cautions are on the view.
      expect(await page.getByTestId('model-view-cautions').innerText()).toMatch(/licensed engineer/);

      await page.getByTestId('model-view-canvas').evaluate((el) => el.scrollIntoView({ block: 'center' }));
      let canvasBox = (await page.getByTestId('model-view-canvas').boundingBox())!;
      await page.screenshot({ path: path.join(SHOTS, 'model-view.png'), clip: { x: canvasBox.x - 10, y: canvasBox.y - 120, width: 1400 - canvasBox.x, height: canvasBox.height + 180 } });
      const bands = RESULT_BANDS.map((band) => ({ band, colour: BAND_STYLE[band].colour }));
      const census = await censusOfCanvas(page, bands);
      console.log(`pixels per band, whole model: ${JSON.stringify(census.counts)} of ${census.width}×${census.height}`);
      const seen = Object.entries(census.counts).filter(([, n]) => n >= 20).map(([b]) => b as ResultBand);
      expect(seen.length, JSON.stringify(census.counts)).toBeGreaterThan(1);
      for (const b of seen) expect(expectedBands.has(b), b).toBe(true);

      // Keyboard path: N goes to the most critical member, selects it and shows its card.
      const card = page.getByTestId('model-view-card');
      const canvasArea = page.getByTestId('model-view-canvas');
      await canvasArea.focus();
      await page.keyboard.press('n');
      await card.waitFor();
      await page.screenshot({ path: path.join(SHOTS, 'model-view-critical.png'), clip: { x: canvasBox.x - 10, y: canvasBox.y - 120, width: 1400 - canvasBox.x, height: canvasBox.height + 180 } });
      const top = [...rows].filter((r) => r.isTension && r.utilisation != null).sort((a, b) => b.utilisation! - a.utilisation!)[0];
      expect(await card.locator('[data-global-id]').getAttribute('data-global-id')).toBe(top.globalId);
      // Escape clears the selection; the camera stays close to that member.
      await page.keyboard.press('Escape');
      await card.waitFor({ state: 'detached' });
      await page.waitForTimeout(300);

      // Pick with the mouse: hover shows the tooltip, a click fills the card.
      const close = await censusOfCanvas(page, bands);
      console.log(`pixels per band, close up: ${JSON.stringify(close.counts)}`);
      const band = (['over', 'tight', 'working', 'unknown', 'spare'] as const).find((b) => close.points[b]);
      expect(band, JSON.stringify(close.counts)).toBeDefined();
      const at = close.points[band!];
      canvasBox = (await page.getByTestId('model-view-canvas').boundingBox())!;
      await page.mouse.move(canvasBox.x + at.x, canvasBox.y + at.y);
      await page.getByRole('tooltip').waitFor();
      await page.mouse.click(canvasBox.x + at.x, canvasBox.y + at.y);
      await card.waitFor();
      const globalId = await card.locator('[data-global-id]').getAttribute('data-global-id');
      expect(globalId).toMatch(/^[0-9A-Za-z_$]{22}$/);
      expect(await card.innerText()).toContain(globalId!);
      const row = rows.find((r) => r.globalId === globalId);
      expect(row, 'the picked element is a member of the revision').toBeDefined();
      expect(row!.band).toBe(band);
      // The card leads to the member sheet.
      expect(await card.getByRole('link', { name: /member sheet/ }).getAttribute('href')).toBe(`/projects/${projectId}/revisions/${revisionId}/members/${globalId}`);
      // The selection is the page's: the ledger marks the same member as selected.
      const selected = await page.evaluate((rid) => JSON.parse(sessionStorage.getItem(`gaugeline.selection.${rid}`) ?? '[]'), revisionId);
      expect(selected).toEqual([globalId]);
      await page.screenshot({ path: path.join(SHOTS, 'model-view-picked.png'), clip: { x: canvasBox.x - 10, y: canvasBox.y - 120, width: 1400 - canvasBox.x, height: canvasBox.height + 180 } });

    });
  });
});
