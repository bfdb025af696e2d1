// Project isolation: people outside a project cannot read, change or export anything in it
// by guessing ids. Every project-scoped route answers an outsider exactly as it answers for
// an id that does not exist (404 wherever the role could use the route at all), never 200
// and never a 403 that a missing id would not also get; nothing in the project changes.
// Admins see every project.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { dbQuery, importEnded, uploadFile } from '../support/imports';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
const SAMPLE_2X3 = readFileSync(path.join(root, 'samples/kestrel-yard-shed-ifc2x3.ifc'));
const PASSWORD = 'isolation-password-1';
const MISSING = 987654;

interface Side {
  projectId: number;
  modelId: number;
  revisionId: number;
  globalId: string;
  engineer: Caller;
  viewer: Caller;
}

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
interface Probe {
  name: string;
  method: Method;
  url: (s: Pick<Side, 'projectId' | 'modelId' | 'revisionId' | 'globalId'>) => string;
  body?: unknown;
  upload?: boolean;
}

const rev = (s: { projectId: number; revisionId: number }) => `/api/projects/${s.projectId}/revisions/${s.revisionId}`;

/** Every route that names a project, with the parts it names. */
const PROBES: Probe[] = [
  { name: 'project', method: 'get', url: (s) => `/api/projects/${s.projectId}` },
  { name: 'project change', method: 'patch', url: (s) => `/api/projects/${s.projectId}`, body: { description: 'taken over' } },
  { name: 'project people', method: 'get', url: (s) => `/api/projects/${s.projectId}/members` },
  { name: 'models', method: 'get', url: (s) => `/api/projects/${s.projectId}/models` },
  { name: 'revisions of a model', method: 'get', url: (s) => `/api/projects/${s.projectId}/models/${s.modelId}/revisions` },
  { name: 'revision', method: 'get', url: (s) => rev(s) },
  { name: 'upload', method: 'post', url: (s) => `/api/projects/${s.projectId}/uploads`, upload: true },
  { name: 'members', method: 'get', url: (s) => `${rev(s)}/members` },
  { name: 'overview', method: 'get', url: (s) => `${rev(s)}/overview` },
  { name: 'member sheet', method: 'get', url: (s) => `${rev(s)}/members/${s.globalId}` },
  { name: 'member audit', method: 'get', url: (s) => `${rev(s)}/members/${s.globalId}/audit` },
  { name: 'member override', method: 'patch', url: (s) => `${rev(s)}/members/${s.globalId}/overrides`, body: { designForceN: 1, reason: 'taken over' } },
  { name: 'forces', method: 'post', url: (s) => `${rev(s)}/forces`, body: { csv: 'GlobalId,LoadCase,N [kN]\n' } },
  { name: 'geometry', method: 'get', url: (s) => `${rev(s)}/geometry` },
  { name: 'member columns', method: 'get', url: (s) => `${rev(s)}/member-columns` },
  { name: 'CSV export', method: 'get', url: (s) => `${rev(s)}/exports/csv` },
  { name: 'workbook export', method: 'get', url: (s) => `${rev(s)}/exports/xlsx` },
  { name: 'IFC export', method: 'get', url: (s) => `${rev(s)}/exports/ifc` },
  { name: 'project log', method: 'get', url: (s) => `/api/projects/${s.projectId}/audit` },
];

let app: TestApp;
let admin: Caller;
let a: Side;
let b: Side;

async function send(caller: Caller, probe: Probe, ids: Parameters<Probe['url']>[0]) {
  const url = probe.url(ids);
  if (probe.upload) {
    return caller.agent.post(url).set('X-CSRF-Token', caller.csrf).attach('file', Buffer.concat([SAMPLE, Buffer.from('\n/* intruder */\n')]), 'intruder.ifc');
  }
  return caller.call(probe.method, url, probe.body);
}

