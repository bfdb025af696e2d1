// Upload → background import → stored results, and every way an upload can be refused.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { waitFor } from '../support/wait-for';
import { makeZip } from '../support/make-zip';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = path.join(root, 'samples/kestrel-yard-shed.ifc');

let app: TestApp;
let engineer: Caller;
let viewer: Caller;
let projectId: number;

function incomingFiles(): string[] {
  const dir = path.join(app.server.config.dataDir, 'uploads', 'incoming');
  return existsSync(dir) ? readdirSync(dir) : [];
}

async function upload(caller: Caller, name: string, bytes: Buffer, modelName?: string) {
  const req = caller.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', caller.csrf).attach('file', bytes, name);
  return modelName ? req.field('modelName', modelName) : req;
}

async function finished(revisionId: number) {
  return waitFor(
    () => engineer.call('get', `/api/projects/${projectId}/revisions/${revisionId}`),
    (res) => ['done', 'failed'].includes(res.body.status),
    90_000,
  );
}

beforeAll(async () => {
  app = await startTestApp({ UPLOAD_LIMIT_MB: '8', ARCHIVE_INFLATE_LIMIT_MB: '4', IMPORT_POLL_MS: '100' });
  engineer = await signIn(app.url, DEMO.engineer);
  viewer = await signIn(app.url, DEMO.viewer);
  projectId = (await engineer.call('get', '/api/projects')).body.projects[0].id;
});
afterAll(async () => {
  await app?.stop();
});

