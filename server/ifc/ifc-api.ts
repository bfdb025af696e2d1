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
