/** Upload-and-wait helpers and direct database reads shared by the security and reliability suites. */
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import mariadb from 'mariadb';
import type { Caller } from './api-client';
import { waitFor } from './wait-for';
import { testDbServer } from './test-db';

export async function uploadFile(caller: Caller, projectId: number, bytes: Buffer | Uint8Array, fileName: string, modelName?: string) {
  const req = caller.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', caller.csrf).attach('file', Buffer.from(bytes), fileName);
  return modelName ? req.field('modelName', modelName) : req;
}

/** Polls a revision until its job has ended (done or failed) or the time is up. */
export async function importEnded(caller: Caller, projectId: number, revisionId: number, timeoutMs = 90_000) {
  return waitFor(
    () => caller.call('get', `/api/projects/${projectId}/revisions/${revisionId}`),
    (r) => ['done', 'failed'].includes(r.body?.status),
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
