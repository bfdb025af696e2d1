import { existsSync } from 'node:fs';
import { expect, it } from 'vitest';
import { CORPUS_DIR, FILES, corpusPath, corpusSuite, readCorpus } from './corpus-helpers.ts';

// Every corpus file opens and extracts without throwing, and the model is plain data.
for (const [key, name] of Object.entries(FILES)) {
  corpusSuite(`file ${key.slice(1)}`, name, () => {
    it('opens and extracts without throwing', async () => {
      const m = await readCorpus(name);
      expect(['IFC2X3', 'IFC4', 'IFC4X3']).toContain(m.schema);
      expect(m.units.lengthToMm).toBeGreaterThan(0);
      // Plain data: survives a JSON round trip unchanged (no web-ifc objects leak out).
      expect(JSON.parse(JSON.stringify(m))).toEqual(m);
      for (const mem of m.members) expect(mem.globalId).toMatch(/^[0-9A-Za-z_$]{22}$/);
    });
  });
}

if (!existsSync(CORPUS_DIR)) {
  it('corpus folder is absent and was reported', () => {
    expect(existsSync(corpusPath(FILES.f1))).toBe(false);
  });
}
