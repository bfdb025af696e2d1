// Export routes: who may export, what each format answers with, filters, and isolation.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { waitFor } from '../support/wait-for';
import { ROOT } from '../support/export-fixture';
import { rawBody } from '../support/raw-body';

const SAMPLE = readFileSync(path.join(ROOT, 'samples/kestrel-yard-shed.ifc'));
const FORCES = readFileSync(path.join(ROOT, 'samples/kestrel-yard-forces.csv'), 'utf8');

let app: TestApp;
let engineer: Caller;
let viewer: Caller;
let admin: Caller;
let projectId: number;
let revisionId: number;
let base: string;

/** GET with the body kept as bytes, whatever the content type. */
const download = (caller: Caller, url: string) => rawBody(caller.agent.get(url));
const csvRows = (body: Buffer) => parse(body, { bom: true, columns: true }) as Record<string, string>[];

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  [engineer, viewer, admin] = await Promise.all([signIn(app.url, DEMO.engineer), signIn(app.url, DEMO.viewer), signIn(app.url, DEMO.admin)]);
  projectId = (await engineer.call('get', '/api/projects')).body.projects[0].id;
  const up = await engineer.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', engineer.csrf).attach('file', SAMPLE, 'kestrel-yard-shed.ifc');
  revisionId = up.body.revision.id;
  const done = await waitFor(() => engineer.call('get', `/api/projects/${projectId}/revisions/${revisionId}`), (r) => ['done', 'failed'].includes(r.body.status), 90_000);
  expect(done.body.status).toBe('done');
  expect((await engineer.call('post', `/api/projects/${projectId}/revisions/${revisionId}/forces`, { csv: FORCES })).status).toBe(200);
  base = `/api/projects/${projectId}/revisions/${revisionId}/exports`;
}, 120_000);
afterAll(async () => {
  await app?.stop();
});

describe('export access', () => {
  it('viewers are refused (403) for every format; signed-out callers get 401', async () => {
    for (const f of ['csv', 'xlsx', 'pdf', 'bcf', 'ifc']) expect((await viewer.call('get', `${base}/${f}`)).status).toBe(403);
    expect((await download({ ...engineer, agent: (await import('supertest')).default.agent(app.url) } as Caller, `${base}/csv`)).status).toBe(401);
  });

  it('a project the caller is not a member of, or a revision of another project, is not found (404)', async () => {
    const other = await admin.call('post', '/api/projects', { name: 'Export isolation check' });
    expect(other.status).toBe(201);
    expect((await engineer.call('get', `/api/projects/${other.body.id}/revisions/${revisionId}/exports/csv`)).status).toBe(404);
    expect((await admin.call('get', `/api/projects/${other.body.id}/revisions/${revisionId}/exports/csv`)).status).toBe(404);
    expect((await engineer.call('get', `${base}/docx`)).status).toBe(404);
  });
});

describe('export formats', () => {
  const expectations: [string, RegExp, string, (b: Buffer) => void][] = [
    ['csv', /^text\/csv/, 'tension.csv', (b) => expect(b.subarray(0, 3)).toEqual(Buffer.from([0xef, 0xbb, 0xbf]))],
    ['xlsx', /spreadsheetml/, 'tension.xlsx', (b) => expect(b.subarray(0, 2).toString()).toBe('PK')],
    ['pdf', /^application\/pdf/, 'tension.pdf', (b) => expect(b.subarray(0, 5).toString()).toBe('%PDF-')],
    ['bcf', /^application\/octet-stream/, 'critical.bcfzip', (b) => expect(b.subarray(0, 2).toString()).toBe('PK')],
    ['ifc', /^application\/x-step/, 'tension.ifc', (b) => expect(b.subarray(0, 13).toString()).toBe('ISO-10303-21;')],
  ];
  for (const [format, type, suffix, check] of expectations) {
    it(`engineer gets ${format} with its content type and a sanitised file name`, async () => {
      const res = await download(engineer, `${base}/${format}`);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toMatch(type);
      expect(res.headers['content-disposition']).toBe(`attachment; filename="kestrel-yard-shed-r1-${suffix}"`);
      check(res.body as Buffer);
    }, 60_000);
  }

  it('applies the member-table filters: band, minimum utilisation, search; default is every tension member with a result', async () => {
    const all = csvRows((await download(engineer, `${base}/csv`)).body);
    const table = (await engineer.call('get', `/api/projects/${projectId}/revisions/${revisionId}/members?pageSize=500`)).body.members;
    const withResult = table.filter((m: { designCapacityN: number | null }) => m.designCapacityN !== null);
    expect(all.map((r) => r.GlobalId).sort()).toEqual(withResult.map((m: { globalId: string }) => m.globalId).sort());

    const over = await download(engineer, `${base}/csv?band=over`);
    expect(over.headers['content-disposition']).toContain('-filtered.csv');
    const overRows = csvRows(over.body);
    expect(overRows.length).toBeGreaterThan(0);
    expect(overRows.every((r) => r.Band === 'over')).toBe(true);

    const minU = csvRows((await download(engineer, `${base}/csv?minUtilisation=0.5`)).body);
    expect(minU.length).toBeLessThan(all.length);
    expect(minU.every((r) => Number(r['Utilisation [-]']) >= 0.5)).toBe(true);

    const one = all[0];
    const search = csvRows((await download(engineer, `${base}/csv?q=${encodeURIComponent(one.GlobalId)}`)).body);
    expect(search.map((r) => r.GlobalId)).toEqual([one.GlobalId]);

    expect((await engineer.call('get', `${base}/csv?band=purple`)).status).toBe(400);
  });

  it('IFC export of a filtered set carries results on just those members', async () => {
    const res = await download(engineer, `${base}/ifc?band=over`);
    expect(res.status).toBe(200);
    const text = (res.body as Buffer).toString('latin1');
    const overCount = csvRows((await download(engineer, `${base}/csv?band=over`)).body).length;
    expect(text.match(/'Gaugeline_TensionCheck'/g)).toHaveLength(overCount);
    expect(res.headers['x-gaugeline-members']).toBe(String(overCount));
  });
});
