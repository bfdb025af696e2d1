// Member table (paging, sorting, filters, search), member sheet, overview, and forces tables.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { waitFor } from '../support/wait-for';
import { bandOf } from '../../shared/api/results';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
const FORCES = readFileSync(path.join(root, 'samples/kestrel-yard-forces.csv'), 'utf8');

let app: TestApp;
let engineer: Caller;
let viewer: Caller;
let base: string;

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  engineer = await signIn(app.url, DEMO.engineer);
  viewer = await signIn(app.url, DEMO.viewer);
  const projectId = (await engineer.call('get', '/api/projects')).body.projects[0].id;
  const up = await engineer.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', engineer.csrf).attach('file', SAMPLE, 'kestrel-yard-shed.ifc');
  const done = await waitFor(() => engineer.call('get', `/api/projects/${projectId}/revisions/${up.body.revision.id}`), (r) => ['done', 'failed'].includes(r.body.status), 90_000);
  expect(done.body.status).toBe('done');
  base = `/api/projects/${projectId}/revisions/${up.body.revision.id}`;
});
afterAll(async () => {
  await app?.stop();
});

describe('member table', () => {
  it('pages, sorts by utilisation with unknowns last, and reports the total', async () => {
    const all = await viewer.call('get', `${base}/members?pageSize=500`);
    expect(all.status).toBe(200);
    const total = all.body.total;
    expect(total).toBeGreaterThan(5);
    const utils = all.body.members.map((m: { utilisation: number | null }) => m.utilisation);
    const known = utils.filter((u: number | null) => u !== null);
    expect(known).toEqual([...known].sort((a, b) => b - a));
    expect(utils.slice(known.length).every((u: number | null) => u === null)).toBe(true);
    const p1 = await viewer.call('get', `${base}/members?pageSize=3&page=1`);
    const p2 = await viewer.call('get', `${base}/members?pageSize=3&page=2`);
    expect(p1.body.members).toHaveLength(3);
    expect(p1.body.members.map((m: { globalId: string }) => m.globalId)).toEqual(all.body.members.slice(0, 3).map((m: { globalId: string }) => m.globalId));
    expect(p2.body.members[0].globalId).toBe(all.body.members[3].globalId);
    for (const m of all.body.members) expect(m.band).toBe(bandOf(m.utilisation));
  });

  it('filters by band, threshold, class and free text, and sorts by other columns', async () => {
    const withU = await viewer.call('get', `${base}/members?minUtilisation=0.5&pageSize=500`);
    expect(withU.body.members.every((m: { utilisation: number }) => m.utilisation >= 0.5)).toBe(true);
    const unknown = await viewer.call('get', `${base}/members?band=unknown&pageSize=500`);
    expect(unknown.body.members.every((m: { band: string }) => m.band === 'unknown')).toBe(true);
    const first = (await viewer.call('get', `${base}/members?pageSize=1`)).body.members[0];
    const search = await viewer.call('get', `${base}/members?q=${encodeURIComponent(first.globalId.slice(0, 10))}`);
    expect(search.body.members.map((m: { globalId: string }) => m.globalId)).toContain(first.globalId);
    const byClass = await viewer.call('get', `${base}/members?ifcClass=${first.ifcClass}&pageSize=500`);
    expect(byClass.body.members.every((m: { ifcClass: string }) => m.ifcClass === first.ifcClass)).toBe(true);
    const byProfile = await viewer.call('get', `${base}/members?sort=profile&dir=asc&pageSize=500`);
    const profiles = byProfile.body.members.map((m: { profile: string | null }) => m.profile).filter(Boolean);
    expect(profiles).toEqual([...profiles].sort((a: string, b: string) => a.localeCompare(b, 'en', { sensitivity: 'base' })));
    const bad = await viewer.call('get', `${base}/members?sort=drop_table&pageSize=99999`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fields)).toEqual(expect.arrayContaining(['sort', 'pageSize']));
  });

  it('serves a member sheet with the trace, assumptions and cautions', async () => {
    const top = (await viewer.call('get', `${base}/members?pageSize=1`)).body.members[0];
    const sheet = await viewer.call('get', `${base}/members/${encodeURIComponent(top.globalId)}`);
    expect(sheet.status).toBe(200);
    expect(sheet.body.member.globalId).toBe(top.globalId);
    expect(sheet.body.result.trace.length).toBeGreaterThan(3);
    expect(sheet.body.result.assumptions.map((a: { name: string }) => a.name)).toEqual(expect.arrayContaining(['fy', 'fu']));
    expect(sheet.body.cautions.join(' ')).toMatch(/licensed/);
    expect((await viewer.call('get', `${base}/members/AAAAAAAAAAAAAAAAAAAAAA`)).status).toBe(404);
  });

  it('gives an overview whose band counts add up to the table total', async () => {
    const overview = await viewer.call('get', `${base}/overview`);
    const total = (await viewer.call('get', `${base}/members?pageSize=1`)).body.total;
    expect(overview.body.total).toBe(total);
    const sum = Object.values(overview.body.bands as Record<string, number>).reduce((a, b) => a + b, 0);
    expect(sum).toBe(total);
    const binned = overview.body.histogram.reduce((a: number, b: { count: number }) => a + b.count, 0);
    expect(binned).toBe(total - overview.body.bands.unknown);
  });
});

