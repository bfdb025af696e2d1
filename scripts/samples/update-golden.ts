/**
 * Rewrites tests/ifc/golden/*.json from the current samples. Run after a deliberate change:
 *   node --import tsx scripts/samples/update-golden.ts
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import { GOLDEN_SAMPLES, goldenPath, goldenText } from './golden.ts';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
for (const sample of GOLDEN_SAMPLES) {
  const model = await readIfcModel(new Uint8Array(readFileSync(resolve(root, 'samples', sample))));
  writeFileSync(goldenPath(root, sample), goldenText(model));
  console.log(`updated ${goldenPath(root, sample)}`);
}
