// Every member of a revision in one compact answer for the 3D view: the same rows as the member
// table, gzipped when asked for, revalidated by a strong ETag that moves whenever results change
// (forces applied, an override), and hidden outside the project.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { rawBody } from '../support/raw-body';
import type { MemberRow } from '@shared/api';
import { decodeMemberColumns, memberColumnsSchema } from '@shared/api/member-columns';
import { startTestApp, type TestApp } from '../support/test-app';
import { anonymous, signIn, DEMO, type Caller } from '../support/api-client';
import { importSample } from '../support/imports';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
const FORCES = readFileSync(path.join(root, 'samples/kestrel-yard-forces.csv'), 'utf8');

let app: TestApp;
let engineer: Caller;
let viewer: Caller;
let projectId: number;
let revisionId: number;
let base: string;

const raw = rawBody;

async function columns(caller: Caller): Promise<{ rows: MemberRow[]; etag: string }> {
  const res = await caller.agent.get(`${base}/member-columns`);
  expect(res.status).toBe(200);
  return { rows: decodeMemberColumns(memberColumnsSchema.parse(res.body)), etag: res.headers.etag as string };
}

async function tableRows(caller: Caller): Promise<MemberRow[]> {
  const res = await caller.call('get', `${base}/members?scope=all&pageSize=500&sort=globalId&dir=asc`);
  expect(res.status).toBe(200);
  expect(res.body.total).toBe(res.body.members.length);
  return res.body.members;
}

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  engineer = await signIn(app.url, DEMO.engineer);
  viewer = await signIn(app.url, DEMO.viewer);
  ({ projectId, revisionId } = await importSample(engineer, SAMPLE));
  base = `/api/projects/${projectId}/revisions/${revisionId}`;
});
afterAll(async () => {
  await app?.stop();
});

describe('GET …/revisions/:revisionId/member-columns', () => {
  it('holds every member of the table (all candidates), row for row', async () => {
    const { rows } = await columns(viewer);
    const table = await tableRows(viewer);
    expect(rows.length).toBeGreaterThan(5);
    expect(rows.some((r) => !r.isTension)).toBe(true);
    const byId = new Map(rows.map((r) => [r.globalId, r]));
    expect(byId.size).toBe(table.length);
    for (const t of table) expect(byId.get(t.globalId), t.globalId).toEqual(t);
  });

  it('is gzipped when the client takes it and plain otherwise, with the same content and a strong ETag', async () => {
    const zipped = await raw(viewer.agent.get(`${base}/member-columns`).set('Accept-Encoding', 'gzip, deflate'));
    expect(zipped.status).toBe(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.headers['content-type']).toMatch(/^application\/json/);
    expect(zipped.headers.vary).toMatch(/Accept-Encoding/);
    expect(zipped.headers['cache-control']).toBe('private, no-cache');
    const plain = await raw(viewer.agent.get(`${base}/member-columns`).set('Accept-Encoding', 'identity'));
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    const plainBody = plain.body as Buffer;
    expect(Number(plain.headers['content-length'])).toBe(plainBody.length);
    // Unzipped on arrival, the gzip body is the plain one; on the wire it was much smaller.
    expect((zipped.body as Buffer).equals(plainBody)).toBe(true);
    expect(Number(zipped.headers['content-length'])).toBeLessThan(plainBody.length * 0.75);
    // The columns are smaller than the same rows as table JSON.
    expect(plainBody.length).toBeLessThan(JSON.stringify(await tableRows(viewer)).length * 0.7);
    const etag = plain.headers.etag as string;
    expect(etag).toMatch(/^"[A-Za-z0-9_-]{43}"$/);
    expect(zipped.headers.etag).toBe(etag);
    // 'gzip;q=0' refuses gzip.
    const refused = await raw(viewer.agent.get(`${base}/member-columns`).set('Accept-Encoding', 'gzip;q=0, identity'));
    expect(refused.headers['content-encoding']).toBeUndefined();
  });

  it('answers 304 while results are unchanged, and moves its ETag when forces or an override change them', async () => {
    const before = await columns(viewer);
    const again = await viewer.agent.get(`${base}/member-columns`).set('If-None-Match', before.etag);
    expect(again.status).toBe(304);
    expect(again.headers.etag).toBe(before.etag);

    const forces = await engineer.call('post', `${base}/forces`, { csv: FORCES });
    expect(forces.status, JSON.stringify(forces.body)).toBe(200);
    const afterForces = await columns(viewer);
    expect(afterForces.etag).not.toBe(before.etag);
    expect((await viewer.agent.get(`${base}/member-columns`).set('If-None-Match', before.etag)).status).toBe(200);
    expect(afterForces.rows).toEqual(expect.arrayContaining(await tableRows(viewer)));

    const target = afterForces.rows.find((r) => r.isTension && r.utilisation != null)!;
    const override = await engineer.call('patch', `${base}/members/${target.globalId}/overrides`, { designForceN: target.designForceN! * 2, reason: 'member columns test' });
    expect(override.status, JSON.stringify(override.body)).toBe(200);
    const afterOverride = await columns(viewer);
    expect(afterOverride.etag).not.toBe(afterForces.etag);
    const changed = afterOverride.rows.find((r) => r.globalId === target.globalId)!;
    expect(changed.designForceN).toBe(target.designForceN! * 2);
    expect(changed).toEqual(override.body);
    expect(changed.utilisation).not.toBe(target.utilisation);
  });

  it('is hidden from other projects, people outside the project and the signed out', async () => {
    const admin = await signIn(app.url, DEMO.admin);
    const other = await admin.call('post', '/api/projects', { name: 'Elsewhere for columns' });
    expect(other.status).toBe(201);
    // The revision is not in the other project, even for an admin who sees both.
    const wrongProject = await admin.call('get', `/api/projects/${other.body.id}/revisions/${revisionId}/member-columns`);
    expect(wrongProject.status).toBe(404);
    expect(Object.keys(wrongProject.body).sort()).toEqual(['error', 'message']);
    // The viewer is not a member of the other project.
    expect((await viewer.call('get', `/api/projects/${other.body.id}/revisions/${revisionId}/member-columns`)).status).toBe(404);
    expect((await viewer.call('get', `/api/projects/${projectId}/revisions/999999/member-columns`)).status).toBe(404);
    expect((await (await anonymous(app.url)).call('get', `${base}/member-columns`)).status).toBe(401);
  });
});
