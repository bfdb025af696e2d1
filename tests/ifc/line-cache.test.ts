// The line cache is bounded (two generations); evicting lines must not change what is read.
import { describe, expect, it } from 'vitest';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import { KESTREL_MEMBERS } from '../../scripts/samples/kestrel-yard.ts';
import { buildModel, makeSyntheticModel } from '../../scripts/samples/make-samples.ts';

describe('bounded line cache', () => {
  it('reads the Kestrel Yard sample the same with a cache of 8 lines per generation as with the default', async () => {
    for (const schema of ['IFC4', 'IFC2X3'] as const) {
      const bytes = await buildModel(schema, KESTREL_MEMBERS);
      const tiny = await readIfcModel(bytes, { cacheGeneration: 8 });
      const normal = await readIfcModel(bytes);
      expect(tiny.members.length).toBeGreaterThan(0);
      expect(tiny).toEqual(normal);
    }
  });

  it('reads a synthetic model with bolts and holes the same when every generation turns over', async () => {
    const bytes = await makeSyntheticModel(20);
    const tiny = await readIfcModel(bytes, { cacheGeneration: 50 });
    const normal = await readIfcModel(bytes);
    expect(tiny.members).toHaveLength(20);
    expect(tiny.members.every((m) => m.holes.length === 4)).toBe(true);
    expect(tiny).toEqual(normal);
  });
});
