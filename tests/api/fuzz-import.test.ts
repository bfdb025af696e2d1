// The full job path under hostile input and faults: mutated models uploaded through the API
// each end "failed" with a message or "done" within the time limit, the server keeps
// answering, and the stored rows of other revisions and projects stay byte-for-byte the
// same. Five uploads at once under one model name get distinct revision numbers and all
// finish. A worker thread terminated from outside mid-import fails that job alone; the
// pool recovers and the next job is done.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { ImportPools } from '../../server/imports/import-pools.ts';
import request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { importEnded, revisionRowsJson, uploadFile } from '../support/imports';
import { waitFor } from '../support/wait-for';
import { mutate } from '../support/ifc-mutations';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
const SAMPLE_2X3 = readFileSync(path.join(root, 'samples/kestrel-yard-shed-ifc2x3.ifc'));
const TIME_LIMIT_S = 40;
const ENDED = ['done', 'failed'];

let app: TestApp;
let engineer: Caller;
let admin: Caller;
let projectA: number;
let projectB: number;
/** Revisions nobody touches after the start: one in each project. */
const untouched: number[] = [];

const revisionRows = (revisionId: number) => revisionRowsJson(app.dbName, revisionId);

async function importOk(caller: Caller, projectId: number, bytes: Buffer, modelName: string): Promise<number> {
  const up = await uploadFile(caller, projectId, bytes, 'model.ifc', modelName);
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  const done = await importEnded(caller, projectId, up.body.revision.id);
  expect(done.body.status, JSON.stringify(done.body.failure)).toBe('done');
  return up.body.revision.id;
}

let snapshots: string[] = [];

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100', IMPORT_WORKERS: '1', IMPORT_TIME_LIMIT_SECONDS: String(TIME_LIMIT_S) });
  engineer = await signIn(app.url, DEMO.engineer);
  admin = await signIn(app.url, DEMO.admin);
  projectA = (await engineer.call('get', '/api/projects')).body.projects[0].id;
  projectB = (await admin.call('post', '/api/projects', { name: 'Untouched project' })).body.id;
  untouched.push(await importOk(engineer, projectA, SAMPLE, 'Untouched shed'));
  untouched.push(await importOk(admin, projectB, SAMPLE_2X3, 'Untouched shed 2x3'));
  snapshots = await Promise.all(untouched.map(revisionRows));
}, 120_000);

afterAll(async () => {
  await app?.stop();
});

describe('fuzzed models through the upload API', () => {
  const KINDS = ['cut short', 'flipped bytes', 'malformed entity line', 'ENDSEC deleted', 'huge string', 'duplicated ids', 'references rewired', 'random bytes after a header'];

  it(`each ends "done" or "failed" with a message within ${TIME_LIMIT_S} s; the server keeps answering`, async () => {
    // All uploaded at once: they queue behind each other on the one import thread.
    const uploaded: { kind: string; id: number; at: number }[] = [];
    for (const kind of KINDS) {
      const bytes = mutate(SAMPLE, 'kestrel-yard-shed.ifc', kind);
      const up = await uploadFile(engineer, projectA, bytes, `${kind}.ifc`, 'Fuzzed shed');
      expect([200, 201], `${kind}: ${JSON.stringify(up.body)}`).toContain(up.status);
      if (up.status === 201) uploaded.push({ kind, id: up.body.revision.id, at: Date.now() });
    }
    expect(uploaded.length).toBeGreaterThanOrEqual(KINDS.length - 1);
    const outcomes: Record<string, string> = {};
    for (const u of uploaded) {
      const end = await importEnded(engineer, projectA, u.id, (TIME_LIMIT_S + 30) * 1000 * 2);
      expect(ENDED, `${u.kind}: ${JSON.stringify(end.body)}`).toContain(end.body.status);
      if (end.body.status === 'failed') {
        expect(end.body.failure.error, u.kind).toMatch(/^(ifc|import|upload)\./);
        expect(end.body.failure.error, `${u.kind}: ${end.body.failure.message}`).not.toBe('import.worker-lost');
        expect(end.body.failure.message.length, u.kind).toBeGreaterThan(10);
        outcomes[u.kind] = end.body.failure.error;
      } else {
        outcomes[u.kind] = `done (${end.body.summary.tensionMembers} tension members)`;
      }
      // The server answers while and after each job.
      expect((await request(app.url).get('/api/health')).status).toBe(200);
    }
    console.log(`fuzzed jobs: ${JSON.stringify(outcomes)}`);
  }, 600_000);

  it("leaves other revisions' and projects' rows byte-for-byte the same", async () => {
    expect(await Promise.all(untouched.map(revisionRows))).toEqual(snapshots);
  });
});

