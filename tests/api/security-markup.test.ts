// Markup, script and formulas in a model's member names and tags are data, never code:
// the API returns them as plain JSON strings, the member ledger and member sheet render
// them as text in a real browser (no dialog, no injected element), CSV cells that a
// spreadsheet would run as formulas are defused, the workbook holds them as plain strings,
// and the BCF XML escapes them.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import ExcelJS from 'exceljs';
import yauzl from 'yauzl';
import { parse } from 'csv-parse/sync';
import type { Browser, Page } from 'playwright-core';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { importEnded, uploadFile } from '../support/imports';
import { launchBrowser } from '../support/browser';
import { buildModel, memberGuid } from '../../scripts/samples/make-samples';
import { KESTREL_MEMBERS } from '../../scripts/samples/kestrel-yard';
import { DEMO_PASSWORD } from '../../server/db/seed/demo-seed';

/** [Name, Tag] pairs written into the model. No apostrophes or backslashes: those are STEP syntax. */
const PAYLOADS: [string, string][] = [
  ['<script>alert(1)</script>', '"><img src=x onerror=alert(2)>'],
  ['"><img src=x onerror=alert(3)>', '<svg onload=alert(4)>'],
  ['=HYPERLINK("http://example.test/x","open")', '+1+2'],
  ['@SUM(1,2)', '-2+3'],
  ['<iframe src=javascript:alert(5)></iframe>', '=1+1'],
];
const FORMULA_START = /^[=+\-@]/;

let app: TestApp;
let engineer: Caller;
let projectId: number;
let revisionId: number;
let browser: Browser | undefined;
const base = () => `/api/projects/${projectId}/revisions/${revisionId}`;
/** GlobalId of each payload member, in PAYLOADS order. */
const gids: string[] = [];

beforeAll(async () => {
  // The shed's members, the first few renamed and re-tagged with payloads.
  const targets = KESTREL_MEMBERS.filter((m) => m.ifcClass === 'IfcMember').slice(0, PAYLOADS.length);
  const members = KESTREL_MEMBERS.map((m) => {
    const i = targets.indexOf(m);
    if (i < 0) return m;
    gids[i] = memberGuid(PAYLOADS[i][1]);
    return { ...m, name: PAYLOADS[i][0], key: PAYLOADS[i][1], bolts: m.bolts.map((g) => ({ ...g, connects: undefined })) };
  });
  const bytes = await buildModel('IFC4', members, '<b>Markup</b> project');
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  engineer = await signIn(app.url, DEMO.engineer);
  projectId = (await engineer.call('get', '/api/projects')).body.projects[0].id;
  const up = await uploadFile(engineer, projectId, bytes, 'markup.ifc', '<img src=x onerror=alert(6)> model');
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  revisionId = up.body.revision.id;
  const done = await importEnded(engineer, projectId, revisionId);
  expect(done.body.status, JSON.stringify(done.body.failure)).toBe('done');
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await app?.stop();
});

