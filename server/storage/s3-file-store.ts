import { createReadStream, createWriteStream, promises as fs } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import type { Readable } from 'node:stream';
import os from 'node:os';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { S3Client, PutObjectCommand, GetObjectCommand, HeadObjectCommand, DeleteObjectCommand } from '@aws-sdk/client-s3';
import { assertSafeKey, type FileStore } from './file-store';

export interface S3StoreOptions {
  endpoint?: string;
  region: string;
  bucket: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  forcePathStyle: boolean;
}

/** S3-compatible object storage, so app processes on several machines share one store. */
export class S3FileStore implements FileStore {
  readonly kind = 's3' as const;
  private readonly client: S3Client;
  constructor(private readonly options: S3StoreOptions) {
    this.client = new S3Client({
      endpoint: options.endpoint,
      region: options.region,
      forcePathStyle: options.forcePathStyle,
      // Many S3-compatible stores do not understand the SDK's default streaming checksums.
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      credentials: options.accessKeyId ? { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey ?? '' } : undefined,
    });
  }

  async put(key: string, sourcePath: string): Promise<void> {
    assertSafeKey(key);
    const { size } = await fs.stat(sourcePath);
    await this.client.send(
      new PutObjectCommand({ Bucket: this.options.bucket, Key: key, Body: createReadStream(sourcePath), ContentLength: size }),
    );
    await fs.rm(sourcePath, { force: true });
  }

  async exists(key: string): Promise<boolean> {
    assertSafeKey(key);
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.options.bucket, Key: key }));
      return true;
    } catch (err) {
      if ((err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return false;
      throw err;
    }
  }

  async fetchToLocal(key: string) {
    assertSafeKey(key);
    const res = await this.client.send(new GetObjectCommand({ Bucket: this.options.bucket, Key: key }));
    const tmp = path.join(os.tmpdir(), `gaugeline-s3-${randomBytes(6).toString('hex')}-${path.basename(key)}`);
    await pipeline(res.Body as Readable, createWriteStream(tmp));
    return { path: tmp, release: () => fs.rm(tmp, { force: true }) };
  }

  async remove(key: string): Promise<void> {
    assertSafeKey(key);
    await this.client.send(new DeleteObjectCommand({ Bucket: this.options.bucket, Key: key }));
  }
}
