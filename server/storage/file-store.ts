/**
 * Where uploaded model files live. Keys are content addresses (ifc/<sha256>.<ext>), so
 * identical uploads are stored once and several app processes can share one store.
 */
export interface FileStore {
  readonly kind: 'local' | 's3';
  /** Stores a local file under `key` (the source file may be moved away). */
  put(key: string, sourcePath: string): Promise<void>;
  exists(key: string): Promise<boolean>;
  /** A local path to read the object from; `release` removes any temporary copy. */
  fetchToLocal(key: string): Promise<{ path: string; release(): Promise<void> }>;
  remove(key: string): Promise<void>;
}

/** Keys are produced by us, but check anyway: no path tricks can reach outside the store. */
export function assertSafeKey(key: string): void {
  if (!/^[a-z0-9][a-z0-9/_.-]{0,200}$/.test(key) || key.includes('..')) throw new Error(`unsafe storage key: ${key}`);
}
