// The import reads an upload into shared memory so that the reader thread reads the same bytes
// instead of a copy (server/imports/read-upload-bytes.ts, server/ifc/reader-thread.ts).
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readUploadBytes } from '../../server/imports/read-upload-bytes.ts';
import { shareable } from '../../server/ifc/reader-thread.ts';
import { makeZip } from '../support/make-zip.ts';

const SAMPLE = path.resolve(import.meta.dirname, '../../samples/kestrel-yard-shed.ifc');
const dir = mkdtempSync(path.join(tmpdir(), 'gaugeline-upload-bytes-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('readUploadBytes', () => {
  const original = readFileSync(SAMPLE);

  it('reads a plain .ifc into a SharedArrayBuffer when asked, byte for byte', async () => {
    const bytes = await readUploadBytes(SAMPLE, 'ifc', 1e9, { shared: true });
    expect(bytes.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(Buffer.from(bytes).equals(original)).toBe(true);
  });

  it('inflates an .ifczip into a SharedArrayBuffer when asked, byte for byte', async () => {
    const zipPath = path.join(dir, 'model.ifczip');
    writeFileSync(zipPath, makeZip('model.ifc', original));
    const bytes = await readUploadBytes(zipPath, 'ifczip', 1e9, { shared: true });
    expect(bytes.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(Buffer.from(bytes).equals(original)).toBe(true);
  });

  it('keeps plain memory by default', async () => {
    const bytes = await readUploadBytes(SAMPLE, 'ifc', 1e9);
    expect(bytes.buffer).not.toBeInstanceOf(SharedArrayBuffer);
    expect(Buffer.from(bytes).equals(original)).toBe(true);
  });

  it('reads an empty file as no bytes', async () => {
    const empty = path.join(dir, 'empty.ifc');
    writeFileSync(empty, '');
    expect((await readUploadBytes(empty, 'ifc', 1e9, { shared: true })).length).toBe(0);
  });
});

describe('shareable', () => {
  it('passes shared bytes through and copies others once', () => {
    const plain = new Uint8Array([1, 2, 3]);
    const copy = shareable(plain);
    expect(copy.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect([...copy]).toEqual([1, 2, 3]);
    expect(shareable(copy)).toBe(copy);
  });
});