describe('upload and import', () => {
  it('imports the demo model in the background and keeps its members', async () => {
    const bytes = readFileSync(SAMPLE);
    const res = await upload(engineer, 'kestrel-yard-shed.ifc', bytes, 'Shed steel');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.duplicateOf).toBeNull();
    expect(res.body.revision).toMatchObject({ number: 1, fileName: 'kestrel-yard-shed.ifc', fileSize: bytes.length });
    const done = await finished(res.body.revision.id);
    expect(done.body.status, JSON.stringify(done.body.failure)).toBe('done');
    expect(done.body.progress).toBe(1);
    expect(done.body.summary.schema).toBe('IFC4');
    expect(done.body.summary.tensionMembers).toBeGreaterThan(5);
    expect(done.body.summary.checked).toBeGreaterThan(5);
    const models = await viewer.call('get', `/api/projects/${projectId}/models`);
    expect(models.body.models.map((m: { name: string }) => m.name)).toContain('Shed steel');
    expect(incomingFiles()).toEqual([]);
  });

  it('recognises identical bytes and makes a new revision for changed ones', async () => {
    const bytes = readFileSync(SAMPLE);
    const again = await upload(engineer, 'copy.ifc', bytes, 'Shed steel');
    expect(again.status).toBe(200);
    expect(again.body.duplicateOf).toBe(again.body.revision.id);
    const changed = Buffer.concat([bytes, Buffer.from('\n/* re-exported */\n')]);
    const next = await upload(engineer, 'kestrel-yard-shed.ifc', changed, 'Shed steel');
    expect(next.status).toBe(201);
    expect(next.body.revision.number).toBe(2);
  });

  it('imports a .ifczip and refuses an archive that inflates beyond the limit', async () => {
    const zipped = makeZip('shed.ifc', readFileSync(SAMPLE));
    const ok = await upload(engineer, 'shed.ifczip', zipped, 'Zipped shed');
    expect(ok.status).toBe(201);
    expect((await finished(ok.body.revision.id)).body.status).toBe('done');

    const bomb = makeZip('bomb.ifc', Buffer.concat([Buffer.from('ISO-10303-21;\n'), Buffer.alloc(6 * 1024 * 1024, 0x20)]));
    expect(bomb.length).toBeLessThan(100_000);
    const res = await upload(engineer, 'bomb.ifczip', bomb, 'Bomb');
    expect(res.status).toBe(201);
    const failed = await finished(res.body.revision.id);
    expect(failed.body.status).toBe('failed');
    expect(failed.body.failure.error).toBe('upload.archive-too-large');
  });

  it('ends a truncated or unknown-schema file as a failed job with a plain message', async () => {
    const cut = await upload(engineer, 'cut.ifc', Buffer.from('ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION((\'\'),\'2;1\');\n'), 'Cut');
    expect(cut.status).toBe(201);
    const a = await finished(cut.body.revision.id);
    expect(a.body.status).toBe('failed');
    expect(a.body.failure.error).toMatch(/^ifc\./);
    expect(a.body.failure.message.length).toBeGreaterThan(10);

    const foreign = await upload(engineer, 'future.ifc', Buffer.from("ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION(('x'),'2;1');\nFILE_NAME('a','2026',(''),(''),'','','');\nFILE_SCHEMA(('IFC9'));\nENDSEC;\nDATA;\nENDSEC;\nEND-ISO-10303-21;\n"), 'Future');
    const b = await finished(foreign.body.revision.id);
    expect(b.body.status).toBe('failed');
    expect(b.body.failure.error).toMatch(/^ifc\./);
  });

  it('refuses bad uploads before queueing anything, and leaves no file behind', async () => {
    const before = (await engineer.call('get', `/api/projects/${projectId}/models`)).body.models.length;
    const wrongType = await upload(engineer, 'notes.txt', Buffer.from('hello'));
    expect(wrongType.status).toBe(415);
    expect(wrongType.body.error).toBe('upload.wrong-type');
    const notIfc = await upload(engineer, 'fake.ifc', Buffer.from('<html>not a model</html>'));
    expect(notIfc.status).toBe(422);
    expect(notIfc.body.error).toBe('upload.not-ifc');
    const empty = await upload(engineer, 'empty.ifc', Buffer.alloc(0));
    expect(empty.status).toBe(422);
    expect(empty.body.error).toBe('upload.empty');
    const notZip = await upload(engineer, 'fake.ifczip', Buffer.from('ISO-10303-21;'));
    expect(notZip.body.error).toBe('upload.not-zip');
    const tooLarge = await upload(engineer, 'huge.ifc', Buffer.concat([Buffer.from('ISO-10303-21;\n'), Buffer.alloc(9 * 1024 * 1024, 0x20)]));
    expect(tooLarge.status).toBe(413);
    expect(tooLarge.body.error).toBe('upload.too-large');
    const pathName = await upload(engineer, '../../etc/evil.ifc', readFileSync(SAMPLE).subarray(0, 2000), 'Path test');
    expect([201, 200]).toContain(pathName.status);
    expect(pathName.body.revision.fileName).toBe('evil.ifc');
    const noFile = await engineer.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', engineer.csrf).field('modelName', 'x');
    expect(noFile.status).toBe(400);
    expect(incomingFiles()).toEqual([]);
    const after = (await engineer.call('get', `/api/projects/${projectId}/models`)).body.models.length;
    expect(after).toBe(before + 1); // only the path test made a model
  });

  it('refuses uploads from a viewer and from other projects', async () => {
    const res = await upload(viewer, 'shed.ifc', readFileSync(SAMPLE));
    expect(res.status).toBe(403);
    const admin = await signIn(app.url, DEMO.admin);
    const other = await admin.call('post', '/api/projects', { name: 'Not the engineer’s project' });
    const foreign = await engineer.agent.post(`/api/projects/${other.body.id}/uploads`).set('X-CSRF-Token', engineer.csrf).attach('file', readFileSync(SAMPLE), 'x.ifc');
    expect(foreign.status).toBe(404);
    expect(incomingFiles()).toEqual([]);
  });

  it('keeps answering API requests while a model is being imported', async () => {
    const bytes = Buffer.concat([readFileSync(SAMPLE), Buffer.from('\n/* another */\n')]);
    const res = await upload(engineer, 'busy.ifc', bytes, 'Busy');
    const started = Date.now();
    const answers = [];
    for (let i = 0; i < 5; i++) answers.push((await engineer.call('get', '/api/projects')).status);
    expect(answers.every((s) => s === 200)).toBe(true);
    expect(Date.now() - started).toBeLessThan(5000);
    await finished(res.body.revision.id);
  });
});

