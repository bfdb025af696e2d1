import { createHash, randomBytes } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import multer from 'multer';
import request from 'supertest';
import { afterEach, describe, expect, it } from 'vitest';
import { hashingDiskStorage } from '../../server/features/uploads/hashing-disk-storage';

const folders: string[] = [];
afterEach(() => folders.splice(0).forEach((f) => rmSync(f, { recursive: true, force: true })));

/** A bare app that receives one file with the storage and answers what multer made of it. */
function appWith(limitBytes: number) {
  const folder = mkdtempSync(path.join(os.tmpdir(), 'gl-hash-store-'));
  folders.push(folder);
  const app = express();
  const upload = multer({ storage: hashingDiskStorage(folder), limits: { fileSize: limitBytes } }).single('file');
  app.post('/up', (req, res) => upload(req, res, (err: unknown) => {
    if (err) return res.status(413).json({ error: (err as { code?: string }).code ?? String(err) });
    res.json(req.file);
  }));
  return { app, folder };
}

describe('hashingDiskStorage', () => {
  it('writes the bytes as sent and gives their SHA-256 and size', async () => {
    const { app, folder } = appWith(64 * 1024 * 1024);
    // Several megabytes, so the hash spans many chunks of the multipart stream.
    const bytes = randomBytes(5 * 1024 * 1024 + 17);
    const res = await request(app).post('/up').attach('file', bytes, 'frame.ifc');
    expect(res.status).toBe(200);
    expect(res.body.sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
    expect(res.body.size).toBe(bytes.length);
    expect(path.dirname(res.body.path)).toBe(folder);
    expect(readFileSync(res.body.path).equals(bytes)).toBe(true);
  });

  it('leaves nothing behind when a file is over the limit', async () => {
    const { app, folder } = appWith(1024 * 1024);
    const res = await request(app).post('/up').attach('file', randomBytes(3 * 1024 * 1024), 'frame.ifc');
    expect(res.status).toBe(413);
    expect(res.body.error).toBe('LIMIT_FILE_SIZE');
    expect(readdirSync(folder)).toEqual([]);
  });
});
