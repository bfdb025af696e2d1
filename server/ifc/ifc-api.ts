/**
 * One web-ifc instance per process (per worker thread later). Init loads the wasm once,
 * which takes tens of milliseconds; models are opened and closed per read.
 */
import { IfcAPI, LogLevel } from 'web-ifc';

let apiPromise: Promise<IfcAPI> | null = null;

export function getIfcApi(): Promise<IfcAPI> {
  if (!apiPromise) {
    apiPromise = (async () => {
      const api = new IfcAPI();
      // Single-threaded wasm: predictable inside a worker thread, and faster for line-by-line reads.
      await api.Init(undefined, true);
      // web-ifc logs parse problems to the console; we report them ourselves.
      api.SetLogLevel(LogLevel.LOG_LEVEL_OFF);
      return api;
    })().catch((e) => {
      apiPromise = null;
      throw e;
    });
  }
  return apiPromise;
}

/** This thread's instance if one was made and not dropped since; null otherwise (none is made). */
export function currentIfcApi(): Promise<IfcAPI> | null {
  return apiPromise;
}

/**
 * Drops this thread's web-ifc instance. Its wasm memory grows to the largest model opened and
 * never shrinks while the instance lives (290 MB after the 154 MB benchmark model); once dropped it goes with the
 * next full garbage collection. The next getIfcApi() initialises a new one (about 50 ms).
 * Call only when no model is open.
 */
export function releaseIfcApi(): void {
  apiPromise = null;
}
