/**
 * The reader thread: a large file is read on both of the app's cores (decision 0014). While the
 * reading thread indexes the first part of the text, this thread indexes the rest; while the
 * reading thread extracts members, this one reads the bolt groups (reader-thread.mjs →
 * reader-thread-tasks.ts). Both read the same memory: the bytes must be in a SharedArrayBuffer
 * (an import reads its upload into one; shareable copies others once). A thread that answers
 * waits for the next request; one stopped, failing or ending without an answer is ended, and
 * answers { ok: false } — the reading thread then does that part itself.
 */
import { Worker, resourceLimits } from 'node:worker_threads';
import type { IndexRestAnswer, ReaderThreadAnswer, ReaderThreadRequest } from './reader-thread-tasks.ts';
import type { BoltGroupsAnswer } from './bolt-groups-read.ts';

export interface ReaderThreadWork<A> {
  answer: Promise<A>;
  /** Ends the thread if it is still working. */
  stop(): void;
}

/** Reader threads waiting for their next request (one per read running at once, usually one). */
const idle: Worker[] = [];

function readerThread(): Worker {
  // Under the same old-generation limit as the thread that asks (an import worker's memory
  // limit): a thread out of memory ends, and the reading thread does its part itself.
  const oldLimit = resourceLimits.maxOldGenerationSizeMb;
  return idle.pop() ?? new Worker(new URL('./reader-thread.mjs', import.meta.url), { resourceLimits: { maxYoungGenerationSizeMb: readerYoungGenerationMb(resourceLimits.maxYoungGenerationSizeMb), ...(oldLimit ? { maxOldGenerationSizeMb: oldLimit } : {}) } });
}

/**
 * The reader thread's young generation, MB: half the asking thread's (it reads a third of what that
 * thread reads), at least 32. Import threads for large files have 192, those for smaller files 48
 * (import-pools.ts); a thread without a limit of its own (the command line) is taken as a large one.
 */
export function readerYoungGenerationMb(askingThreadMb: number | undefined): number {
  return Math.max(32, (askingThreadMb || 192) / 2);
}

/**
 * Starts a reader thread loading its code, if none is waiting, so that a read which asks for one
 * finds it ready (loading costs about half a second of CPU). Idle, it holds no file.
 */
export function prewarmReaderThread(): void {
  if (idle.length) return;
  const worker = readerThread();
  worker.unref();
  // One that fails to load is dropped; a read then starts another and, failing again, reads alone.
  worker.once('error', () => idle.splice(idle.indexOf(worker) >>> 0, 1));
  idle.push(worker);
}

export function askReaderThread(request: ReaderThreadRequest & { kind: 'index-rest' }): ReaderThreadWork<IndexRestAnswer>;
export function askReaderThread(request: ReaderThreadRequest & { kind: 'bolt-groups' }): ReaderThreadWork<BoltGroupsAnswer>;
export function askReaderThread(request: ReaderThreadRequest): ReaderThreadWork<ReaderThreadAnswer> {
  if (!(request.bytes.buffer instanceof SharedArrayBuffer)) throw new Error('the reader thread reads shared memory only (shareable)');
  const worker = readerThread();
  // Held while it works (a read waits for its answer); an idle one must not keep a process alive.
  worker.ref();
  let settled = false;
  const answer = new Promise<ReaderThreadAnswer>((resolve) => {
    const settle = (a: ReaderThreadAnswer, keep: boolean) => {
      if (settled) return;
      settled = true;
      worker.off('message', onMessage);
      worker.off('error', onError);
      worker.off('exit', onExit);
      resolve(a);
      if (keep) {
        worker.unref();
        idle.push(worker);
      } else void worker.terminate();
    };
    const onMessage = (a: ReaderThreadAnswer) => settle(a, true);
    const onError = (e: unknown) => settle({ ok: false, message: e instanceof Error ? e.message : String(e) }, false);
    const onExit = (code: number) => settle({ ok: false, message: `the reader thread ended (${code}) without an answer` }, false);
    worker.on('message', onMessage);
    worker.once('error', onError);
    worker.once('exit', onExit);
    worker.postMessage(request);
  });
  return {
    answer,
    stop() {
      // Its exit then answers { ok: false } to anyone still waiting.
      if (!settled) void worker.terminate();
    },
  };
}

/** Reader threads waiting for a request (tests). */
export function idleReaderThreads(): number {
  return idle.length;
}

/** The bytes in memory both threads can read: themselves when they are already, else a copy. */
export function shareable(bytes: Uint8Array): Uint8Array {
  if (bytes.buffer instanceof SharedArrayBuffer) return bytes;
  const shared = new Uint8Array(new SharedArrayBuffer(bytes.byteLength));
  shared.set(bytes);
  return shared;
}