async function importInto(caller: Caller, projectId: number, bytes: Buffer, modelName: string) {
  const up = await uploadFile(caller, projectId, bytes, 'model.ifc', modelName);
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  const done = await importEnded(caller, projectId, up.body.revision.id);
  expect(done.body.status, JSON.stringify(done.body.failure)).toBe('done');
  const models = await caller.call('get', `/api/projects/${projectId}/models`);
  const members = await caller.call('get', `/api/projects/${projectId}/revisions/${up.body.revision.id}/members?pageSize=1`);
  return { modelId: models.body.models[0].id as number, revisionId: up.body.revision.id as number, globalId: members.body.members[0].globalId as string };
}

/** Everything stored for a project: its row, models, revisions, members, results, forces and log. */
async function projectState(projectId: number): Promise<unknown> {
  const db = app.dbName;
  const models = await dbQuery(db, 'SELECT * FROM models WHERE project_id = ? ORDER BY id', [projectId]);
  const revIds = (await dbQuery<{ id: number }>(db, 'SELECT r.id FROM revisions r JOIN models m ON m.id = r.model_id WHERE m.project_id = ? ORDER BY r.id', [projectId])).map((r) => r.id);
  const inRevs = revIds.length ? revIds : [0];
  return {
    project: await dbQuery(db, 'SELECT * FROM projects WHERE id = ?', [projectId]),
    people: await dbQuery(db, 'SELECT * FROM project_members WHERE project_id = ? ORDER BY user_id', [projectId]),
    models,
    revisions: await dbQuery(db, 'SELECT * FROM revisions WHERE id IN (?) ORDER BY id', [inRevs]),
    members: await dbQuery(db, 'SELECT * FROM members WHERE revision_id IN (?) ORDER BY id', [inRevs]),
    results: await dbQuery(db, 'SELECT c.* FROM check_results c JOIN members m ON m.id = c.member_id WHERE m.revision_id IN (?) ORDER BY c.id', [inRevs]),
    forces: await dbQuery(db, 'SELECT f.* FROM member_forces f JOIN members m ON m.id = f.member_id WHERE m.revision_id IN (?) ORDER BY f.id', [inRevs]),
    capacities: await dbQuery(db, 'SELECT * FROM check_capacities WHERE revision_id IN (?) ORDER BY id', [inRevs]),
    // A refused export or override leaves no entry in the other project's log.
    log: await dbQuery(db, 'SELECT * FROM audit_entries WHERE project_id = ? ORDER BY id', [projectId]),
  };
}

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  admin = await signIn(app.url, DEMO.admin);
  // Project A: the demo project with the demo engineer and architect.
  const engineerA = await signIn(app.url, DEMO.engineer);
  const viewerA = await signIn(app.url, DEMO.viewer);
  const projectA = (await engineerA.call('get', '/api/projects')).body.projects[0].id;
  // Project B: another team's project that A's people are not members of.
  const projectB = (await admin.call('post', '/api/projects', { name: 'Heron Quay footbridge' })).body.id;
  const people: Caller[] = [];
  for (const role of ['engineer', 'viewer'] as const) {
    const email = `${role}-b@example.test`;
    const made = await admin.call('post', '/api/users', { email, name: `Team B ${role}`, role, password: PASSWORD });
    expect(made.status).toBe(201);
    expect((await admin.call('put', `/api/projects/${projectB}/members/${made.body.id}`)).status).toBe(204);
    people.push(await signIn(app.url, email, PASSWORD));
  }
  const [importedA, importedB] = await Promise.all([
    importInto(engineerA, projectA, SAMPLE, 'Shed'),
    importInto(people[0], projectB, SAMPLE_2X3, 'Footbridge steel'),
  ]);
  a = { projectId: projectA, ...importedA, engineer: engineerA, viewer: viewerA };
  b = { projectId: projectB, ...importedB, engineer: people[0], viewer: people[1] };
}, 150_000);

afterAll(async () => {
  await app?.stop();
});

