// The session read also reads the account and, for GET paths under a revision, the revision
// with its access check (server/http/request-read-ahead.ts). These tests count the statements
// the driver is sent, so they fail if a route quietly goes back to its own round trip; who may
// see what is held by security-isolation and security-route-access.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { MemberModel } from '../../server/db/models/member';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { importSample } from '../support/imports';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));

let app: TestApp;
let engineer: Caller;
let viewer: Caller;
let projectId: number;
let revisionId: number;
const sent: string[] = [];
let recording = false;

/** Records the SQL of every statement sent through the app's pool while `recording`. */
function recordStatements(): void {
  type Send = (sql: string | { sql: string }, ...rest: unknown[]) => unknown;
  type Connection = { query: Send; execute: Send; recorded?: boolean };
  const manager = MemberModel.sequelize!.connectionManager as unknown as { getConnection(o: unknown): Promise<Connection> };
  const getConnection = manager.getConnection.bind(manager);
  manager.getConnection = async (options) => {
    const connection = await getConnection(options);
    if (!connection.recorded) {
      for (const verb of ['query', 'execute'] as const) {
        const send = connection[verb].bind(connection);
        connection[verb] = (sql, ...rest) => {
          if (recording) sent.push(typeof sql === 'string' ? sql : sql.sql);
          return send(sql, ...rest);
        };
      }
      connection.recorded = true;
    }
    return connection;
  };
}

async function statementsOf(caller: Caller, url: string, status = 200): Promise<string[]> {
  sent.length = 0;
  recording = true;
  try {
    expect((await caller.call('get', url)).status, url).toBe(status);
  } finally {
    recording = false;
  }
  return [...sent];
}

const revisionAlone = (sql: string) => /FROM revisions r JOIN models m/.test(sql) && !/FROM sessions/.test(sql);
const withRevision = (sql: string) => /FROM sessions/.test(sql) && /AS revId/.test(sql);

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  engineer = await signIn(app.url, DEMO.engineer);
  viewer = await signIn(app.url, DEMO.viewer);
  ({ projectId, revisionId } = await importSample(engineer, SAMPLE));
  recordStatements();
  // The first table page loads the app's copy of the table; the tests below look at warm pages.
  expect((await engineer.call('get', `/api/projects/${projectId}/revisions/${revisionId}/members`)).status).toBe(200);
}, 120_000);
afterAll(async () => app?.stop());

describe('revision read with the session', () => {
  it('serves the member table, overview and 3D columns without a revision query of their own', async () => {
    const base = `/api/projects/${projectId}/revisions/${revisionId}`;
    for (const url of [`${base}/members?sort=utilisation&dir=desc`, `${base}/overview`, `${base}/member-columns`]) {
      for (const caller of [engineer, viewer]) {
        const statements = await statementsOf(caller, url);
        expect(statements.filter(withRevision), url).toHaveLength(1);
        expect(statements.filter(revisionAlone), url).toEqual([]);
      }
    }
  });

  it('answers a member sheet in one round trip: its statements go with the session read', async () => {
    const base = `/api/projects/${projectId}/revisions/${revisionId}`;
    const page = await engineer.call('get', `${base}/members?pageSize=1`);
    const globalId = page.body.members[0].globalId as string;
    const statements = await statementsOf(viewer, `${base}/members/${globalId}`);
    expect(statements.filter(withRevision)).toHaveLength(1);
    // Everything is sent before the first answer: no statement of the sheet's own access-checked read.
    expect(statements.filter((s) => /md\.project_id = \?/.test(s))).toEqual([]);
    expect(statements.filter((s) => /FROM members m/.test(s))).toHaveLength(1);
    const sheet = (await viewer.call('get', `${base}/members/${globalId}`)).body;
    expect(sheet.member.globalId).toBe(globalId);
    expect(sheet.cautions.length).toBeGreaterThan(0);
    // Read along but not visible through that project: the sheet's own read decides, and says 404.
    const elsewhere = await statementsOf(viewer, `/api/projects/${projectId + 1000}/revisions/${revisionId}/members/${globalId}`, 404);
    expect(elsewhere.filter((s) => /md\.project_id = \?/.test(s))).toHaveLength(1);
  });

  it('still reads the revision itself when the path names a revision the session cannot see', async () => {
    // Wrong project for this revision: the read-ahead finds nothing, the route's own lookup answers 404.
    const statements = await statementsOf(engineer, `/api/projects/${projectId + 1000}/revisions/${revisionId}/members`, 404);
    expect(statements.filter(withRevision)).toHaveLength(1);
    expect(statements.length).toBeGreaterThan(1);
  });

  it('reads only session and account for paths outside a revision and for writes', async () => {
    const statements = await statementsOf(engineer, `/api/projects/${projectId}`);
    expect(statements.filter(withRevision)).toEqual([]);
    expect(statements.filter((s) => /FROM sessions/.test(s))).toHaveLength(1);
  });
});
