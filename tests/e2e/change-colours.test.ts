// Colour by change in a real browser (SwiftShader WebGL): two revisions of the demo shed that
// differ in known ways (one brace taken out and another put in its place, one section renamed,
// design forces raised on two members, one of them into the tight band, and lowered on another); the revision page's 3D view,
// switched to "change since revision 1", draws the change colours (read back from the canvas),
// names a hovered member's changes in words, lists the taken-out brace beside the view and
// keeps the cautions; the changes page shows the same view.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Browser, Page } from 'playwright-core';
import type { MemberRow } from '@shared/api';
import { CHANGE_PRECEDENCE, CHANGE_STYLE, changeLookOf } from '@shared/compare/change-look';
import type { ChangeKind } from '@shared/compare/compare-revisions';
import { startTestApp, type TestApp } from '../support/test-app';
import { inSignedInPage, launchBrowser } from '../support/browser';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { importEnded, importSample, uploadFile } from '../support/imports';
import { censusOfCanvas } from '../support/canvas-census';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
const FORCES = readFileSync(path.join(root, 'samples/kestrel-yard-forces.csv'), 'utf8');
const SHOTS = path.join(root, '.test-data', 'screenshots');
/** Wall brace east (tag EB1): in revision 2 it has a new GlobalId and tag, so it is taken out and a new member put in. */
const TAKEN_OUT = '3I5qe2dofLtFBFIakaWyri';
const PUT_IN = '3I5qe2dofLtFBFIakaWy00';

let app: TestApp;
let browser: Browser;
let engineer: Caller;
let projectId: number;
let r1: number;
let r2: number;
let changes: { globalId: string; kinds: ChangeKind[] }[];

/** The forces table with each listed member's forces multiplied, and some members left out. */
function scaledForces(factor: Record<string, number>, leaveOut: string[]): string {
  const [head, ...lines] = FORCES.trim().split('\n');
  const out = lines
    .filter((l) => !leaveOut.includes(l.split(',')[0]))
    .map((l) => {
      const cells = l.split(',');
      const f = factor[cells[0]] ?? 1;
      cells[2] = (Number(cells[2]) * f).toFixed(1);
      return cells.join(',');
    });
  return [head, ...out].join('\n') + '\n';
}

