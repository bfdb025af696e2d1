// Import jobs under faults: a time limit ends a job alone; two app processes sharing one
// database never run a job twice; an app killed mid-import has its job picked up again, once.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import mariadb from 'mariadb';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { waitFor } from '../support/wait-for';
import { testDbServer } from '../support/test-db';
import { makeSyntheticModel } from '../../scripts/samples/make-samples';
import { sharedEnvOf, spawnApp, type AppProcess } from '../support/spawn-app';
import { replicateModel } from '../support/replicate-model';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
let big: Buffer;
const apps: TestApp[] = [];

async function start(env: Record<string, string>) {
  const app = await startTestApp({ IMPORT_POLL_MS: '100', ...env });
  apps.push(app);
  return app;
}

const others: AppProcess[] = [];

/** Environment for a child app process that shares a test app's database and data folder. */
const shareEnv = (app: TestApp, extra: Record<string, string>) => sharedEnvOf(app.server.config, extra);

async function projectOf(caller: Caller): Promise<number> {
  return (await caller.call('get', '/api/projects')).body.projects[0].id;
}

async function upload(caller: Caller, projectId: number, bytes: Buffer, name: string) {
  const res = await caller.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', caller.csrf).attach('file', bytes, name).field('modelName', name);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.revision.id as number;
}

async function revisionRows(dbName: string): Promise<{ id: number; status: string; attempts: number; claimed_by: string | null }[]> {
  const s = testDbServer();
  const conn = await mariadb.createConnection({ host: s.host, port: s.port, user: s.user, password: s.password, database: dbName });
  try {
    return await conn.query('SELECT id, status, attempts, claimed_by FROM revisions ORDER BY id');
  } finally {
    await conn.end();
  }
}

beforeAll(async () => {
  // Large enough that reading it takes several times the suite's 2 s limit: 3 × 3,000 members.
  big = replicateModel(await makeSyntheticModel(3000), 3);
}, 120_000);

// One in-process app at a time (Sequelize models are per process): stop each test's apps
// whether it passed or not, so a failed test cannot take the next test's jobs.
afterEach(async () => {
  for (const p of others.splice(0)) await p.stop().catch(() => undefined);
  for (const app of apps) await app.server.stop().catch(() => undefined);
});

afterAll(async () => {
  for (const p of others) await p.stop().catch(() => undefined);
  for (const app of apps.reverse()) await app.server.stop().catch(() => undefined); // stopping twice is harmless
  for (const app of apps) await app.dropDatabase().catch(() => undefined);
});

describe('import faults', () => {
  it('stops a job at its time limit and keeps the pool working for the next one', async () => {
    const app = await start({ IMPORT_TIME_LIMIT_SECONDS: '2' });
    const engineer = await signIn(app.url, DEMO.engineer);
    const pid = await projectOf(engineer);
    // Uploaded while the app's worker threads are still loading (seconds on a busy machine):
    // the limit runs from when a thread begins the job, so loading does not count against it.
    const warm = await upload(engineer, pid, SAMPLE, 'warm-up.ifc');
    const warmed = await waitFor(() => engineer.call('get', `/api/projects/${pid}/revisions/${warm}`), (r) => ['done', 'failed'].includes(r.body.status), 60_000);
    expect(warmed.body.status, JSON.stringify(warmed.body.failure)).toBe('done');
    const slow = await upload(engineer, pid, big, 'big-braces.ifc');
    const failed = await waitFor(() => engineer.call('get', `/api/projects/${pid}/revisions/${slow}`), (r) => ['done', 'failed'].includes(r.body.status), 60_000);
    expect(failed.body.status).toBe('failed');
    expect(failed.body.failure.error).toBe('import.time-limit');
    expect(failed.body.failure.message).toMatch(/limit/);
    const quick = await upload(engineer, pid, Buffer.concat([SAMPLE, Buffer.from('\n/* after the limit */\n')]), 'shed.ifc');
    const done = await waitFor(() => engineer.call('get', `/api/projects/${pid}/revisions/${quick}`), (r) => ['done', 'failed'].includes(r.body.status), 60_000);
    expect(done.body.status, JSON.stringify(done.body.failure)).toBe('done');
  }, 120_000);

  it('runs each job exactly once when two app processes share the database', async () => {
    const a = await start({});
    const b = await spawnApp(shareEnv(a, {}));
    others.push(b);
    const engineer = await signIn(a.url, DEMO.engineer);
    const pid = await projectOf(engineer);
    const ids: number[] = [];
    for (let i = 0; i < 5; i++) ids.push(await upload(engineer, pid, Buffer.concat([SAMPLE, Buffer.from(`\n/* copy ${i} */\n`)]), `copy-${i}.ifc`));
    const viaB = await signIn(b.url, DEMO.engineer);
    for (const id of ids) {
      const r = await waitFor(() => viaB.call('get', `/api/projects/${pid}/revisions/${id}`), (x) => ['done', 'failed'].includes(x.body.status), 120_000);
      expect(r.body.status, JSON.stringify(r.body.failure)).toBe('done');
    }
    const rows = (await revisionRows(a.dbName)).filter((r) => ids.includes(r.id));
    expect(rows.map((r) => r.attempts)).toEqual(ids.map(() => 1));
    console.log(`jobs per process: ${JSON.stringify(Object.fromEntries([a.server.imports.owner, b.owner].map((o) => [o, rows.filter((r) => r.claimed_by === o).length])))}`);

  }, 180_000);

  it('picks up a job again, once, after its app process is killed mid-import', async () => {
    const base = await start({ IMPORT_WORKERS: '0' }); // database, seed and data folder only; runs no jobs
    const a = await spawnApp(shareEnv(base, { IMPORT_STALE_SECONDS: '5' }));
    others.push(a);
    const engineer = await signIn(a.url, DEMO.engineer);
    const pid = await projectOf(engineer);
    const id = await upload(engineer, pid, big, 'interrupted.ifc');
    const working = await waitFor(() => engineer.call('get', `/api/projects/${pid}/revisions/${id}`), (r) => ['reading', 'extracting', 'checking', 'done', 'failed'].includes(r.body.status), 30_000);
    expect(['reading', 'extracting', 'checking']).toContain(working.body.status);
    await a.kill();
    const b = await spawnApp(shareEnv(base, { IMPORT_STALE_SECONDS: '5' }));
    others.push(b);
    const viaB = await signIn(b.url, DEMO.engineer);
    const done = await waitFor(() => viaB.call('get', `/api/projects/${pid}/revisions/${id}`), (r) => ['done', 'failed'].includes(r.body.status), 150_000, 500);
    expect(done.body.status, JSON.stringify(done.body.failure)).toBe('done');
    const row = (await revisionRows(base.dbName)).find((r) => r.id === id)!;
    expect(row.attempts).toBe(2);
    expect(row.claimed_by).toBe(b.owner);
  }, 240_000);
});
