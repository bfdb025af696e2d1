// Imports read models without the list of every profile definition (ReadOptions.listProfiles):
// the members, their profiles and everything else must come out the same.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { readIfcModel } from '../../server/ifc/read-model';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

describe('reading without the profile list', () => {
  for (const file of ['kestrel-yard-shed.ifc', 'kestrel-yard-shed-ifc2x3.ifc']) {
    it(`${file}: the same model, only the list left empty`, async () => {
      const bytes = new Uint8Array(readFileSync(path.join(root, 'samples', file)));
      const listed = await readIfcModel(bytes);
      const unlisted = await readIfcModel(bytes, { listProfiles: false });
      expect(listed.profileDefinitions.length).toBeGreaterThan(0);
      expect(unlisted.profileDefinitions).toEqual([]);
      expect({ ...unlisted, profileDefinitions: listed.profileDefinitions }).toEqual(listed);
    });
  }
});
