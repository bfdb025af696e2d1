import { Worker } from 'node:worker_threads';

/** What web-ifc made of the file in the checking thread. */
export type OpenCheckAnswer = { ok: true; lines: number; schemaIndex: number } | { ok: false; message: string };

export interface OpenCheck {
  answer: Promise<OpenCheckAnswer>;
  /** Ends the thread (and its wasm memory) if it is still running. */
  stop(): void;
}

/** Checking threads waiting for their next file (one per read running at once, usually one). */
const idle: Worker[] = [];

function checkingThread(): Worker {
  const reused = idle.pop();
  if (reused) return reused;
  // No inherited Node options: the app may run under a TypeScript loader, which this plain
  // JavaScript thread does not need and which would cost it a second or more to start.
  return new Worker(new URL('./open-check-thread.mjs', import.meta.url), { execArgv: [] });
}

/**
 * Has web-ifc open the file in a thread of its own (open-check-thread.mjs) and count its lines,
 * so the calling thread can read the file's text meanwhile. The thread reads the same memory
 * when the bytes are in a SharedArrayBuffer; others are copied into one first (a plain copy:
 * handing a 150 MB array to a thread as a structured clone cost 0.1–0.5 s). A thread that
 * answers waits for the next file; one stopped, failing or ending without an answer is
 * ended (and answers { ok: false }).
 */
export function startOpenCheck(bytes: Uint8Array): OpenCheck {
  const worker = checkingThread();
  // Held while it works (a read waits for its answer); an idle one must not keep a process alive.
  worker.ref();
  let settled = false;
  const answer = new Promise<OpenCheckAnswer>((resolve) => {
    const settle = (a: OpenCheckAnswer, keep: boolean) => {
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
    const onMessage = (m: OpenCheckAnswer) => settle(m, true);
    const onError = (e: unknown) => settle({ ok: false, message: e instanceof Error ? e.message : String(e) }, false);
    const onExit = (code: number) => settle({ ok: false, message: `the checking thread ended (${code}) without an answer` }, false);
    worker.on('message', onMessage);
    worker.once('error', onError);
    worker.once('exit', onExit);
    worker.postMessage({ bytes: shareable(bytes) });
  });
  return {
    answer,
    stop() {
      // Its exit then answers { ok: false } to anyone still waiting.
      if (!settled) void worker.terminate();
    },
  };
}

/** Checking threads waiting for a file (tests). */
export function idleCheckingThreads(): number {
  return idle.length;
}

/** The bytes in memory both threads can read: themselves when they are already, else a copy. */
export function shareable(bytes: Uint8Array): Uint8Array {
  if (bytes.buffer instanceof SharedArrayBuffer) return bytes;
  const shared = new Uint8Array(new SharedArrayBuffer(bytes.byteLength));
  shared.set(bytes);
  return shared;
}
