import { promises as fs } from 'node:fs';
import path from 'node:path';
import { assertSafeKey, type FileStore } from './file-store';

/** A folder on this machine (default: .data/uploads/store). */
export class LocalFileStore implements FileStore {
  readonly kind = 'local' as const;
  constructor(private readonly root: string) {}

  private resolve(key: string): string {
    assertSafeKey(key);
    return path.join(this.root, key);
  }

  async put(key: string, sourcePath: string): Promise<void> {
    const target = this.resolve(key);
    await fs.mkdir(path.dirname(target), { recursive: true });
    try {
      await fs.rename(sourcePath, target);
    } catch (err) {
      // Another filesystem: copy through a temporary name so readers never see half a file.
      if ((err as NodeJS.ErrnoException).code !== 'EXDEV') throw err;
      const tmp = `${target}.${process.pid}.partial`;
      await fs.copyFile(sourcePath, tmp);
      await fs.rename(tmp, target);
      await fs.rm(sourcePath, { force: true });
    }
  }

  async exists(key: string): Promise<boolean> {
    return fs.access(this.resolve(key)).then(() => true, () => false);
  }

  async fetchToLocal(key: string) {
    const p = this.resolve(key);
    await fs.access(p);
    return { path: p, release: async () => {} };
  }

  async remove(key: string): Promise<void> {
    await fs.rm(this.resolve(key), { force: true });
  }
}
