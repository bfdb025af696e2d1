// The line cache is small and direct-mapped; evicting lines must not change what is read,
// whether lines come from the file's text or through web-ifc's GetLine.
import { describe, expect, it } from 'vitest';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import { KESTREL_MEMBERS } from '../../scripts/samples/kestrel-yard.ts';
import { buildModel, makeSyntheticModel } from '../../scripts/samples/make-samples.ts';

describe('bounded line cache', () => {
  it('reads the Kestrel Yard sample the same with a cache of 8 lines as with the default', async () => {
    for (const schema of ['IFC4', 'IFC2X3'] as const) {
      const bytes = await buildModel(schema, KESTREL_MEMBERS);
      const normal = await readIfcModel(bytes);
      expect(normal.members.length).toBeGreaterThan(0);
      for (const cacheSize of [1, 8]) {
        expect(await readIfcModel(bytes, { cacheSize })).toEqual(normal);
        expect(await readIfcModel(bytes, { cacheSize, readLinesWith: 'web-ifc' })).toEqual(normal);
      }
    }
  });

  it('reads a synthetic model with bolts and holes the same when the cache turns over all the time', async () => {
    const bytes = await makeSyntheticModel(20);
    const normal = await readIfcModel(bytes);
    expect(normal.members).toHaveLength(20);
    expect(normal.members.every((m) => m.holes.length === 4)).toBe(true);
    expect(normal.boltGroups.every((g) => g.boltCount === 2 && g.memberGlobalIds.length > 0)).toBe(true);
    for (const cacheSize of [1, 50]) {
      expect(await readIfcModel(bytes, { cacheSize })).toEqual(normal);
      expect(await readIfcModel(bytes, { cacheSize, readLinesWith: 'web-ifc' })).toEqual(normal);
    }
  });
});