describe('concurrent uploads', () => {
  it('five uploads at once under one model name get distinct revision numbers and all finish', async () => {
    const variants = Array.from({ length: 5 }, (_, i) => Buffer.concat([SAMPLE, Buffer.from(`\n/* concurrent ${i} */\n`)]));
    const responses = await Promise.all(variants.map((bytes, i) => uploadFile(engineer, projectA, bytes, `concurrent-${i}.ifc`, 'Concurrent shed')));
    for (const r of responses) expect(r.status, JSON.stringify(r.body)).toBe(201);
    const numbers = responses.map((r) => r.body.revision.number as number).sort((x, y) => x - y);
    expect(numbers).toEqual([1, 2, 3, 4, 5]);
    for (const r of responses) {
      const end = await importEnded(engineer, projectA, r.body.revision.id);
      expect(end.body.status, JSON.stringify(end.body.failure)).toBe('done');
    }
    const models = (await engineer.call('get', `/api/projects/${projectA}/models`)).body.models.filter((m: { name: string }) => m.name === 'Concurrent shed');
    expect(models).toHaveLength(1);

    // Five more at once, now that the model exists: 6 to 10, each once.
    const more = await Promise.all(
      variants.map((bytes, i) => uploadFile(engineer, projectA, Buffer.concat([bytes, Buffer.from(`/* again ${i} */`)]), `again-${i}.ifc`, 'Concurrent shed')),
    );
    for (const r of more) expect(r.status, JSON.stringify(r.body)).toBe(201);
    expect(more.map((r) => r.body.revision.number as number).sort((x, y) => x - y)).toEqual([6, 7, 8, 9, 10]);
    const revisions = await engineer.call('get', `/api/projects/${projectA}/models/${models[0].id}/revisions`);
    expect(revisions.body.revisions.map((r: { number: number }) => r.number).sort((x: number, y: number) => x - y)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    for (const r of more) {
      const end = await importEnded(engineer, projectA, r.body.revision.id);
      expect(end.body.status, JSON.stringify(end.body.failure)).toBe('done');
    }
  }, 300_000);
});

describe('a worker killed mid-import', () => {
  it('fails that job with a message; the pool recovers and the job queued behind it is done', async () => {
    // A model that takes a few seconds to read: the shed with many extra (unused) points.
    const text = SAMPLE.toString('latin1');
    const at = text.lastIndexOf('ENDSEC;');
    const points = Array.from({ length: 400_000 }, (_, i) => `#${900000 + i}=IFCCARTESIANPOINT((${i}.,0.,0.));`).join('\n');
    const slow = Buffer.from(`${text.slice(0, at)}${points}\n${text.slice(at)}`, 'latin1');
    const pool = (app.server.imports as unknown as { pools: ImportPools }).pools;
    expect(Array.isArray(pool.threads), 'ImportRunner keeps its worker pools in `pools`').toBe(true);

    const victim = (await uploadFile(engineer, projectA, slow, 'slow.ifc', 'Killed shed')).body.revision.id;
    const behind = (await uploadFile(engineer, projectA, Buffer.concat([SAMPLE, Buffer.from('\n/* behind */\n')]), 'behind.ifc', 'Queued shed')).body.revision.id;
    const running = await waitFor(() => engineer.call('get', `/api/projects/${projectA}/revisions/${victim}`), (r) => r.body.status !== 'queued', 60_000, 50);
    expect(['reading', 'extracting', 'checking'], JSON.stringify(running.body)).toContain(running.body.status);
    expect(pool.threads.length).toBeGreaterThan(0);
    await Promise.all(pool.threads.map((t) => t.terminate()));

    const killed = await importEnded(engineer, projectA, victim, 60_000);
    expect(killed.body.status, JSON.stringify(killed.body)).toBe('failed');
    expect(killed.body.failure.error).toMatch(/^import\./);
    expect(killed.body.failure.message.length).toBeGreaterThan(10);
    const next = await importEnded(engineer, projectA, behind, 90_000);
    expect(next.body.status, JSON.stringify(next.body.failure)).toBe('done');
    // And the untouched revisions are still untouched.
    expect(await Promise.all(untouched.map(revisionRows))).toEqual(snapshots);
    expect((await request(app.url).get('/api/health')).status).toBe(200);
  }, 240_000);
});
