import v8 from 'node:v8';
import vm from 'node:vm';
import { currentIfcApi, releaseIfcApi } from '../ifc/ifc-api';

/** Files from this size up leave web-ifc's memory large enough to be worth giving back after extraction. */
export const RELEASE_FROM_BYTES = 32 * 1024 * 1024;

/**
 * From this size up web-ifc is given back after the display geometry too (releaseAfterGeometry),
 * which opens every file with web-ifc: its wasm memory grows to hold the model and its meshes
 * (about 200 MB for a 7 MB file) and never shrinks, so the worker kept that between imports.
 * Below this (the samples) the instance is kept: a new one costs about 50 ms, which the next
 * geometry then pays after its results are stored.
 */
export const RELEASE_AFTER_GEOMETRY_FROM_BYTES = 4 * 1024 * 1024;

/**
 * Called once a model is extracted, before its members are checked. When web-ifc held the
 * model in this thread (files read the usual way, or a line only web-ifc could read), its wasm
 * memory has grown to hold it and would stay that size through the checks and every later
 * import; after a large file the instance is dropped, so that memory goes with the next full
 * collection and the checks do not sit on top of it. Since decision 0014 a regular large file
 * is read without web-ifc's model, and the collection then mostly gives back the file's bytes
 * and text index. A smaller file keeps the instance (a new one costs about 50 ms). Returns
 * whether it was dropped.
 * Measured on the 154 MB benchmark model in the app: 1,306 MB → 776 MB between extraction and
 * checks (the file's bytes and text go in the same collection), peak 1,806 → 1,332 MB, for
 * about half a second of collection.
 */
export function releaseReaderMemory(fileBytes: number): boolean {
  if (fileBytes < RELEASE_FROM_BYTES) return false;
  releaseIfcApi();
  fullCollection();
  return true;
}

let collect: (() => void) | undefined;

/**
 * A full garbage collection of this thread, now. V8 counts wasm memory outside its heap, so
 * nothing in the checks would prompt one soon. `gc` is exposed to a new context only (the
 * flag changes no existing one).
 */
function fullCollection(): void {
  if (!collect) {
    v8.setFlagsFromString('--expose-gc');
    collect = vm.runInNewContext('gc') as () => void;
  }
  collect();
}

/**
 * The same after a display-geometry build (from RELEASE_AFTER_GEOMETRY_FROM_BYTES), waiting
 * until the instance is really gone: the meshes web-ifc handed over hold it until their
 * finalisers have run, and each round of finalisers needs a collection and a turn of the event
 * loop (four rounds after the demo model). Collects at most `rounds` times; returns whether the
 * instance went.
 */
export async function releaseAfterGeometry(fileBytes: number, rounds = 10): Promise<boolean> {
  // No instance: nothing to give back (and none is made just to drop it). The instance is not
  // kept in a variable here: this frame lives through the collections and would hold it.
  if (fileBytes < RELEASE_AFTER_GEOMETRY_FROM_BYTES || !currentIfcApi()) return false;
  const gone = await watchInstance();
  releaseIfcApi();
  for (let i = 0; i < rounds && !gone.done; i++) {
    fullCollection();
    await new Promise((resolve) => setTimeout(resolve, 0));
  }
  return gone.done;
}

/** A flag set once the instance has been collected (the registry kept beside it, so it lives as long). */
async function watchInstance(): Promise<{ done: boolean; registry: FinalizationRegistry<null> }> {
  const gone = { done: false, registry: new FinalizationRegistry<null>(() => (gone.done = true)) };
  gone.registry.register(await currentIfcApi()!, null);
  return gone;
}