describe('markup in member names and tags', () => {
  it('the API returns them unchanged as JSON strings', async () => {
    const res = await engineer.call('get', `${base()}/members?pageSize=500&scope=all`);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    const byGid = new Map(res.body.members.map((m: { globalId: string }) => [m.globalId, m]));
    PAYLOADS.forEach(([name, tag], i) => {
      expect(byGid.get(gids[i]), `member ${i}`).toMatchObject({ name, tag });
    });
    const sheet = await engineer.call('get', `${base()}/members/${gids[0]}`);
    expect(sheet.body.member).toMatchObject({ name: PAYLOADS[0][0], tag: PAYLOADS[0][1] });
  });

  it('CSV export: every cell a spreadsheet would run as a formula is defused; markup stays literal', async () => {
    const res = await engineer.agent.get(`${base()}/exports/csv`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    const rows: Record<string, string>[] = parse((res.body as Buffer).toString('utf8'), { columns: true, bom: true });
    const byGid = new Map(rows.map((r) => [r.GlobalId, r]));
    PAYLOADS.forEach(([name, tag], i) => {
      const row = byGid.get(gids[i]);
      expect(row, `member ${i} in the CSV`).toBeDefined();
      expect(row!.Name).toBe(FORMULA_START.test(name) ? `'${name}` : name);
      expect(row!.Tag).toBe(FORMULA_START.test(tag) ? `'${tag}` : tag);
    });
    // No cell anywhere starts a formula.
    for (const row of rows) for (const [column, value] of Object.entries(row)) {
      if (typeof value === 'string' && FORMULA_START.test(value)) expect(value, `${column}`).toMatch(/^-?\d+(\.\d+)?$/);
    }
  });

  it('workbook export: names and tags are plain string cells, never formulas', async () => {
    const res = await engineer.agent.get(`${base()}/exports/xlsx`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as never);
    const found = new Set<string>();
    wb.eachSheet((ws) => {
      ws.eachRow((row) => {
        row.eachCell((cell) => {
          expect(cell.type, `${ws.name}!${cell.address}`).not.toBe(ExcelJS.ValueType.Formula);
          expect(cell.formula, `${ws.name}!${cell.address}`).toBeFalsy();
          for (const [name, tag] of PAYLOADS) {
            for (const p of [name, tag]) if (cell.value === p) {
              expect(cell.type).toBe(ExcelJS.ValueType.String);
              found.add(p);
            }
          }
        });
      });
    });
    for (const [name, tag] of PAYLOADS) {
      expect(found.has(name), name).toBe(true);
      expect(found.has(tag), tag).toBe(true);
    }
  });

  it('BCF export: the XML escapes markup and is well-formed', async () => {
    const res = await engineer.agent.get(`${base()}/exports/bcf?minUtilisation=0`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status, String(res.body)).toBe(200);
    const entries = await unzip(res.body as Buffer);
    const xml = entries.filter((e) => /\.(bcf|bcfv|version|xml)$/.test(e.name));
    expect(xml.length).toBeGreaterThan(0);
    const dir = mkdtempSync(path.join(os.tmpdir(), 'gaugeline-bcf-'));
    try {
      for (const e of xml) {
        expect(e.text, e.name).not.toMatch(/<(script|img|svg|iframe)\b/i);
        const file = path.join(dir, 'x.xml');
        writeFileSync(file, e.text);
        const lint = spawnSync('xmllint', ['--noout', file], { encoding: 'utf8' });
        if (!lint.error) expect(lint.status, `${e.name}: ${lint.stderr}`).toBe(0);
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('the ledger and the member sheet show them as text in a real browser', async () => {
    browser = await launchBrowser();
    const context = await browser.newContext({ baseURL: app.url, viewport: { width: 1400, height: 900 } });
    const page = await context.newPage();
    const dialogs: string[] = [];
    page.on('dialog', (d) => {
      dialogs.push(d.message());
      void d.dismiss();
    });
    try {
      await page.goto('/sign-in');
      const form = page.getByRole('form', { name: 'Sign in' });
      await form.getByLabel('E-mail address').fill(DEMO.engineer);
      await form.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
      await form.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();

      await page.goto(`/projects/${projectId}`);
      await page.getByText('<img src=x onerror=alert(6)> model').first().waitFor();
      await expectNoInjection(page, dialogs);

      await page.goto(`/projects/${projectId}/revisions/${revisionId}`);
      const ledger = page.locator('table[data-ledger]');
      await ledger.waitFor();
      await page.waitForFunction(() => document.querySelectorAll('table[data-ledger] tbody tr').length > 5);
      const text = await ledger.innerText();
      for (const [name, tag] of PAYLOADS) {
        expect(text, name).toContain(name);
        expect(text, tag).toContain(tag);
      }
      await expectNoInjection(page, dialogs);

      for (const i of [0, 1]) {
        await page.goto(`/projects/${projectId}/revisions/${revisionId}/members/${gids[i]}`);
        await page.getByText(PAYLOADS[i][0]).first().waitFor();
        expect(await page.locator('body').innerText()).toContain(PAYLOADS[i][1]);
        await expectNoInjection(page, dialogs);
      }
    } finally {
      await context.close();
    }
  }, 90_000);
});

/** No dialog fired, and nothing from the payloads became an element or an event handler. */
async function expectNoInjection(page: Page, dialogs: string[]) {
  await page.waitForTimeout(300);
  expect(dialogs).toEqual([]);
  const injected = await page.evaluate(() => ({
    xImages: document.querySelectorAll('img[src="x"]').length,
    handlers: document.querySelectorAll('[onerror],[onload]').length,
    iframes: document.querySelectorAll('iframe').length,
    inlineScripts: [...document.querySelectorAll('script')].filter((s) => !s.src).length,
    bold: [...document.querySelectorAll('b')].filter((b) => b.textContent === 'Markup').length,
  }));
  expect(injected).toEqual({ xImages: 0, handlers: 0, iframes: 0, inlineScripts: 0, bold: 0 });
}

function unzip(buf: Buffer): Promise<{ name: string; text: string }[]> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(buf, { lazyEntries: true }, (err, zip) => {
      if (err || !zip) return reject(err);
      const out: { name: string; text: string }[] = [];
      zip.on('entry', (entry: yauzl.Entry) => {
        zip.openReadStream(entry, (e, stream) => {
          if (e || !stream) return reject(e);
          const chunks: Buffer[] = [];
          stream.on('data', (c: Buffer) => chunks.push(c));
          stream.on('end', () => {
            out.push({ name: entry.fileName, text: Buffer.concat(chunks).toString('utf8') });
            zip.readEntry();
          });
        });
      });
      zip.on('end', () => resolve(out));
      zip.on('error', reject);
      zip.readEntry();
    });
  });
}
