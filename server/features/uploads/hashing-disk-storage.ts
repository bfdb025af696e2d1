import { createHash, randomBytes } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Request } from 'express';
import type { StorageEngine } from 'multer';

/** What the storage adds to multer's file: where it was written, its size and SHA-256 (hex). */
export interface HashedFileInfo {
  destination: string;
  filename: string;
  path: string;
  size: number;
  sha256: string;
}

/**
 * A multer storage engine that writes each file under a random name in `folder` and works out
 * its SHA-256 from the same bytes on their way to disk: an upload of 150 MB is then not read
 * back a second time before it can be queued (≈ 0.3 s of the request thread).
 */
export function hashingDiskStorage(folder: string): StorageEngine {
  return {
    _handleFile(_req: Request, file: Express.Multer.File, cb: (error?: unknown, info?: Partial<HashedFileInfo>) => void): void {
      const filename = `${Date.now()}-${randomBytes(8).toString('hex')}.upload`;
      const target = path.join(folder, filename);
      const hash = createHash('sha256');
      let size = 0;
      const tap = new Transform({
        transform(chunk: Buffer, _encoding, done) {
          hash.update(chunk);
          size += chunk.length;
          done(null, chunk);
        },
      });
      // Multer records the path before the outcome, so a failed or refused file is still removed.
      file.path = target;
      pipeline(file.stream, tap, createWriteStream(target)).then(
        () => cb(null, { destination: folder, filename, path: target, size, sha256: hash.digest('hex') }),
        // Nothing half-written stays behind when the stream fails (client gone, disk full).
        (err: unknown) => void rm(target, { force: true }).finally(() => cb(err)),
      );
    },
    _removeFile(_req: Request, file: Express.Multer.File, cb: (error: Error | null) => void): void {
      rm(file.path, { force: true }).then(() => cb(null), cb);
    },
  };
}
