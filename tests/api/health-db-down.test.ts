// The API answers 503 with a message while its database is down, and recovers without a restart.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { startMariaInstance, ensureDatabase, type MariaInstance } from '../../scripts/db/mariadb-instance';
import { startServer, type RunningServer } from '../../server/index';
import { signIn, DEMO } from '../support/api-client';
import { freePort } from '../../scripts/lib/free-port';


let dir: string;
let port: number;
let db: MariaInstance;
let server: RunningServer;

beforeAll(async () => {
  // A database server of this suite's own, so stopping it disturbs no other suite.
  dir = mkdtempSync(path.join(os.tmpdir(), 'gaugeline-dbdown-'));
  port = await freePort();
  db = await startMariaInstance({ dir, port, quiet: true });
  await ensureDatabase(db, { name: 'gl_down', user: 'gl_down', password: 'down-pass' });
  server = await startServer(
    { NODE_ENV: 'test', PORT: '0', DB_PORT: String(port), DB_NAME: 'gl_down', DB_USER: 'gl_down', DB_PASSWORD: 'down-pass', SESSION_SECRET: 'a-test-secret-of-enough-length', CLIENT_DIST: '/nonexistent' },
    true,
  );
}, 60_000);

afterAll(async () => {
  await server?.stop().catch(() => undefined);
  await db?.stop();
  rmSync(dir, { recursive: true, force: true });
});

describe('database outage', () => {
  it('reports ok, then down with 503, then ok again after the database returns', async () => {
    const up = await request(server.url).get('/api/health');
    expect(up.status).toBe(200);
    expect(up.body).toEqual({ status: 'ok', db: 'ok' });

    const engineer = await signIn(server.url, DEMO.engineer);
    expect((await engineer.call('get', '/api/projects')).status).toBe(200);

    await db.stop();
    const down = await request(server.url).get('/api/health');
    expect(down.status).toBe(503);
    expect(down.body.db).toBe('down');
    const api = await engineer.call('get', '/api/projects');
    expect(api.status).toBe(503);
    expect(api.body.error).toBe('service.db-down');
    expect(api.body.message).toMatch(/database/i);

    db = await startMariaInstance({ dir, port, quiet: true });
    let status = 0;
    for (let i = 0; i < 50 && status !== 200; i++) {
      status = (await request(server.url).get('/api/health')).status;
      if (status !== 200) await new Promise((r) => setTimeout(r, 200));
    }
    expect(status).toBe(200);
    expect((await engineer.call('get', '/api/projects')).status).toBe(200);
  }, 90_000);
});
