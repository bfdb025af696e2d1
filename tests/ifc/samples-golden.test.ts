import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect, it } from 'vitest';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import { GOLDEN_SAMPLES, goldenOf, goldenPath } from '../../scripts/samples/golden.ts';

const root = resolve(fileURLToPath(new URL('.', import.meta.url)), '../..');

// Compares each sample's extraction with its golden file. To accept a deliberate change run
// `node --import tsx scripts/samples/update-golden.ts`; this test never writes.
for (const sample of GOLDEN_SAMPLES) {
  it(`extraction of ${sample} matches tests/ifc/golden`, async () => {
    const path = goldenPath(root, sample);
    expect(existsSync(path), `${path} missing — run scripts/samples/update-golden.ts`).toBe(true);
    const model = await readIfcModel(new Uint8Array(readFileSync(resolve(root, 'samples', sample))));
    expect(goldenOf(model)).toEqual(JSON.parse(readFileSync(path, 'utf8')));
  });
}