async function postForces(revisionId: number, csv: string): Promise<void> {
  const res = await engineer.call('post', `/api/projects/${projectId}/revisions/${revisionId}/forces`, { csv });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
}

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  browser = await launchBrowser();
  engineer = await signIn(app.url, DEMO.engineer);
  ({ projectId, revisionId: r1 } = await importSample(engineer, SAMPLE));
  await postForces(r1, FORCES);
  const rows: MemberRow[] = (await engineer.call('get', `/api/projects/${projectId}/revisions/${r1}/members?pageSize=500`)).body.members;
  const withResult = rows.filter((r) => r.utilisation != null && r.globalId !== TAKEN_OUT).sort((a, b) => a.utilisation! - b.utilisation!);
  expect(withResult.length, 'tension members with a result in revision 1').toBeGreaterThan(3);
  // The least used member becomes tight (newly critical); the next one only rises; the most used one falls.
  const critical = withResult[0];
  const raised = withResult[1];
  const lowered = withResult[withResult.length - 1];
  expect(raised.utilisation!, 'room to rise without becoming tight').toBeLessThan(0.7);

  // Revision 2: the brace replaced, the first flat-bar section renamed, forces raised and lowered.
  let text = SAMPLE.toString('latin1');
  expect(text.split(`'${TAKEN_OUT}'`).length).toBe(2);
  text = text.replace(`'${TAKEN_OUT}'`, `'${PUT_IN}'`).replace(`,'EB1',.BRACE.)`, `,'EB2',.BRACE.)`);
  const profile = /'(FL\d+x\d+)'/.exec(text)![1];
  text = text.replace(`'${profile}'`, `'${profile}B'`);
  const up = await uploadFile(engineer, projectId, Buffer.from(text, 'latin1'), 'kestrel-yard-shed.ifc');
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  r2 = up.body.revision.id;
  expect(up.body.revision.number).toBe(2);
  expect((await importEnded(engineer, projectId, r2)).body.status).toBe('done');
  const factors = { [critical.globalId]: 0.95 / critical.utilisation!, [raised.globalId]: Math.min(1.3, 0.8 / raised.utilisation!), [lowered.globalId]: 0.5 };
  await postForces(r2, scaledForces(factors, [TAKEN_OUT]));

  changes = (await engineer.call('get', `/api/projects/${projectId}/revisions/${r2}/comparison?with=${r1}`)).body.changes;
  const kindsOf = (g: string) => changes.find((c) => c.globalId === g)?.kinds ?? [];
  expect(kindsOf(TAKEN_OUT)).toEqual(['removed']);
  expect(kindsOf(PUT_IN)).toContain('added');
  expect(kindsOf(critical.globalId)).toEqual(expect.arrayContaining(['force-changed', 'utilisation-up', 'newly-critical']));
  expect(kindsOf(raised.globalId)).toEqual(['force-changed', 'utilisation-up']);
  expect(kindsOf(lowered.globalId)).toEqual(expect.arrayContaining(['force-changed', 'utilisation-down']));
  expect(changes.some((c) => c.kinds.includes('resized'))).toBe(true);
  mkdirSync(SHOTS, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

const asArchitect = (run: (page: Page) => Promise<void>) => inSignedInPage(browser, app.url, DEMO.viewer, run);

const CHANGE_COLOURS = CHANGE_PRECEDENCE.map((kind) => ({ band: kind, colour: CHANGE_STYLE[kind].colour }));
/** Kind each changed member is drawn as (by the same function the view uses). */
const shownAs = (globalId: string) => {
  const look = changeLookOf(changes.find((c) => c.globalId === globalId)?.kinds ?? []);
  return look.kind === 'drawn' ? look.shownAs : look.kind;
};

/** Waits until the view has repainted: at least one change colour is on the canvas. */
async function changeCensus(page: Page) {
  let census = await censusOfCanvas(page, CHANGE_COLOURS);
  for (let tries = 0; tries < 40 && Object.values(census.counts).every((n) => n < 20); tries++) {
    await page.waitForTimeout(250);
    census = await censusOfCanvas(page, CHANGE_COLOURS);
  }
  // On a loaded machine the first coloured frame can be a partial one: read until two reads agree.
  for (let tries = 0; tries < 20; tries++) {
    await page.waitForTimeout(250);
    const again = await censusOfCanvas(page, CHANGE_COLOURS);
    if (JSON.stringify(again.counts) === JSON.stringify(census.counts)) break;
    census = again;
  }
  return census;
}

describe('colour by change', () => {
  it('draws the kinds of change in their colours, names a hovered member’s changes and lists the taken-out brace', async () => {
    const expectedKinds = new Set(changes.map((c) => shownAs(c.globalId)).filter((k) => k !== 'removed'));
    expect(expectedKinds.size, [...expectedKinds].join(', ')).toBeGreaterThanOrEqual(4);

    await asArchitect(async (page) => {
      await page.goto(`/projects/${projectId}/revisions/${r2}`);
      const canvasArea = page.getByTestId('model-view-canvas');
      await canvasArea.locator('canvas').waitFor();
      await page.waitForFunction(() => window.__gaugelineView !== undefined, undefined, { timeout: 60_000 });
      await canvasArea.evaluate((el) => el.scrollIntoView({ block: 'center' }));

      // Result-band colouring first: none of the change colours is on the canvas.
      const before = await censusOfCanvas(page, CHANGE_COLOURS);
      console.log(`change-colour pixels while coloured by band: ${JSON.stringify(before.counts)}`);

      await page.getByLabel('Colour by').selectOption({ label: 'change since revision 1' });
      const key = page.getByTestId('model-view-overlay-key');
      await key.waitFor();
      expect(await key.innerText()).toMatch(/change since revision 1/i);
      expect(await key.innerText()).toMatch(/first of them in this list/);
      // One key line per drawn kind, in precedence order, with its count in the model.
      expect(await key.locator('[data-overlay-entry]').evaluateAll((els) => els.map((e) => e.getAttribute('data-overlay-entry')))).toEqual([...CHANGE_PRECEDENCE]);

      const census = await changeCensus(page);
      const box = (await canvasArea.boundingBox())!;
      await page.screenshot({ path: path.join(SHOTS, 'model-view-changes.png'), clip: { x: box.x - 10, y: box.y - 120, width: 1400 - box.x, height: box.height + 180 } });
      console.log(`change-colour pixels after "colour by change": ${JSON.stringify(census.counts)} of ${census.width}×${census.height}`);
      const seen = Object.entries(census.counts).filter(([, n]) => n >= 20).map(([k]) => k);
      expect(seen.length, JSON.stringify(census.counts)).toBeGreaterThanOrEqual(4);
      for (const k of seen) expect(expectedKinds.has(k as never), `${k} seen but no member is drawn as it`).toBe(true);
      const gained = seen.filter((k) => census.counts[k] > 3 * (before.counts[k] ?? 0) + 20);
      expect(gained.length, `colours that appeared on switching: ${JSON.stringify(census.counts)} vs ${JSON.stringify(before.counts)}`).toBeGreaterThanOrEqual(4);

      // Close up (N fits the most critical drawn member, Escape lets it go), then hover a patch of a
      // change colour: the tooltip says that change in words; a click picks it.
      await canvasArea.focus();
      await page.keyboard.press('n');
      await page.getByTestId('model-view-card').waitFor();
      await page.keyboard.press('Escape');
      await page.getByTestId('model-view-card').waitFor({ state: 'detached' });
      await page.waitForTimeout(300);
      const close = await censusOfCanvas(page, CHANGE_COLOURS);
      console.log(`change-colour pixels, close up: ${JSON.stringify(close.counts)}`);
      const kind = CHANGE_PRECEDENCE.find((k) => close.points[k]);
      expect(kind, JSON.stringify(close.counts)).toBeDefined();
      const at = close.points[kind!];
      await page.mouse.move(box.x + at.x, box.y + at.y);
      const hoverWords = page.getByTestId('model-view-hover-words');
      await hoverWords.waitFor();
      const hovered = await hoverWords.innerText();
      const wordOf: Record<string, RegExp> = {
        'newly-critical': /now tight or over/,
        'utilisation-up': /utilisation higher/,
        added: /new member/,
        resized: /section changed/,
        regraded: /grade changed/,
        rebolted: /holes changed/,
        'force-changed': /design force changed/,
        'utilisation-down': /utilisation lower/,
      };
      expect(hovered).toMatch(wordOf[kind!]);
      await page.mouse.click(box.x + at.x, box.y + at.y);
      const card = page.getByTestId('model-view-card');
      await card.waitFor();
      const globalId = (await card.locator('[data-global-id]').getAttribute('data-global-id'))!;
      expect(shownAs(globalId)).toBe(kind);
      const cardWords = await page.getByTestId('model-view-card-words').innerText();
      for (const k of changes.find((c) => c.globalId === globalId)!.kinds) expect(cardWords).toMatch(wordOf[k]);
      // The first line names the change that gives the colour.
      expect(cardWords.split('\n')[0]).toMatch(wordOf[kind!]);

      // The taken-out brace cannot be drawn: it is listed beside the view, linked to its sheet in revision 1.
      const absent = page.getByTestId('model-view-absent');
      expect(await absent.innerText()).toMatch(/taken out since revision 1/i);
      expect(await absent.locator(`[data-global-id="${TAKEN_OUT}"] a`).getAttribute('href')).toBe(`/projects/${projectId}/revisions/${r1}/members/${TAKEN_OUT}`);
      expect(await absent.innerText()).toMatch(/EB1/);

      // Cautions stay on the view and the page.
      expect(await page.getByTestId('model-view-cautions').innerText()).toMatch(/licensed engineer/);
      expect(await page.locator('[data-cautions]').count()).toBe(1);

      // Back to result bands: the band key returns.
      await page.getByLabel('Colour by').selectOption({ label: 'result band' });
      await key.waitFor({ state: 'detached' });
      await page.getByRole('list', { name: 'Result bands in the model' }).waitFor();
    });
  });

  it('shows the newer revision coloured by change on the changes page', async () => {
    await asArchitect(async (page) => {
      await page.goto(`/projects/${projectId}/revisions/${r2}/changes`);
      await page.getByRole('heading', { level: 1, name: 'What changed in revision 2' }).waitFor();
      const key = page.getByTestId('model-view-overlay-key');
      await key.waitFor({ timeout: 60_000 });
      const census = await changeCensus(page);
      console.log(`change-colour pixels on the changes page: ${JSON.stringify(census.counts)}`);
      expect(Object.values(census.counts).filter((n) => n >= 20).length, JSON.stringify(census.counts)).toBeGreaterThanOrEqual(2);
      await page.getByTestId('model-view-absent').locator(`[data-global-id="${TAKEN_OUT}"]`).waitFor();
      expect(await page.getByTestId('model-view-cautions').innerText()).toMatch(/licensed engineer/);
    });
  });
});
