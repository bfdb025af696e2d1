// A bundle for the export writer tests, built from the Kestrel Yard sample through the
// same in-process pipeline the server and the command line use (forces table applied).
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { StandardId } from '../../shared/api/projects';
import { parseForcesCsv } from '../../shared/forces/parse-forces-csv';
import { runImportTask } from '../../server/imports/run-import-task';
import type { MemberRecord } from '../../server/imports/check-members';
import { bundleFromRecords, selectRecords } from '../../server/exports/bundle-from-records';
import type { ExportBundle } from '../../server/exports/export-bundle';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const SAMPLE_IFC4 = path.join(ROOT, 'samples/kestrel-yard-shed.ifc');
export const SAMPLE_IFC2X3 = path.join(ROOT, 'samples/kestrel-yard-shed-ifc2x3.ifc');
export const SAMPLE_FORCES = path.join(ROOT, 'samples/kestrel-yard-forces.csv');

export async function sampleRecords(file = SAMPLE_IFC4, standard: StandardId = 'as4100', withForces = true): Promise<MemberRecord[]> {
  const forceRows = withForces ? parseForcesCsv(readFileSync(SAMPLE_FORCES, 'utf8')).rows : undefined;
  const out = await runImportTask({ filePath: file, kind: 'ifc', standard, defaultGrade: 'AS/NZS 3679.1-300', inflateLimitBytes: 1e9, forceRows });
  if (!out.ok) throw new Error(`sample import failed: ${out.failure.message}`);
  return out.members;
}

export async function sampleBundle(file = SAMPLE_IFC4, standard: StandardId = 'as4100'): Promise<ExportBundle> {
  const records = selectRecords(await sampleRecords(file, standard));
  return bundleFromRecords(records, {
    projectName: 'Kestrel Yard maintenance shed',
    modelName: 'kestrel-yard-shed',
    fileName: path.basename(file),
    standard,
    checkedAt: '2025-03-04T05:06:07.000Z',
    generatedAt: '2025-03-05T08:09:10.000Z',
    filterDescription: 'tension members with a check result',
  });
}
