// The project log (GET /api/projects/:projectId/audit): uploads, overrides, exports and mail
// sent, with who and when, newest first, paged and filtered by kind; read by the project's
// engineers and admins, refused to its viewers, not found for everyone else.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { importSample } from '../support/imports';
import { waitForMail } from '../support/mail-sink';
import { rawBody } from '../support/raw-body';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));

interface Entry {
  id: number;
  at: string;
  by: { name: string; email: string } | null;
  action: string;
  kind: string | null;
  subject: string;
  revisionNumber: number | null;
  globalId: string | null;
  detail: Record<string, unknown>;
  reason: string | null;
}

let app: TestApp;
let engineer: Caller;
let admin: Caller;
let viewer: Caller;
let projectId: number;
let revisionId: number;
let revisionNumber: number;
let globalId: string;
let log: string;
const exported: Record<string, number> = {};

/** GET with the body kept as bytes, whatever the content type. */
const download = (caller: Caller, url: string) => rawBody(caller.agent.get(url));

async function readLog(caller: Caller, query = ''): Promise<{ total: number; page: number; pageSize: number; entries: Entry[] }> {
  const res = await caller.call('get', `${log}${query}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body;
}

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  [engineer, admin, viewer] = await Promise.all([signIn(app.url, DEMO.engineer), signIn(app.url, DEMO.admin), signIn(app.url, DEMO.viewer)]);
  ({ projectId, revisionId } = await importSample(engineer, SAMPLE));
  log = `/api/projects/${projectId}/audit`;
  const rev = `/api/projects/${projectId}/revisions/${revisionId}`;
  revisionNumber = (await engineer.call('get', rev)).body.number;
  globalId = (await engineer.call('get', `${rev}/members?pageSize=1`)).body.members[0].globalId;

  const override = await engineer.call('patch', `${rev}/members/${globalId}/overrides`, { designForceN: 125_000, reason: 'Site measured force for the log test' });
  expect(override.status, JSON.stringify(override.body)).toBe(200);
  // Two formats by two people, so the log must name each actor rightly.
  const csv = await download(engineer, `${rev}/exports/csv?band=over,tight,working,spare`);
  expect(csv.status).toBe(200);
  exported.csv = Number(csv.headers['x-gaugeline-members']);
  const xlsx = await download(admin, `${rev}/exports/xlsx`);
  expect(xlsx.status).toBe(200);
  exported.xlsx = Number(xlsx.headers['x-gaugeline-members']);
  const mail = await engineer.call('post', `${rev}/send-critical`, { recipients: ['site.team@example.test', DEMO.viewer], message: 'For the log test.', minUtilisation: 0, attach: ['csv', 'pdf'] });
  expect(mail.status, JSON.stringify(mail.body)).toBe(202);
  exported.mail = mail.body.members;
  await waitForMail(app.server.mailSink!.dir, 'site.team@example.test', /^Critical members/);
}, 150_000);

afterAll(async () => {
  await app?.stop();
});

describe('the project log', () => {
  it('lists the upload, override, both exports and the mail, newest first, each with its actor', async () => {
    const page = await readLog(engineer, '?pageSize=50');
    expect(page.total).toBe(page.entries.length);
    expect(page.entries.map((e) => e.action)).toEqual(['mail.critical-members', 'export.created', 'export.created', 'member.override', 'model.uploaded']);
    for (let i = 1; i < page.entries.length; i++) {
      expect(page.entries[i - 1].at >= page.entries[i].at).toBe(true);
      expect(page.entries[i - 1].id).toBeGreaterThan(page.entries[i].id);
    }
    for (const e of page.entries) expect(new Date(e.at).toISOString()).toBe(e.at);
    const [mail, xlsx, csv, override, upload] = page.entries;
    const words = `kestrel-yard-shed, revision ${revisionNumber}`;

    expect(upload).toMatchObject({ kind: 'upload', by: { email: DEMO.engineer, name: 'Ewan Marsh (demo engineer)' }, subject: words, revisionNumber, globalId: null });
    expect(upload.detail).toMatchObject({ fileName: 'kestrel-yard-shed.ifc', size: SAMPLE.length });

    expect(override).toMatchObject({ kind: 'override', by: { email: DEMO.engineer }, revisionNumber, globalId, reason: 'Site measured force for the log test' });
    expect(override.subject).toBe(`member ${globalId} in ${words}`);
    expect(override.detail).toEqual({ change: { designForceN: { before: null, after: 125_000 } } });

    expect(csv).toMatchObject({ kind: 'export', by: { email: DEMO.engineer }, subject: words, revisionNumber, reason: null });
    expect(csv.detail).toMatchObject({ format: 'csv', revision: revisionNumber, members: exported.csv, fileName: `kestrel-yard-shed-r${revisionNumber}-filtered.csv` });
    expect(csv.detail.filter).toMatch(/in band\(s\) over, tight, working, spare/);
    expect(xlsx).toMatchObject({ kind: 'export', by: { email: DEMO.admin, name: 'Ada Okafor (demo admin)' } });
    expect(xlsx.detail).toMatchObject({ format: 'xlsx', revision: revisionNumber, members: exported.xlsx, filter: 'tension members with a check result' });
    expect(exported.xlsx).toBeGreaterThan(0);

    expect(mail).toMatchObject({ kind: 'mail', by: { email: DEMO.engineer }, subject: words, revisionNumber });
    expect(mail.detail).toMatchObject({ revision: revisionNumber, recipients: 2, members: exported.mail, minUtilisation: 0 });
    expect([...(mail.detail.addresses as string[])].sort()).toEqual([DEMO.viewer, 'site.team@example.test']);
    expect(mail.detail.attachments).toEqual([`kestrel-yard-shed-r${revisionNumber}-filtered.csv`, `kestrel-yard-shed-r${revisionNumber}-filtered.pdf`]);
  });

  it('an export or a mail that fails writes nothing', async () => {
    const before = (await readLog(engineer)).total;
    const rev = `/api/projects/${projectId}/revisions/${revisionId}`;
    expect((await engineer.call('get', `${rev}/exports/csv?minUtilisation=lots`)).status).toBe(400);
    expect((await engineer.call('get', `${rev}/exports/xml`)).status).toBe(404);
    expect((await viewer.call('get', `${rev}/exports/pdf`)).status).toBe(403);
    // Nothing at or above 99: the mail is refused before anything is queued.
    expect((await engineer.call('post', `${rev}/send-critical`, { recipients: ['a@example.test'], minUtilisation: 99 })).status).toBe(400);
    expect((await readLog(engineer)).total).toBe(before);
  });

  it('pages newest first without gaps or repeats', async () => {
    const all = (await readLog(engineer, '?pageSize=50')).entries.map((e) => e.id);
    const first = await readLog(engineer, '?pageSize=2&page=1');
    const second = await readLog(engineer, '?pageSize=2&page=2');
    const third = await readLog(engineer, '?pageSize=2&page=3');
    expect([first.page, first.pageSize, first.total]).toEqual([1, 2, all.length]);
    expect([...first.entries, ...second.entries, ...third.entries].map((e) => e.id)).toEqual(all);
    expect(third.entries).toHaveLength(all.length - 4);
    expect((await readLog(engineer, '?pageSize=2&page=9')).entries).toEqual([]);
    const bad = await engineer.call('get', `${log}?pageSize=0`);
    expect(bad.status).toBe(400);
    expect(bad.body.fields).toHaveProperty('pageSize');
  });

  it('filters by kind', async () => {
    const exports = await readLog(engineer, '?kind=export');
    expect(exports.total).toBe(2);
    expect(exports.entries.map((e) => e.detail.format)).toEqual(['xlsx', 'csv']);
    const uploads = await readLog(engineer, '?kind=upload');
    expect(uploads.entries.map((e) => e.action)).toEqual(['model.uploaded']);
    expect((await readLog(engineer, '?kind=mail')).entries.map((e) => e.action)).toEqual(['mail.critical-members']);
    expect((await readLog(engineer, '?kind=override')).entries.map((e) => e.globalId)).toEqual([globalId]);
    expect((await readLog(engineer, '?kind=forces')).total).toBe(0);
    const bad = await engineer.call('get', `${log}?kind=everything`);
    expect(bad.status).toBe(400);
    expect(bad.body.fields).toHaveProperty('kind');
  });

  it('is readable by admins, refused to the project viewer (403), and not found for an engineer of another project (404)', async () => {
    expect((await readLog(admin)).total).toBe((await readLog(engineer)).total);
    const refused = await viewer.call('get', log);
    expect(refused.status).toBe(403);
    expect(refused.body.error).toBe('auth.forbidden');

    const other = await admin.call('post', '/api/projects', { name: 'Heron Quay footbridge' });
    const made = await admin.call('post', '/api/users', { email: 'other.engineer@example.test', name: 'Other engineer', role: 'engineer', password: 'other-engineer-pass-1' });
    expect((await admin.call('put', `/api/projects/${other.body.id}/members/${made.body.id}`)).status).toBe(204);
    const outsider = await signIn(app.url, 'other.engineer@example.test', 'other-engineer-pass-1');
    const hidden = await outsider.call('get', log);
    const missing = await outsider.call('get', '/api/projects/987654/audit');
    expect(hidden.status).toBe(404);
    expect(hidden.body).toEqual(missing.body);
    // Their own project's log reads fine, and holds nothing of the first project.
    const own = await outsider.call('get', `/api/projects/${other.body.id}/audit`);
    expect(own.status).toBe(200);
    expect(own.body.entries.map((e: Entry) => e.action)).toEqual(['project.member-added', 'project.created']);
    expect(JSON.stringify(own.body)).not.toMatch(/kestrel/i);
  });
});
