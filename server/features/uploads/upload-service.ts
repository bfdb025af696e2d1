import { rm } from 'node:fs/promises';
import { fn, col, UniqueConstraintError, type Sequelize } from 'sequelize';
import type { SessionUser } from '@shared/api/session';
import type { ProjectModel } from '../../db/models/project';
import { IfcModelModel } from '../../db/models/ifc-model';
import { RevisionModel } from '../../db/models/revision';
import type { FileStore } from '../../storage/file-store';
import { AuditEntryModel } from '../../db/models/audit-entry';
import { cleanFileName, kindFromName, sniffUpload, uploadErrors } from './sniff-upload';

export interface ReceivedFile {
  path: string;
  originalName: string;
  size: number;
  /** SHA-256 (hex), worked out while the file was received (hashingDiskStorage). */
  sha256: string;
}

export interface UploadOutcome {
  revision: RevisionModel;
  duplicateOf: number | null;
}

/** The project's model of that name, created if missing; safe against concurrent creation. */
async function findOrCreateModel(projectId: number, name: string): Promise<IfcModelModel> {
  const existing = await IfcModelModel.findOne({ where: { projectId, name } });
  if (existing) return existing;
  try {
    return await IfcModelModel.create({ projectId, name });
  } catch (err) {
    if (!(err instanceof UniqueConstraintError)) throw err;
    const winner = await IfcModelModel.findOne({ where: { projectId, name } });
    if (!winner) throw err;
    return winner;
  }
}

/** Default model name: the file name without its extension. */
function modelNameFor(fileName: string, given?: string): string {
  return (given ?? fileName.replace(/\.(ifc|ifczip)$/i, '')).trim().slice(0, 160) || 'Model';
}

/**
 * Stores an uploaded file and queues it as the next revision of a named model.
 * Identical bytes already uploaded to the same model are recognised and not queued again.
 */
export async function acceptUpload(
  sequelize: Sequelize,
  store: FileStore,
  user: SessionUser,
  project: ProjectModel,
  file: ReceivedFile,
  givenModelName?: string,
): Promise<UploadOutcome> {
  try {
    const kind = kindFromName(file.originalName);
    if (!kind) throw uploadErrors.wrongType();
    if (file.size === 0) throw uploadErrors.empty();
    await sniffUpload(file.path, kind);
    const { sha256 } = file;
    const fileName = cleanFileName(file.originalName);
    const modelName = modelNameFor(fileName, givenModelName);
    const storageKey = `ifc/${sha256}.${kind}`;

    const existingModel = await IfcModelModel.findOne({ where: { projectId: project.id, name: modelName } });
    if (existingModel) {
      const same = await RevisionModel.findOne({ where: { modelId: existingModel.id, sha256 }, order: [['number', 'DESC']] });
      if (same) return { revision: same, duplicateOf: same.id };
    }
    // Content-addressed: the same bytes uploaded elsewhere are stored once.
    if (!(await store.exists(storageKey))) await store.put(storageKey, file.path);

    // The model row is made outside the transaction: concurrent first uploads under one new
    // name then meet the unique index (one insert wins, the others read its row) instead of
    // deadlocking on gap locks inside their transactions.
    const model = await findOrCreateModel(project.id, modelName);
    const revision = await sequelize.transaction(async (transaction) => {
      // Lock the model row first, so two uploads at once get distinct revision numbers: as the
      // transaction's first read it also makes the MAX below see every committed revision.
      await IfcModelModel.findByPk(model.id, { transaction, lock: transaction.LOCK.UPDATE });
      const max = (await RevisionModel.findOne({
        attributes: [[fn('MAX', col('number')), 'max']],
        where: { modelId: model.id },
        raw: true,
        transaction,
      })) as unknown as { max: number | null } | null;
      const created = await RevisionModel.create(
        {
          modelId: model.id,
          number: (max?.max ?? 0) + 1,
          fileName,
          fileSize: file.size,
          sha256,
          storageKey,
          uploadedById: user.id,
          standard: project.standard,
          status: 'queued',
        },
        { transaction },
      );
      await AuditEntryModel.create(
        { actorId: user.id, projectId: project.id, action: 'model.uploaded', subject: `revision:${created.id}`, detail: { model: modelName, fileName, sha256, size: file.size }, reason: null },
        { transaction },
      );
      return created;
    });
    return { revision, duplicateOf: null };
  } finally {
    await rm(file.path, { force: true });
  }
}
