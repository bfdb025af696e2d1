// Hostile uploads: several files in one request, oversized fields, too many parts, a request
// cut off mid-file, and file names with path parts, NUL, bidi controls and markup. Each is
// refused, or accepted under a clean display name; in every case no file is left behind in
// the incoming folder and the store holds nothing but content-addressed keys.
// (Wrong type, empty, not IFC, too large, "../" names and viewers are in model-upload.test.ts.)
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app';
import { DEMO } from '../support/api-client';
import { DEMO_PASSWORD } from '../../server/db/seed/demo-seed';
import { dbQuery, filesUnder } from '../support/imports';
import { waitFor } from '../support/wait-for';
import { LocalFileStore } from '../../server/storage/local-file-store';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));

let app: TestApp;
let agent: ReturnType<typeof request.agent>;
let cookie: string;
let csrf: string;
let projectId: number;
let variant = 0;

const incomingDir = () => path.join(app.server.config.dataDir, 'uploads', 'incoming');
const storeDir = () => path.join(app.server.config.dataDir, 'uploads', 'store');
const uploadsUrl = () => `/api/projects/${projectId}/uploads`;
/** Sample bytes made unique, so each accepted upload is stored as a new file. */
const uniqueModel = () => Buffer.concat([SAMPLE, Buffer.from(`\n/* upload variant ${++variant} */\n`)]);
const post = () => agent.post(uploadsUrl()).set('X-CSRF-Token', csrf);
const revisionCount = async () => (await dbQuery<{ n: number }>(app.dbName, 'SELECT COUNT(*) AS n FROM revisions'))[0].n;

/** The promises every refused upload must keep: an error body, no file left, nothing stored or queued. */
async function expectRefusedCleanly(res: request.Response, before: { revisions: number; store: string[] }) {
  expect(res.status, JSON.stringify(res.body)).toBeGreaterThanOrEqual(400);
  expect(res.status).toBeLessThan(500);
  expect(typeof res.body.error).toBe('string');
  await waitFor(async () => filesUnder(incomingDir()), (files) => files.length === 0, 5_000, 100);
  expect(filesUnder(incomingDir())).toEqual([]);
  expect(filesUnder(storeDir())).toEqual(before.store);
  expect(await revisionCount()).toBe(before.revisions);
}

async function snapshot() {
  return { revisions: await revisionCount(), store: filesUnder(storeDir()) };
}

beforeAll(async () => {
  // Jobs are not run here (IMPORT_WORKERS 0): this suite is about what happens before a job.
  app = await startTestApp({ UPLOAD_LIMIT_MB: '1', IMPORT_WORKERS: '0' });
  agent = request.agent(app.url);
  const first = await agent.get('/api/session');
  const signedIn = await agent.post('/api/session').set('X-CSRF-Token', first.body.csrfToken).send({ email: DEMO.engineer, password: DEMO_PASSWORD });
  expect(signedIn.status).toBe(200);
  csrf = signedIn.body.csrfToken;
  cookie = ([] as string[]).concat(signedIn.headers['set-cookie'])[0].split(';')[0];
  projectId = (await agent.get('/api/projects')).body.projects[0].id;
});

afterAll(async () => {
  await app?.stop();
});

