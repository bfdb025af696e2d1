import path from 'node:path';
import type { AppConfig } from '../config/config';
import type { FileStore } from './file-store';
import { LocalFileStore } from './local-file-store';
import { S3FileStore } from './s3-file-store';

export function createFileStore(config: AppConfig): FileStore {
  if (config.storage.kind === 's3') return new S3FileStore(config.storage);
  return new LocalFileStore(path.resolve(config.dataDir, 'uploads', 'store'));
}
