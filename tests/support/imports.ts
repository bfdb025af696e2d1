/** Upload-and-wait helpers and direct database reads shared by the security and reliability suites. */
import { existsSync, readFileSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import mariadb from 'mariadb';
import { DEMO, signIn, type Caller } from './api-client';
import { startTestApp, type TestApp } from './test-app';
import { waitFor } from './wait-for';
import { testDbServer } from './test-db';

/** The demo sample (IFC4) as the suites upload it. */
export const SAMPLE_IFC = readFileSync(path.resolve(import.meta.dirname, '../../samples/kestrel-yard-shed.ifc'));

export async function uploadFile(caller: Caller, projectId: number, bytes: Buffer | Uint8Array, fileName: string, modelName?: string) {
  const req = caller.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', caller.csrf).attach('file', Buffer.from(bytes), fileName);
  return modelName ? req.field('modelName', modelName) : req;
}

/** Polls a revision until its job has ended (done or failed) and its 3D geometry is no longer being built. */
export async function importEnded(caller: Caller, projectId: number, revisionId: number, timeoutMs = 90_000) {
  return waitFor(
    () => caller.call('get', `/api/projects/${projectId}/revisions/${revisionId}`),
    (r) => r.body?.status === 'failed' || (r.body?.status === 'done' && r.body?.summary?.geometry !== 'pending'),
    timeoutMs,
  );
}

/** Runs one query against a test app's database with a connection of its own. */
export async function dbQuery<T = Record<string, unknown>>(dbName: string, sql: string, params: unknown[] = []): Promise<T[]> {
  const s = testDbServer();
  const conn = await mariadb.createConnection({ host: s.host, port: s.port, user: s.user, password: s.password, database: dbName, dateStrings: true });
  try {
    return (await conn.query({ sql, bigIntAsNumber: true }, params)) as T[];
  } finally {
    await conn.end();
  }
}

/** Every file below a folder, as paths relative to it (empty when the folder does not exist). */
export function filesUnder(dir: string): string[] {
  if (!existsSync(dir)) return [];
  const out: string[] = [];
  const visit = (d: string) => {
    for (const name of readdirSync(d)) {
      const p = path.join(d, name);
      if (statSync(p).isDirectory()) visit(p);
      else out.push(path.relative(dir, p));
    }
  };
  visit(dir);
  return out.sort();
}

/** Every stored row of one revision (the revision, its members, results, capacities and forces) as JSON, for byte-for-byte comparisons. */
export async function revisionRowsJson(dbName: string, revisionId: number): Promise<string> {
  return JSON.stringify({
    revision: await dbQuery(dbName, 'SELECT * FROM revisions WHERE id = ?', [revisionId]),
    members: await dbQuery(dbName, 'SELECT * FROM members WHERE revision_id = ? ORDER BY id', [revisionId]),
    results: await dbQuery(dbName, 'SELECT c.* FROM check_results c JOIN members m ON m.id = c.member_id WHERE m.revision_id = ? ORDER BY c.id', [revisionId]),
    forces: await dbQuery(dbName, 'SELECT f.* FROM member_forces f JOIN members m ON m.id = f.member_id WHERE m.revision_id = ? ORDER BY f.id', [revisionId]),
    capacities: await dbQuery(dbName, 'SELECT * FROM check_capacities WHERE revision_id = ? ORDER BY id', [revisionId]),
  });
}

/**
 * Uploads the demo sample to the caller's first project and waits until it is checked
 * (and its 3D geometry built). Fails the calling test when either step does not succeed.
 */
export async function importSample(caller: Caller, sample: Buffer = SAMPLE_IFC): Promise<{ projectId: number; revisionId: number }> {
  const projectId = (await caller.call('get', '/api/projects')).body.projects[0].id as number;
  const up = await uploadFile(caller, projectId, sample, 'kestrel-yard-shed.ifc');
  if (up.status !== 201) throw new Error(`sample upload answered ${up.status}: ${JSON.stringify(up.body)}`);
  const revisionId = up.body.revision.id as number;
  const done = await importEnded(caller, projectId, revisionId);
  if (done.body.status !== 'done') throw new Error(`sample import ended ${done.body.status}: ${JSON.stringify(done.body.failure)}`);
  return { projectId, revisionId };
}

/**
 * A test app whose demo engineer has imported the sample: how a suite about one checked
 * revision starts. `base` is the revision's API path.
 */
export async function appWithSample(env: Record<string, string> = { IMPORT_POLL_MS: '100' }): Promise<{ app: TestApp; engineer: Caller; projectId: number; revisionId: number; base: string }> {
  const app = await startTestApp(env);
  const engineer = await signIn(app.url, DEMO.engineer);
  const { projectId, revisionId } = await importSample(engineer);
  return { app, engineer, projectId, revisionId, base: `/api/projects/${projectId}/revisions/${revisionId}` };
}
