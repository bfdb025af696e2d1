import { Op } from 'sequelize';
import type { StandardId } from '@shared/api/projects';
import type { MemberDetail } from '@shared/api/member-detail';
import { withForce, type CheckResult } from '@shared/engine';
import { MemberModel } from '../../db/models/member';
import { CheckCapacityModel, CheckResultModel } from '../../db/models/check-result';
import { IfcModelModel } from '../../db/models/ifc-model';
import type { ProjectModel } from '../../db/models/project';
import type { RevisionModel } from '../../db/models/revision';
import type { FileStore } from '../../storage/file-store';
import { errors } from '../../http/errors';
import { ENGINE_VERSION } from '../../imports/engine-version';
import { readUploadBytes } from '../../imports/read-upload-bytes';
import type { ExportBundle } from '../../exports/export-bundle';
import { memberOrder, memberWhere } from '../members/member-query';
import { presentMemberRow } from '../members/member-presenter';
import { describeFilter, type ExportQuery } from './export-query';

/** A bigger export is refused rather than tying up the server; filter it instead. */
export const MAX_EXPORT_MEMBERS = 20_000;
/** The upload was already accepted within the server's inflate limit; this only guards memory. */
const INFLATE_LIMIT_BYTES = 2 * 1024 ** 3;

/** Loads the members (with their stored result for the revision's standard) that the filter selects. */
export async function loadExportBundle(project: ProjectModel, revision: RevisionModel, q: ExportQuery): Promise<ExportBundle & { modelName: string }> {
  if (revision.status !== 'done') throw errors.conflict('This revision has not finished importing, so there is nothing to export yet.');
  const members = await MemberModel.findAll({ where: memberWhere(revision.id, q), order: memberOrder(q), limit: MAX_EXPORT_MEMBERS + 1 });
  if (members.length > MAX_EXPORT_MEMBERS) throw errors.validation(`More than ${MAX_EXPORT_MEMBERS} members match; narrow the filter.`);
  const results = members.length
    ? await CheckResultModel.findAll({ where: { memberId: { [Op.in]: members.map((m) => m.id) }, standard: revision.standard } })
    : [];
  const byMember = new Map(results.map((r) => [r.memberId, r]));
  const capacityIds = [...new Set(results.map((r) => r.capacityId))];
  const capacities = capacityIds.length ? await CheckCapacityModel.findAll({ where: { id: { [Op.in]: capacityIds } } }) : [];
  const capacityOf = new Map(capacities.map((c) => [c.id, c.body as CheckResult]));
  const model = await IfcModelModel.findByPk(revision.modelId, { attributes: ['name'] });
  const modelName = model?.name ?? revision.fileName;
  const versions = [...new Set(results.map((r) => r.engineVersion))].sort();
  const newest = results.reduce<Date | null>((d, r) => (!d || r.createdAt > d ? r.createdAt : d), null);
  return {
    modelName,
    project: { name: project.name },
    model: { name: modelName },
    revision: {
      number: revision.number,
      fileName: revision.fileName,
      standard: revision.standard as StandardId,
      checkedAt: (newest ?? revision.finishedAt ?? revision.updatedAt).toISOString(),
    },
    generatedAt: new Date().toISOString(),
    // The version that made the stored numbers, which may be older than the running one.
    engineVersion: versions.length ? versions.join(', ') : ENGINE_VERSION,
    filterDescription: describeFilter(q),
    members: members
      .filter((m) => byMember.has(m.id))
      .map((m) => {
        const detail = m.detail as MemberDetail;
        return {
          row: { ...presentMemberRow(m), warnings: detail.warnings ?? [] },
          // The stored capacity with the member's design force, as the import made it.
          result: withForce(capacityOf.get(byMember.get(m.id)!.capacityId)!, m.designForceN),
          detail,
        };
      }),
  };
}

/** The uploaded model's IFC bytes (inflated from .ifczip when needed). */
export async function revisionIfcBytes(store: FileStore, revision: RevisionModel): Promise<Uint8Array> {
  const local = await store.fetchToLocal(revision.storageKey);
  try {
    const kind = /\.ifczip$/i.test(revision.storageKey) || /\.ifczip$/i.test(revision.fileName) ? 'ifczip' : 'ifc';
    return await readUploadBytes(local.path, kind, INFLATE_LIMIT_BYTES);
  } finally {
    await local.release();
  }
}