describe('project isolation', () => {
  const cases: [string, () => Side, () => Side, 'engineer' | 'viewer'][] = [
    ["project A's engineer probing project B", () => a, () => b, 'engineer'],
    ["project A's viewer probing project B", () => a, () => b, 'viewer'],
    ["project B's engineer probing project A", () => b, () => a, 'engineer'],
    ["project B's viewer probing project A", () => b, () => a, 'viewer'],
  ];

  for (const [label, own, other, role] of cases) {
    it(`${label}: every route answers as for a missing id, and nothing changes`, async () => {
      const caller = own()[role];
      const target = other();
      const before = await projectState(target.projectId);
      const seen: string[] = [];
      for (const probe of PROBES) {
        const real = await send(caller, probe, target);
        const missing = await send(caller, probe, { projectId: MISSING, modelId: MISSING, revisionId: MISSING, globalId: target.globalId });
        seen.push(`${probe.name} ${real.status}`);
        expect(real.status, `${probe.name}: ${JSON.stringify(real.body)}`).toBe(missing.status);
        expect(real.body.error, probe.name).toBe(missing.body.error);
        // Where the role may use the route at all, the answer is "not found".
        const roleRefused = role === 'viewer' && probe.method !== 'get' ? true : role === 'viewer' && /export/.test(probe.name);
        expect(real.status, probe.name).toBe(roleRefused ? 403 : 404);
        // The answer is an error and nothing else: no name, count or id of the other project.
        expect(Object.keys(real.body).sort(), probe.name).toEqual(['error', 'message']);
        expect(JSON.stringify(real.body)).not.toMatch(/Heron|Footbridge|Kestrel|Shed/);
      }
      expect(seen.length).toBe(PROBES.length);
      const projects = await caller.call('get', '/api/projects');
      expect(projects.body.projects.map((p: { id: number }) => p.id)).not.toContain(target.projectId);
      expect(await projectState(target.projectId)).toEqual(before);
    });
  }

  it("a member of A cannot reach B's model or revision through A's project id", async () => {
    for (const caller of [a.engineer, a.viewer]) {
      const mixed = { projectId: a.projectId, modelId: b.modelId, revisionId: b.revisionId, globalId: b.globalId };
      for (const probe of PROBES.filter((p) => /revision|member|overview|geometry|export|forces/.test(p.name))) {
        const res = await send(caller, probe, mixed);
        const roleRefused = caller === a.viewer && (probe.method !== 'get' || /export/.test(probe.name));
        expect(res.status, `${probe.name}: ${JSON.stringify(res.body)}`).toBe(roleRefused ? 403 : 404);
      }
    }
  });

  it("a member of B cannot reach A's model or revision through B's project id", async () => {
    const mixed = { projectId: b.projectId, modelId: a.modelId, revisionId: a.revisionId, globalId: a.globalId };
    for (const probe of PROBES.filter((p) => /revision|member|overview|geometry|export|forces/.test(p.name))) {
      const res = await send(b.engineer, probe, mixed);
      expect(res.status, `${probe.name}: ${JSON.stringify(res.body)}`).toBe(404);
    }
  });

  // Reads only, and one export format: the point is that these answer 200, not the formats.
  const READS = PROBES.filter((p) => p.method === 'get' && !/workbook|IFC export/.test(p.name));

  it('members still reach their own project (the probes above are not refused for every id)', async () => {
    for (const side of [a, b]) {
      for (const probe of READS) {
        const res = await send(side.engineer, probe, side);
        expect(res.status, `${probe.name}: ${JSON.stringify(res.body)}`).toBe(200);
      }
    }
  });

  it('an admin reads and exports every project', async () => {
    for (const side of [a, b]) {
      for (const probe of READS) {
        const res = await send(admin, probe, side);
        expect(res.status, `${probe.name}: ${JSON.stringify(res.body)}`).toBe(200);
      }
    }
    const list = (await admin.call('get', '/api/projects')).body.projects.map((p: { id: number }) => p.id);
    expect(list).toEqual(expect.arrayContaining([a.projectId, b.projectId]));
  });
});
