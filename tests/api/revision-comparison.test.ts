// Comparing two revisions of a model: members matched by GlobalId, changes listed, CSV export.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse } from 'csv-parse/sync';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { waitFor } from '../support/wait-for';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
let app: TestApp;
let engineer: Caller;
let pid: number;
let r1: number;
let r2: number;

async function uploadAndWait(bytes: Buffer): Promise<number> {
  const up = await engineer.agent.post(`/api/projects/${pid}/uploads`).set('X-CSRF-Token', engineer.csrf).attach('file', bytes, 'kestrel-yard-shed.ifc').field('modelName', 'Shed');
  expect(up.status).toBe(201);
  const done = await waitFor(() => engineer.call('get', `/api/projects/${pid}/revisions/${up.body.revision.id}`), (r) => ['done', 'failed'].includes(r.body.status), 90_000);
  expect(done.body.status).toBe('done');
  return up.body.revision.id;
}

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  engineer = await signIn(app.url, DEMO.engineer);
  pid = (await engineer.call('get', '/api/projects')).body.projects[0].id;
  r1 = await uploadAndWait(SAMPLE);
  // The next export of the same model: one member's profile text changed, everything else equal.
  const text = SAMPLE.toString('latin1');
  const profile = /'(FL\d+x\d+)'/.exec(text)![1];
  r2 = await uploadAndWait(Buffer.from(text.replace(`'${profile}'`, `'${profile}B'`), 'latin1'));
});
afterAll(async () => {
  await app?.stop();
});

describe('revision comparison', () => {
  it('matches every member by GlobalId and lists only what changed', async () => {
    const res = await engineer.call('get', `/api/projects/${pid}/revisions/${r2}/comparison?with=${r1}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.before.number).toBe(1);
    expect(res.body.after.number).toBe(2);
    expect(res.body.matchedByTag).toBe(0);
    expect(res.body.counts.added).toBe(0);
    expect(res.body.counts.removed).toBe(0);
    expect(res.body.counts.resized).toBeGreaterThanOrEqual(1);
    for (const c of res.body.changes) expect(c.kinds.length).toBeGreaterThan(0);
    const total = (await engineer.call('get', `/api/projects/${pid}/revisions/${r2}/members?scope=all&pageSize=1`)).body.total;
    expect(res.body.matchedByGlobalId).toBe(total);
  });

  it('compares a revision with itself as unchanged, and refuses other models', async () => {
    const same = await engineer.call('get', `/api/projects/${pid}/revisions/${r1}/comparison?with=${r1}`);
    expect(same.body.changes).toEqual([]);
    const bad = await engineer.call('get', `/api/projects/${pid}/revisions/${r1}/comparison?with=999999`);
    expect(bad.status).toBe(404);
  });

  it('exports the changes as CSV readable by an independent parser', async () => {
    const res = await engineer.agent.get(`/api/projects/${pid}/revisions/${r2}/comparison?with=${r1}&format=csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const rows = parse(res.text, { columns: true, bom: true }) as Record<string, string>[];
    const json = (await engineer.call('get', `/api/projects/${pid}/revisions/${r2}/comparison?with=${r1}`)).body;
    expect(rows.map((r) => r.GlobalId).sort()).toEqual(json.changes.map((c: { globalId: string }) => c.globalId).sort());
    expect(rows[0].Cautions).toMatch(/licensed/);
    expect(rows[0].Revisions).toBe('r1 → r2');
  });
});
