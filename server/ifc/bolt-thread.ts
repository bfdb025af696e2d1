/**
 * The bolt thread: a large file's bolt groups are read in a thread of their own
 * (bolt-thread.mjs → bolt-groups-read.ts) while the reading thread extracts members, so the
 * app's second core works during extraction (decision 0014). The thread reads the same memory
 * when the bytes are in a SharedArrayBuffer (an import reads its upload into one); others are
 * copied into one first. A thread that answers waits for the next file; one stopped, failing or
 * ending without an answer is ended, and answers { ok: false } — the reading thread then reads
 * the bolt groups itself.
 */
import { Worker } from 'node:worker_threads';
import type { BoltGroupsAnswer, BoltGroupsRequest } from './bolt-groups-read.ts';

export interface BoltThreadRead {
  answer: Promise<BoltGroupsAnswer>;
  /** Ends the thread if it is still reading. */
  stop(): void;
}

/** Bolt threads waiting for their next file (one per read running at once, usually one). */
const idle: Worker[] = [];

function boltThread(): Worker {
  return idle.pop() ?? new Worker(new URL('./bolt-thread.mjs', import.meta.url), { resourceLimits: { maxYoungGenerationSizeMb: 96 } });
}

/**
 * Starts a bolt thread loading its code, if none is waiting, so that a read which wants one
 * later finds it ready (loading costs about half a second of CPU). Idle, it holds no file.
 */
export function prewarmBoltThread(): void {
  if (idle.length) return;
  const worker = boltThread();
  worker.unref();
  // One that fails to load is dropped; a read then starts another and, failing again, reads alone.
  worker.once('error', () => idle.splice(idle.indexOf(worker) >>> 0, 1));
  idle.push(worker);
}

export function readBoltGroupsInThread(request: BoltGroupsRequest): BoltThreadRead {
  const worker = boltThread();
  // Held while it works (a read waits for its answer); an idle one must not keep a process alive.
  worker.ref();
  let settled = false;
  const answer = new Promise<BoltGroupsAnswer>((resolve) => {
    const settle = (a: BoltGroupsAnswer, keep: boolean) => {
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
    const onMessage = (a: BoltGroupsAnswer) => settle(a, true);
    const onError = (e: unknown) => settle({ ok: false, message: e instanceof Error ? e.message : String(e) }, false);
    const onExit = (code: number) => settle({ ok: false, message: `the bolt thread ended (${code}) without an answer` }, false);
    worker.on('message', onMessage);
    worker.once('error', onError);
    worker.once('exit', onExit);
    worker.postMessage({ ...request, bytes: shareable(request.bytes) } satisfies BoltGroupsRequest);
  });
  return {
    answer,
    stop() {
      // Its exit then answers { ok: false } to anyone still waiting.
      if (!settled) void worker.terminate();
    },
  };
}

/** Bolt threads waiting for a file (tests). */
export function idleBoltThreads(): number {
  return idle.length;
}

/** The bytes in memory both threads can read: themselves when they are already, else a copy. */
export function shareable(bytes: Uint8Array): Uint8Array {
  if (bytes.buffer instanceof SharedArrayBuffer) return bytes;
  const shared = new Uint8Array(new SharedArrayBuffer(bytes.byteLength));
  shared.set(bytes);
  return shared;
}
