import { copyFile, mkdtemp, rm } from 'node:fs/promises';
import { createHash } from 'node:crypto';
import { readFileSync, existsSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { FileStore } from '../../storage/file-store';
import { IfcModelModel } from '../models/ifc-model';
import { RevisionModel } from '../models/revision';
import { ProjectModel } from '../models/project';
import { UserModel } from '../models/user';
import { DEMO_ACCOUNTS, DEMO_PROJECT } from './demo-seed';

const SAMPLE_IFC = 'kestrel-yard-shed.ifc';
const SAMPLE_FORCES = 'kestrel-yard-forces.csv';

/** Puts a copy of a file in the store under its content address and returns the key. */
async function storeCopy(store: FileStore, file: string, prefix: string, ext: string): Promise<{ key: string; sha256: string; size: number }> {
  const bytes = readFileSync(file);
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  const key = `${prefix}/${sha256}.${ext}`;
  if (!(await store.exists(key))) {
    const dir = await mkdtemp(path.join(os.tmpdir(), 'gaugeline-seed-'));
    try {
      const tmp = path.join(dir, path.basename(file));
      await copyFile(file, tmp);
      await store.put(key, tmp);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  }
  return { key, sha256, size: bytes.length };
}

/**
 * Queues the demo model of the invented project as its first revision, with the sample
 * forces table, so the demo opens on checked results. Runs once, right after the demo seed.
 */
export async function seedDemoModel(store: FileStore, samplesDir: string): Promise<boolean> {
  const ifcPath = path.join(samplesDir, SAMPLE_IFC);
  const csvPath = path.join(samplesDir, SAMPLE_FORCES);
  if (!existsSync(ifcPath) || !existsSync(csvPath)) return false;
  const project = await ProjectModel.findOne({ where: { name: DEMO_PROJECT.name } });
  const engineer = await UserModel.findOne({ where: { email: DEMO_ACCOUNTS.find((a) => a.role === 'engineer')!.email } });
  if (!project || !engineer) return false;
  const ifc = await storeCopy(store, ifcPath, 'ifc', 'ifc');
  const forces = await storeCopy(store, csvPath, 'forces', 'csv');
  const [model] = await IfcModelModel.findOrCreate({ where: { projectId: project.id, name: 'Shed steelwork' } });
  if ((await RevisionModel.count({ where: { modelId: model.id } })) > 0) return false;
  await RevisionModel.create({
    modelId: model.id,
    number: 1,
    fileName: SAMPLE_IFC,
    fileSize: ifc.size,
    sha256: ifc.sha256,
    storageKey: ifc.key,
    forcesStorageKey: forces.key,
    uploadedById: engineer.id,
    standard: project.standard,
    status: 'queued',
  });
  return true;
}
