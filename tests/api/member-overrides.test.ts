// Engineers override a member's inputs with a reason; the member is re-checked at once and
// the change is audited. Viewers are refused.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { waitFor } from '../support/wait-for';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

let app: TestApp;
let engineer: Caller;
let viewer: Caller;
let base: string;
let target: { globalId: string; utilisation: number; designForceN: number; designCapacityN: number; governing: string };

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  engineer = await signIn(app.url, DEMO.engineer);
  viewer = await signIn(app.url, DEMO.viewer);
  const projectId = (await engineer.call('get', '/api/projects')).body.projects[0].id;
  const up = await engineer.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', engineer.csrf).attach('file', readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc')), 'shed.ifc');
  await waitFor(() => engineer.call('get', `/api/projects/${projectId}/revisions/${up.body.revision.id}`), (r) => r.body.status === 'done', 90_000);
  base = `/api/projects/${projectId}/revisions/${up.body.revision.id}`;
  const rows = (await engineer.call('get', `${base}/members?pageSize=500`)).body.members;
  // A member governed by yield or fracture, so a change of grade must move its capacity.
  target = rows.find((m: { utilisation: number | null; governing: string }) => m.utilisation !== null && /yield|fracture/i.test(m.governing));
  expect(target).toBeDefined();
});
afterAll(async () => {
  await app?.stop();
});

describe('member overrides', () => {
  it('requires a reason and a known grade', async () => {
    const noReason = await engineer.call('patch', `${base}/members/${target.globalId}/overrides`, { grade: 'S355' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.fields.reason).toBeDefined();
    const unknown = await engineer.call('patch', `${base}/members/${target.globalId}/overrides`, { grade: 'Unobtainium 9000', reason: 'test an unknown grade' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.fields.grade).toBeDefined();
    const lonelyFy = await engineer.call('patch', `${base}/members/${target.globalId}/overrides`, { fy: 300, reason: 'fy without fu' });
    expect(lonelyFy.status).toBe(400);
  });

  it('re-checks at once with explicit fy/fu and records who, what and why', async () => {
    const fy = 450;
    const fu = 550;
    const res = await engineer.call('patch', `${base}/members/${target.globalId}/overrides`, { fy, fu, reason: 'Mill certificate for heat 7731 shows higher strength' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.designCapacityN).toBeGreaterThan(target.designCapacityN);
    expect(res.body.utilisation).toBeLessThan(target.utilisation);
    expect(res.body.utilisation).toBeCloseTo(res.body.designForceN / res.body.designCapacityN, 12);
    const sheet = await viewer.call('get', `${base}/members/${target.globalId}`);
    expect(sheet.body.detail.overrides.fy).toMatchObject({ value: fy, by: DEMO.engineer, reason: expect.stringMatching(/Mill certificate/) });
    expect(sheet.body.result.assumptions.find((a: { name: string }) => a.name === 'fy').value).toBe(fy);
    const audit = await viewer.call('get', `${base}/members/${target.globalId}/audit`);
    expect(audit.body.entries[0]).toMatchObject({ by: DEMO.engineer, action: 'member.override', reason: expect.stringMatching(/heat 7731/) });
    expect(audit.body.entries[0].change.fy).toEqual({ before: null, after: fy });
  });

  it('overrides the design force above any model or file force, and removes overrides with null', async () => {
    const force = 2 * target.designForceN;
    const res = await engineer.call('patch', `${base}/members/${target.globalId}/overrides`, { designForceN: force, fy: null, fu: null, reason: 'Revised wind load from the façade engineer' });
    expect(res.status).toBe(200);
    expect(res.body.designForceN).toBe(force);
    expect(res.body.forceSource).toBe('override');
    expect(res.body.utilisation).toBeCloseTo(2 * target.utilisation, 9);
    const back = await engineer.call('patch', `${base}/members/${target.globalId}/overrides`, { designForceN: null, reason: 'Back to the model force' });
    expect(back.body.designForceN).toBe(target.designForceN);
    expect(back.body.utilisation).toBeCloseTo(target.utilisation, 12);
  });

  it('excludes and includes members by hand with the reason kept', async () => {
    const out = await engineer.call('patch', `${base}/members/${target.globalId}/overrides`, { inclusion: 'excluded', reason: 'Temporary erection brace, removed after completion' });
    expect(out.body.inclusion).toBe('excluded');
    const list = await viewer.call('get', `${base}/members?pageSize=500`);
    expect(list.body.members.map((m: { globalId: string }) => m.globalId)).not.toContain(target.globalId);
    const all = await viewer.call('get', `${base}/members?pageSize=500&scope=all`);
    expect(all.body.members.map((m: { globalId: string }) => m.globalId)).toContain(target.globalId);
    await engineer.call('patch', `${base}/members/${target.globalId}/overrides`, { inclusion: 'auto', reason: 'Permanent after all' });
  });

  it('refuses every override from a viewer and changes nothing', async () => {
    const before = (await viewer.call('get', `${base}/members/${target.globalId}`)).body;
    const res = await viewer.call('patch', `${base}/members/${target.globalId}/overrides`, { grade: 'S355', reason: 'I am only a viewer' });
    expect(res.status).toBe(403);
    const after = (await viewer.call('get', `${base}/members/${target.globalId}`)).body;
    expect(after.member).toEqual(before.member);
  });
});
