import { gzipSync } from 'node:zlib';
import { transferableSymbol, valueSymbol, move } from 'piscina';
import { buildDisplayGeometry } from '../ifc/display-geometry';
import { readUploadBytes } from './read-upload-bytes';
import { releaseAfterGeometry } from './release-reader-memory';

export interface GeometryTask {
  job: 'geometry';
  filePath: string;
  kind: 'ifc' | 'ifczip';
  inflateLimitBytes: number;
  /** The build stops after this and keeps what it has. */
  timeBudgetMs: number;
}

export interface GeometryOutcome {
  geometry: Uint8Array | null;
  /** The same file gzipped once here, so the server can send it compressed without spending its own time on it. */
  gzipped: Uint8Array | null;
  /** Why the view is partial or missing; null when complete. */
  problem: string | null;
  elapsedMs: number;
}

/**
 * Builds the 3D display geometry of an uploaded model, inside a worker thread. It runs
 * after the revision's results are stored, so a slow geometry kernel never holds them back.
 */
export async function runGeometryTask(task: GeometryTask): Promise<GeometryOutcome> {
  const read = { fileBytes: 0 };
  try {
    return await buildOutcome(task, read);
  } finally {
    // web-ifc's wasm memory grew to hold the model for its meshes and never shrinks: after a
    // large file the worker would keep it between imports. Not awaited: the view's file goes to
    // the request thread now, and the collections run after it (the instance is dropped before
    // this thread can take another task).
    void releaseAfterGeometry(read.fileBytes).catch(() => {});
  }
}

async function buildOutcome(task: GeometryTask, read: { fileBytes: number }): Promise<GeometryOutcome> {
  const started = performance.now();
  let outcome: GeometryOutcome;
  try {
    const bytes = await readUploadBytes(task.filePath, task.kind, task.inflateLimitBytes);
    read.fileBytes = bytes.length;
    const built = await buildDisplayGeometry(bytes, { timeBudgetMs: task.timeBudgetMs });
    const problem = built.stats.skipped ? `partial: ${built.stats.skipped} of ${built.stats.elements} elements left out after ${Math.round(task.timeBudgetMs / 1000)} s` : null;
    const gzipped = built.bytes ? gzipSync(built.bytes) : null;
    outcome = { geometry: built.bytes, gzipped, problem, elapsedMs: performance.now() - started };
  } catch (err) {
    return { geometry: null, gzipped: null, problem: err instanceof Error ? err.message : String(err), elapsedMs: performance.now() - started };
  }
  if (!outcome.geometry) return outcome;
  // Move the bytes to the main thread instead of copying them.
  Object.defineProperty(outcome, transferableSymbol, { value: [outcome.geometry.buffer, ...(outcome.gzipped ? [outcome.gzipped.buffer] : [])] });
  Object.defineProperty(outcome, valueSymbol, { value: { ...outcome } });
  return move(outcome as never) as unknown as GeometryOutcome;
}
