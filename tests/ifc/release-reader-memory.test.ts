// After a large model is extracted, the worker drops its web-ifc instance so the wasm memory
// that held the model can be collected before the checks (server/imports/release-reader-memory.ts).
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { getIfcApi } from '../../server/ifc/ifc-api';
import { readIfcModel } from '../../server/ifc/read-model';
import { RELEASE_FROM_BYTES, releaseReaderMemory } from '../../server/imports/release-reader-memory';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = new Uint8Array(readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc')));
const nextTurn = () => new Promise((resolve) => setImmediate(resolve));

describe('web-ifc memory after a large model', () => {
  it('keeps the instance after a small file', async () => {
    const before = await getIfcApi();
    expect(releaseReaderMemory(RELEASE_FROM_BYTES - 1)).toBe(false);
    expect(await getIfcApi()).toBe(before);
  });

  it('drops the instance after a large file, collects it, and reads the next model with a new one', async () => {
    const extracted = await readIfcModel(SAMPLE);
    const old = new WeakRef(await getIfcApi());
    await nextTurn();
    expect(releaseReaderMemory(RELEASE_FROM_BYTES)).toBe(true);
    await nextTurn();
    // Collected already: nothing else holds the instance, and with it its wasm memory.
    expect(old.deref()).toBeUndefined();
    const again = await readIfcModel(SAMPLE);
    expect(again.members.map((m) => m.globalId)).toEqual(extracted.members.map((m) => m.globalId));
  });
});
