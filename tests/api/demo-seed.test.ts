// The demo opens on checked results: the seed queues the sample model with its forces table.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO } from '../support/api-client';
import { waitFor } from '../support/wait-for';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
let app: TestApp;

beforeAll(async () => {
  app = await startTestApp({ DEMO_MODELS: 'on', IMPORT_POLL_MS: '100' });
});
afterAll(async () => {
  await app?.stop();
});

describe('demo seed', () => {
  it('imports the sample model and applies the sample forces, so the architect sees results', async () => {
    const architect = await signIn(app.url, DEMO.viewer);
    const pid = (await architect.call('get', '/api/projects')).body.projects[0].id;
    const models = (await architect.call('get', `/api/projects/${pid}/models`)).body.models;
    expect(models).toHaveLength(1);
    const rid = models[0].latestRevision.id;
    const done = await waitFor(() => architect.call('get', `/api/projects/${pid}/revisions/${rid}`), (r) => ['done', 'failed'].includes(r.body.status), 90_000);
    expect(done.body.status, JSON.stringify(done.body.failure)).toBe('done');
    const rows = (await architect.call('get', `/api/projects/${pid}/revisions/${rid}/members?pageSize=500`)).body.members;
    const csvIds = new Set(readFileSync(path.join(root, 'samples/kestrel-yard-forces.csv'), 'utf8').trim().split('\n').slice(1).map((l) => l.split(',')[0]));
    const fromTable = rows.filter((m: { forceSource: string }) => m.forceSource === 'forces-csv');
    expect(fromTable.length).toBeGreaterThan(0);
    for (const m of fromTable) expect(csvIds.has(m.globalId)).toBe(true);
    expect(new Set(rows.map((m: { band: string }) => m.band)).size).toBeGreaterThan(1);
  });

  it('does not seed again into a database that has data', async () => {
    const { startServer } = await import('../../server/index');
    await app.server.stop();
    const again = await startServer({ ...process.env, ...envOf(app), DEMO_MODELS: 'on' }, true);
    try {
      const engineer = await signIn(again.url, DEMO.engineer);
      const pid = (await engineer.call('get', '/api/projects')).body.projects[0].id;
      const models = (await engineer.call('get', `/api/projects/${pid}/models`)).body.models;
      expect(models).toHaveLength(1);
      expect(models[0].revisionCount).toBe(1);
    } finally {
      await again.stop();
    }
  });
});

function envOf(a: TestApp): Record<string, string> {
  const c = a.server.config;
  return { NODE_ENV: 'test', PORT: '0', DB_HOST: c.db.host, DB_PORT: String(c.db.port), DB_NAME: c.db.name, DB_USER: c.db.user, DB_PASSWORD: c.db.password, SESSION_SECRET: c.session.secret, DATA_DIR: c.dataDir, CLIENT_DIST: '/nonexistent' };
}