describe('multipart requests that are not one plain file', () => {
  it('refuses two files in the field "file"', async () => {
    const before = await snapshot();
    const res = await post().attach('file', uniqueModel(), 'one.ifc').attach('file', uniqueModel(), 'two.ifc');
    await expectRefusedCleanly(res, before);
  });

  it('refuses a second file under another field name', async () => {
    const before = await snapshot();
    const res = await post().attach('file', uniqueModel(), 'one.ifc').attach('other', uniqueModel(), 'other.ifc');
    await expectRefusedCleanly(res, before);
  });

  it('refuses a huge text field, before or after the file', async () => {
    const huge = 'M'.repeat(200_000);
    let before = await snapshot();
    await expectRefusedCleanly(await post().field('modelName', huge).attach('file', uniqueModel(), 'a.ifc'), before);
    before = await snapshot();
    await expectRefusedCleanly(await post().attach('file', uniqueModel(), 'a.ifc').field('modelName', huge), before);
  });

  it('refuses a request with more fields than allowed', async () => {
    const before = await snapshot();
    let req = post();
    for (let i = 0; i < 20; i++) req = req.field(`f${i}`, 'x');
    await expectRefusedCleanly(await req.attach('file', uniqueModel(), 'a.ifc'), before);
  });

  it('answers a malformed multipart body with 400, not a server error', async () => {
    const before = await snapshot();
    const res = await post()
      .set('Content-Type', 'multipart/form-data; boundary=xyz')
      .send('--xyz\r\nContent-Disposition: form-data; name="file"; filename="a.ifc"\r\nBroken header without colon\r\n\r\nISO-10303-21;\r\n--xyz--\r\n');
    expect(res.status).toBe(400);
    await expectRefusedCleanly(res, before);
  });

  it('refuses a body that is not multipart', async () => {
    const before = await snapshot();
    await expectRefusedCleanly(await post().send({ file: SAMPLE.toString('base64') }), before);
  });

  it('refuses a file over the size limit when it is the second part of the request', async () => {
    const before = await snapshot();
    const big = Buffer.concat([Buffer.from('ISO-10303-21;\n'), Buffer.alloc(1.5 * 1024 * 1024, 0x20)]);
    const res = await post().field('modelName', 'Too big').attach('file', big, 'big.ifc');
    expect(res.status).toBe(413);
    await expectRefusedCleanly(res, before);
  });

  it('leaves no partial file when the client goes away mid-upload', async () => {
    const before = await snapshot();
    const boundary = '----gaugeline-abort-test';
    const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="cut.ifc"\r\nContent-Type: application/octet-stream\r\n\r\n`);
    const url = new URL(uploadsUrl(), app.url);
    const req = http.request(url, {
      method: 'POST',
      headers: { Cookie: cookie, 'X-CSRF-Token': csrf, 'Content-Type': `multipart/form-data; boundary=${boundary}`, 'Content-Length': String(900_000) },
    });
    req.on('error', () => undefined);
    req.write(head);
    req.write(Buffer.concat([Buffer.from('ISO-10303-21;\n'), Buffer.alloc(300_000, 0x20)]));
    // Wait until the server has started writing the file, then cut the connection.
    const started = await waitFor(async () => filesUnder(incomingDir()), (f) => f.length > 0, 10_000, 20);
    expect(started.length).toBe(1);
    req.destroy();
    const left = await waitFor(async () => filesUnder(incomingDir()), (f) => f.length === 0, 10_000, 100);
    expect(left, 'a partial upload was left in the incoming folder').toEqual([]);
    expect(filesUnder(storeDir())).toEqual(before.store);
    expect(await revisionCount()).toBe(before.revisions);
    // The server is still answering.
    expect((await agent.get('/api/projects')).status).toBe(200);
  });
});

describe('file names', () => {
  // [name sent, what the stored display name must be, or null when the upload must be refused]
  const NAMES: [string, string | null][] = [
    ['..\\..\\windows\\system32\\evil.ifc', 'evil.ifc'],
    ['/etc/cron.d/evil.ifc', 'evil.ifc'],
    ['a\u0000b.ifc', null],
    ['model.ifc\u0000.txt', null],
    ['report\u202Etxt.ifc', 'reporttxt.ifc'],
    ['\u2066hidden\u2069.ifc', 'hidden.ifc'],
    ['<img src=x onerror=alert(1)>.ifc', null],
    ['a"b;c.ifc', null],
    [`${'x'.repeat(1000)}.ifc`, null],
    ['%2e%2e%2fevil.ifc', '%2e%2e%2fevil.ifc'],
    // Not an attack: a name in UTF-8 is kept as written.
    ['Brücke Süd – Stahl 東.ifc', 'Brücke Süd – Stahl 東.ifc'],
    ['..', null],
    ['model.ifc ', null],
  ];

  for (const [name, expected] of NAMES) {
    it(`${JSON.stringify(name).slice(0, 60)} is refused or stored under a clean name, leaving no file behind`, async () => {
      const before = await snapshot();
      const res = await post().attach('file', uniqueModel(), name);
      if (res.status >= 400) {
        await expectRefusedCleanly(res, before);
        return;
      }
      expect([200, 201], JSON.stringify(res.body)).toContain(res.status);
      const shown: string = res.body.revision.fileName;
      // No path parts, no control or bidi characters, no markup characters, bounded length.
      expect(shown).not.toMatch(/[\\/\u0000-\u001f\u007f<>"\u200e\u200f\u202a-\u202e\u2066-\u2069]/);
      expect(shown.length).toBeLessThanOrEqual(200);
      expect(shown.toLowerCase().endsWith('.ifc')).toBe(true);
      if (expected) expect(shown).toBe(expected);
      expect(filesUnder(incomingDir())).toEqual([]);
    });
  }

  it('keeps the store to content-addressed keys and writes nothing outside the data folder', () => {
    const stored = filesUnder(storeDir());
    expect(stored.length).toBeGreaterThan(0);
    for (const key of stored) expect(key).toMatch(/^ifc\/[0-9a-f]{64}\.(ifc|ifczip)$/);
    const everything = filesUnder(app.server.config.dataDir);
    expect(everything.filter((f) => /evil|hidden|report|passwd/.test(f))).toEqual([]);
  });
});

describe('storage keys', () => {
  it('the local store refuses keys that could escape its folder', async () => {
    const store = new LocalFileStore(storeDir());
    for (const key of ['../escape.ifc', 'ifc/../../escape.ifc', '/etc/passwd', 'IFC/Upper.ifc', '.hidden', `ifc/${'a'.repeat(300)}`]) {
      await expect(store.exists(key), key).rejects.toThrow(/unsafe storage key/);
      await expect(store.put(key, path.join(root, 'samples/kestrel-yard-shed.ifc')), key).rejects.toThrow(/unsafe storage key/);
    }
    expect(filesUnder(path.dirname(storeDir())).filter((f) => /escape|passwd/.test(f))).toEqual([]);
  });
});
