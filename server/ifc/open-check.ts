import { Worker } from 'node:worker_threads';

/** What web-ifc made of the file in the checking thread. */
export type OpenCheckAnswer = { ok: true; lines: number; schemaIndex: number } | { ok: false; message: string };

export interface OpenCheck {
  answer: Promise<OpenCheckAnswer>;
  /** Ends the thread (and its wasm memory) if it is still running. */
  stop(): void;
}

/**
 * Starts web-ifc opening the file in a thread of its own (open-check-thread.mjs) and counting
 * its lines, so the calling thread can read the file's text meanwhile. The thread reads the
 * same memory when the bytes are in a SharedArrayBuffer; others are copied into one first (a
 * plain copy: handing a 150 MB array to a thread as a structured clone cost 0.1–0.5 s). A thread
 * that fails or ends without answering answers { ok: false }.
 */
export function startOpenCheck(bytes: Uint8Array): OpenCheck {
  // No inherited Node options: the app may run under a TypeScript loader, which this plain
  // JavaScript thread does not need and which would cost it a second or more to start.
  const worker = new Worker(new URL('./open-check-thread.mjs', import.meta.url), { workerData: { bytes: shareable(bytes) }, execArgv: [] });
  let settled = false;
  const answer = new Promise<OpenCheckAnswer>((resolve) => {
    const settle = (a: OpenCheckAnswer) => {
      if (settled) return;
      settled = true;
      resolve(a);
      void worker.terminate();
    };
    worker.once('message', (m: OpenCheckAnswer) => settle(m));
    worker.once('error', (e) => settle({ ok: false, message: e instanceof Error ? e.message : String(e) }));
    worker.once('exit', (code) => settle({ ok: false, message: `the checking thread ended (${code}) without an answer` }));
  });
  return {
    answer,
    stop() {
      if (!settled) void worker.terminate();
    },
  };
}

/** The bytes in memory both threads can read: themselves when they are already, else a copy. */
export function shareable(bytes: Uint8Array): Uint8Array {
  if (bytes.buffer instanceof SharedArrayBuffer) return bytes;
  const shared = new Uint8Array(new SharedArrayBuffer(bytes.byteLength));
  shared.set(bytes);
  return shared;
}