describe('forces tables', () => {
  it('applies the sample forces, re-checks members and records the source', async () => {
    const before = (await engineer.call('get', `${base}/members?pageSize=500&scope=all`)).body.members;
    const res = await engineer.call('post', `${base}/forces`, { csv: FORCES });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.unit).toBe('N [kN]');
    expect(res.body.rows).toBe(FORCES.trim().split('\n').length - 1);
    const after = (await engineer.call('get', `${base}/members?pageSize=500&scope=all`)).body.members;
    const touched = after.filter((m: { forceSource: string | null }) => m.forceSource === 'forces-csv');
    expect(touched.length).toBe(res.body.members);
    // The design force is the largest tension over the file's load cases for that member.
    const lines = FORCES.trim().split('\n').slice(1).map((l) => l.split(','));
    for (const m of touched) {
      const tensions = lines.filter((l) => l[0] === m.globalId).map((l) => Number(l[2]) * 1000).filter((n) => n > 0);
      expect(m.designForceN).toBe(tensions.length ? Math.max(...tensions) : null);
      if (m.designCapacityN && m.designForceN) expect(m.utilisation).toBeCloseTo(m.designForceN / m.designCapacityN, 9);
    }
    expect(before.length).toBe(after.length);
  });

  it('rejects a file with any bad row, reports each, and changes nothing', async () => {
    const before = (await engineer.call('get', `${base}/members?pageSize=500&scope=all`)).body.members;
    const gid = before[0].globalId;
    const csv = `GlobalId,LoadCase,N [kN]\n${gid},NEW,999\nZZZZZZZZZZZZZZZZZZZZZZ,A,1\n${gid},NEW,5\n${gid},X,lots\n`;
    const res = await engineer.call('post', `${base}/forces`, { csv });
    expect(res.status).toBe(422);
    expect(res.body.error).toBe('forces.rejected');
    expect(res.body.details.problems.map((p: { line: number }) => p.line)).toEqual([3, 4, 5]);
    const after = (await engineer.call('get', `${base}/members?pageSize=500&scope=all`)).body.members;
    expect(after).toEqual(before);
    const wrongHeader = await engineer.call('post', `${base}/forces`, { csv: 'Member,Force\nx,1\n' });
    expect(wrongHeader.status).toBe(422);
    expect(wrongHeader.body.details.problems[0].message).toMatch(/GlobalId/);
  });

  it('refuses forces from a viewer', async () => {
    const res = await viewer.call('post', `${base}/forces`, { csv: FORCES });
    expect(res.status).toBe(403);
  });
});
