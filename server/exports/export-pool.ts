/**
 * Writes exports in worker threads: a report of a thousand members takes seconds of
 * pdfkit layout, which must not stall every other request on the server's thread.
 */
import Piscina from 'piscina';
import type { ExportBundle } from './export-bundle';
import type { ExportFormat } from './export-format-info';

let pool: Piscina | null = null;

function exportPool(): Piscina {
  pool ??= new Piscina({
    filename: new URL('./export-worker.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: 1,
    // Short: an idle thread holds memory, and exports come in bursts.
    idleTimeout: 10_000,
  });
  return pool;
}

export async function writeExportInWorker(format: ExportFormat, bundle: ExportBundle, modelBytes?: Uint8Array, timeoutMs = 300_000): Promise<Buffer> {
  const out = (await exportPool().run({ format, bundle, modelBytes }, { signal: AbortSignal.timeout(timeoutMs) })) as Uint8Array;
  return Buffer.from(out.buffer, out.byteOffset, out.byteLength);
}

/** Ends the worker threads (server shutdown, tests). */
export async function closeExportPool(): Promise<void> {
  const p = pool;
  pool = null;
  await p?.destroy();
}
