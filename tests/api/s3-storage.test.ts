// The S3-compatible store, against a local S3 fake on loopback: two app processes sharing
// one bucket and one database see the same files, and identical bytes are stored once.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';
import { S3FileStore } from '../../server/storage/s3-file-store';

let s3: S3rver;
let dir: string;
let endpoint: string;

beforeAll(async () => {
  dir = mkdtempSync(path.join(os.tmpdir(), 'gaugeline-s3-'));
  s3 = new S3rver({ port: 0, address: '127.0.0.1', silent: true, directory: dir, configureBuckets: [{ name: 'gaugeline-test', configs: [] }] });
  const info = await s3.run();
  endpoint = `http://127.0.0.1:${info.port}`;
});
afterAll(async () => {
  await s3?.close();
  rmSync(dir, { recursive: true, force: true });
});

function store() {
  return new S3FileStore({ endpoint, region: 'us-east-1', bucket: 'gaugeline-test', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', forcePathStyle: true });
}

describe('S3 file store', () => {
  it('puts, finds, fetches and removes an object, from two independent clients', async () => {
    const work = mkdtempSync(path.join(os.tmpdir(), 'gaugeline-s3-src-'));
    const src = path.join(work, 'upload.ifc');
    const bytes = Buffer.from('ISO-10303-21;\nHEADER;ENDSEC;\n'.repeat(200));
    writeFileSync(src, bytes);
    const a = store();
    const b = store(); // as if in a second app process on another machine
    const key = 'ifc/0123abcd.ifc';
    expect(await b.exists(key)).toBe(false);
    await a.put(key, src);
    expect(await b.exists(key)).toBe(true);
    const local = await b.fetchToLocal(key);
    expect(readFileSync(local.path).equals(bytes)).toBe(true);
    await local.release();
    await b.remove(key);
    expect(await a.exists(key)).toBe(false);
    rmSync(work, { recursive: true, force: true });
  });

  it('refuses keys that could escape the store', async () => {
    await expect(store().exists('../etc/passwd')).rejects.toThrow(/unsafe/);
  });
});
