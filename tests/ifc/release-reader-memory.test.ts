// After a large model is extracted, the worker drops its web-ifc instance so the wasm memory
// that held the model can be collected before the checks (server/imports/release-reader-memory.ts).
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { getIfcApi } from '../../server/ifc/ifc-api';
import { readIfcModel } from '../../server/ifc/read-model';
import { RELEASE_AFTER_GEOMETRY_FROM_BYTES, RELEASE_FROM_BYTES, releaseReaderMemory } from '../../server/imports/release-reader-memory';
import { runGeometryTask } from '../../server/imports/run-geometry-task';

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
    let collected = false;
    const registry = new FinalizationRegistry<null>(() => (collected = true));
    registry.register(await getIfcApi(), null);
    expect(releaseReaderMemory(RELEASE_FROM_BYTES)).toBe(true);
    // Usually gone with that one collection; objects web-ifc handed out earlier can hold it until
    // their own finalisers have run (seen once on a loaded machine), so later collections may
    // finish the job. Nothing of ours may keep it: without the release it is never collected.
    for (let i = 0; i < 10 && !collected; i++) {
      await nextTurn();
      if (!collected) releaseReaderMemory(RELEASE_FROM_BYTES);
    }
    expect(collected).toBe(true);
    const again = await readIfcModel(SAMPLE);
    expect(again.members.map((m) => m.globalId)).toEqual(extracted.members.map((m) => m.globalId));
  });
});

describe('web-ifc memory after the display geometry of a file of some size', () => {
  it('keeps the instance after the geometry of a small file (the samples)', async () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'gl-geometry-keep-'));
    const file = path.join(dir, 'sample.ifc');
    writeFileSync(file, SAMPLE);
    try {
      expect(SAMPLE.length).toBeLessThan(RELEASE_AFTER_GEOMETRY_FROM_BYTES);
      const before = await getIfcApi();
      const outcome = await runGeometryTask({ job: 'geometry', filePath: file, kind: 'ifc', inflateLimitBytes: 1e9, timeBudgetMs: 60_000 });
      expect(outcome.problem).toBeNull();
      for (let i = 0; i < 5; i++) await new Promise((resolve) => setTimeout(resolve, 0));
      expect(await getIfcApi()).toBe(before);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);

  it('drops the instance once the geometry is built, and it is collected', async () => {
    // The sample followed by blanks to the size from which memory is given back: web-ifc reads
    // past them, and the geometry is the sample's.
    const dir = mkdtempSync(path.join(os.tmpdir(), 'gl-geometry-release-'));
    const file = path.join(dir, 'padded.ifc');
    writeFileSync(file, Buffer.concat([Buffer.from(SAMPLE), Buffer.alloc(RELEASE_AFTER_GEOMETRY_FROM_BYTES, 0x20)]));
    try {
      let collected = false;
      const registry = new FinalizationRegistry<null>(() => (collected = true));
      registry.register(await getIfcApi(), null);
      const outcome = await runGeometryTask({ job: 'geometry', filePath: file, kind: 'ifc', inflateLimitBytes: 1e9, timeBudgetMs: 60_000 });
      expect(outcome.problem).toBeNull();
      expect(outcome.geometry?.length).toBeGreaterThan(0);
      // No collection of our own: the task's, which run just after it answers, must free it.
      for (let i = 0; i < 20 && !collected; i++) await new Promise((resolve) => setTimeout(resolve, 0));
      expect(collected).toBe(true);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);
});
