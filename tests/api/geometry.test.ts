// Display geometry of a revision: prepared during the import, served to any project member
// with a strong ETag and a year of private caching, 304 on If-None-Match, 404 elsewhere;
// gzipped (a copy made once) for clients that take gzip.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { gunzipSync } from 'node:zlib';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { rawBody } from '../support/raw-body';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, anonymous, DEMO, type Caller } from '../support/api-client';
import { waitFor } from '../support/wait-for';
import { parseDisplayGeometry } from '../../shared/geometry/display-geometry-format';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));

let app: TestApp;
let engineer: Caller;
let viewer: Caller;
let projectId: number;
let revisionId: number;
let base: string;

const binary = rawBody;

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  engineer = await signIn(app.url, DEMO.engineer);
  viewer = await signIn(app.url, DEMO.viewer);
  projectId = (await engineer.call('get', '/api/projects')).body.projects[0].id;
  const up = await engineer.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', engineer.csrf).attach('file', SAMPLE, 'kestrel-yard-shed.ifc');
  expect(up.status).toBe(201);
  revisionId = up.body.revision.id;
  const done = await waitFor(() => engineer.call('get', `/api/projects/${projectId}/revisions/${revisionId}`), (r) => r.body.status === 'failed' || (r.body.status === 'done' && r.body.summary?.geometry !== 'pending'), 90_000);
  expect(done.body.status).toBe('done');
  expect(done.body.summary.geometry).toBe('ready');
  base = `/api/projects/${projectId}/revisions/${revisionId}`;
});
afterAll(async () => {
  await app?.stop();
});

describe('GET …/revisions/:revisionId/geometry', () => {
  it('serves the display geometry with a strong ETag and long private caching', async () => {
    const res = await binary(viewer.agent.get(`${base}/geometry`).set('Accept-Encoding', 'identity'));
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/octet-stream/);
    expect(res.headers['cache-control']).toBe('private, max-age=31536000, immutable');
    const body = res.body as Buffer;
    const etag = res.headers.etag as string;
    expect(etag).toBe(`"${createHash('sha256').update(body).digest('base64url')}"`);
    expect(etag.startsWith('W/')).toBe(false);
    const g = parseDisplayGeometry(new Uint8Array(body));
    const members = (await viewer.call('get', `${base}/members?scope=all&pageSize=500`)).body.members as { globalId: string }[];
    const ids = new Set(g.header.entries.map((e) => e.globalId));
    expect(members.length).toBeGreaterThan(5);
    for (const m of members) expect(ids.has(m.globalId), m.globalId).toBe(true);
  });

  it('sends the copy gzipped at import time to clients that take gzip, with its own strong ETag', async () => {
    const stored = path.join(root, '.test-data', app.dbName, 'uploads/store/geometry', `${revisionId}-v1.bin`);
    const plain = readFileSync(stored);
    const gzipped = readFileSync(`${stored}.gz`);
    expect(gunzipSync(gzipped).equals(plain)).toBe(true);
    expect(gzipped.length).toBeLessThan(plain.length / 2);
    // supertest unzips on arrival: the body is the plain file; the headers say what was sent.
    const res = await binary(viewer.agent.get(`${base}/geometry`).set('Accept-Encoding', 'gzip, deflate, br'));
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers.vary).toMatch(/Accept-Encoding/);
    expect(Number(res.headers['content-length'])).toBe(gzipped.length);
    expect((res.body as Buffer).equals(plain)).toBe(true);
    const etag = res.headers.etag as string;
    expect(etag).toBe(`"${createHash('sha256').update(gzipped).digest('base64url')}"`);
    expect((await viewer.agent.get(`${base}/geometry`).set('Accept-Encoding', 'gzip').set('If-None-Match', etag)).status).toBe(304);
    // The plain file's ETag does not stand for the gzipped one.
    const plainEtag = `"${createHash('sha256').update(plain).digest('base64url')}"`;
    expect((await binary(viewer.agent.get(`${base}/geometry`).set('Accept-Encoding', 'gzip').set('If-None-Match', plainEtag))).status).toBe(200);
  });

  it('makes the gzipped copy when a revision has none, sending the plain file meanwhile', async () => {
    const stored = path.join(root, '.test-data', app.dbName, 'uploads/store/geometry', `${revisionId}-v1.bin`);
    const { renameSync, existsSync, rmSync } = await import('node:fs');
    renameSync(`${stored}.gz`, `${stored}.gz.before`);
    try {
      const first = await binary(viewer.agent.get(`${base}/geometry`).set('Accept-Encoding', 'gzip'));
      expect(first.status).toBe(200);
      expect(first.headers['content-encoding']).toBeUndefined();
      expect((first.body as Buffer).equals(readFileSync(stored))).toBe(true);
      await waitFor(async () => existsSync(`${stored}.gz`), (made) => made, 30_000, 100);
      const made = await binary(viewer.agent.get(`${base}/geometry`).set('Accept-Encoding', 'gzip'));
      expect(made.headers['content-encoding']).toBe('gzip');
      expect((made.body as Buffer).equals(readFileSync(stored))).toBe(true);
    } finally {
      rmSync(`${stored}.gz`, { force: true });
      renameSync(`${stored}.gz.before`, `${stored}.gz`);
    }
  });

  it('answers 304 when the ETag matches, and 200 again when it does not', async () => {
    const first = await binary(engineer.agent.get(`${base}/geometry`));
    const etag = first.headers.etag as string;
    const again = await engineer.agent.get(`${base}/geometry`).set('If-None-Match', etag);
    expect(again.status).toBe(304);
    expect(again.headers.etag).toBe(etag);
    const list = await engineer.agent.get(`${base}/geometry`).set('If-None-Match', `"other", ${etag}`);
    expect(list.status).toBe(304);
    const stale = await binary(engineer.agent.get(`${base}/geometry`).set('If-None-Match', '"something-else"'));
    expect(stale.status).toBe(200);
    expect((stale.body as Buffer).length).toBe((first.body as Buffer).length);
  });

  it('hides it from people outside the project and from other projects’ paths', async () => {
    const admin = await signIn(app.url, DEMO.admin);
    const other = await admin.call('post', '/api/projects', { name: 'Somewhere else' });
    expect(other.status).toBe(201);
    // The revision is not in the other project, even for an admin who sees both.
    const wrongProject = await admin.call('get', `/api/projects/${other.body.id}/revisions/${revisionId}/geometry`);
    expect(wrongProject.status).toBe(404);
    // The viewer is not a member of the other project.
    expect((await viewer.call('get', `/api/projects/${other.body.id}/revisions/${revisionId}/geometry`)).status).toBe(404);
    expect((await viewer.call('get', `/api/projects/${projectId}/revisions/999999/geometry`)).status).toBe(404);
    expect((await (await anonymous(app.url)).call('get', `${base}/geometry`)).status).toBe(401);
  });

  it('says geometry.unavailable when a revision has none', async () => {
    const stored = path.join(root, '.test-data', app.dbName, 'uploads/store/geometry', `${revisionId}-v1.bin`);
    const { renameSync } = await import('node:fs');
    renameSync(stored, `${stored}.away`);
    try {
      const res = await viewer.call('get', `/api/projects/${projectId}/revisions/${revisionId}/geometry`);
      expect(res.status).toBe(404);
      expect(res.body.error).toBe('geometry.unavailable');
    } finally {
      renameSync(`${stored}.away`, stored);
    }
  });
});
