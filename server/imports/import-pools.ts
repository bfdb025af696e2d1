/**
 * The import worker threads, in two pools that differ only in the room V8 gives short-lived
 * objects (decision 0017). Large files are read and checked faster with a 192 MB young
 * generation (decision 0008); a smaller file's import fills that space just the same, and with
 * the reader thread's half of it that alone is more than 8 × a file under 64 MB, so those go to
 * threads with V8's usual 48 MB and are read without a reader thread. This module must not load web-ifc or the reader: it runs on
 * the request thread.
 */
import Piscina from 'piscina';

export type ImportPoolName = 'small-files' | 'large-files';

/**
 * Text size from which a file goes to the large-file pool: the reader thread's line too
 * (read-model.ts READER_THREAD_FROM_BYTES; a test holds them equal), as only large-file threads
 * keep a reader thread ready.
 */
export const LARGE_FILE_FROM_BYTES = 64 * 1024 * 1024;

/**
 * An .ifczip holds several times its size in text; IFC text usually packs to a fifth or less
 * (common practice). A wrong guess costs speed or memory, never a result.
 */
export const IFCZIP_TEXT_PER_BYTE = 5;

/**
 * Young generation of each pool's threads, MB (three semi-spaces). Large: extraction and checks make
 * many short-lived objects next to a large live model, and with V8's 48 MB the worker spent about a
 * quarter of the check in scavenges (read + extract of the 5,000-member benchmark model 4.0 → 2.8 s,
 * checks 1.0 → 0.85 s with 192).
 */
export const YOUNG_GENERATION_MB: Record<ImportPoolName, number> = { 'small-files': 48, 'large-files': 192 };

/** The pool that runs a stored file's tasks (size in bytes as stored). */
export function importPoolFor(fileSize: number, kind: 'ifc' | 'ifczip'): ImportPoolName {
  const textBytes = kind === 'ifczip' ? fileSize * IFCZIP_TEXT_PER_BYTE : fileSize;
  return textBytes >= LARGE_FILE_FROM_BYTES ? 'large-files' : 'small-files';
}

export interface ImportPoolOptions {
  /** Threads per pool at most (jobs at once are capped by the runner). */
  maxThreads: number;
  /** Old-generation limit of every thread, MB. */
  memoryLimitMb: number;
}

export class ImportPools {
  private readonly pools: Record<ImportPoolName, Piscina>;

  constructor(options: ImportPoolOptions) {
    const pool = (name: ImportPoolName) =>
      new Piscina({
        filename: new URL('./import-worker.mjs', import.meta.url).href,
        // One thread of each stays loaded (tsx, web-ifc, the engine): after a job is stopped at its
        // limit its replacement starts at once, so the next job does not pay a cold start.
        minThreads: options.maxThreads > 0 ? 1 : 0,
        maxThreads: Math.max(1, options.maxThreads),
        idleTimeout: 60_000,
        concurrentTasksPerWorker: 1,
        workerData: { pool: name },
        resourceLimits: { maxOldGenerationSizeMb: options.memoryLimitMb, maxYoungGenerationSizeMb: YOUNG_GENERATION_MB[name] },
      });
    this.pools = { 'small-files': pool('small-files'), 'large-files': pool('large-files') };
    // Piscina starts the threads now but loads their tasks' module with the first task: a task that
    // only reports loads tsx, web-ifc, the engine and (large files) the reader thread at start-up.
    // Without it the first large import after a start also paid for all that (20.6 s against 13–14 s).
    if (options.maxThreads > 0) for (const p of Object.values(this.pools)) void p.run({ job: 'thread-state' }).catch(() => undefined);
  }

  run<T>(name: ImportPoolName, task: unknown, options: Parameters<Piscina['run']>[1]): Promise<T> {
    return this.pools[name].run(task, options);
  }

  /** The threads of both pools (tests stop them mid-import). */
  get threads(): Piscina['threads'] {
    return [...this.pools['small-files'].threads, ...this.pools['large-files'].threads];
  }

  async destroy(): Promise<void> {
    await Promise.allSettled([this.pools['small-files'].destroy(), this.pools['large-files'].destroy()]);
  }
}
