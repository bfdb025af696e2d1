import { Op, literal, type Sequelize } from 'sequelize';
import type { RevisionSummary } from '@shared/api/models';
import { MemberModel } from '../db/models/member';
import { RevisionModel } from '../db/models/revision';
import { ENGINE_VERSION } from './engine-version';
import { batchInsert } from '../db/batch-insert';
import type { StorableMember } from './storable-member';

const MEMBER_COLUMNS = [
  'revision_id', 'global_id', 'name', 'tag', 'ifc_class', 'storey', 'assembly', 'profile_name', 'grade_name',
  'length_mm', 'is_tension', 'inclusion', 'hole_count', 'design_force_n', 'force_source', 'net_area_mm2', 'design_capacity_n', 'utilisation',
  'governing', 'band', 'warning_count', 'detail', 'created_at', 'updated_at',
] as const;

/**
 * Writes a finished import in one transaction: members, forces, check results and the
 * revision's state. If another process has taken the job over meanwhile, nothing is kept.
 */
export async function storeOutcome(
  sequelize: Sequelize,
  revisionId: number,
  owner: string,
  standard: string,
  summary: RevisionSummary,
  members: StorableMember[],
): Promise<boolean> {
  return sequelize.transaction(async (transaction) => {
    // A retried job may have left nothing (writes are atomic), but be sure.
    await MemberModel.destroy({ where: { revisionId }, transaction });
    const now = new Date();
    // The driver's bulk protocol: no model instance per row and no SQL text to escape.
    await batchInsert(transaction, 'members', MEMBER_COLUMNS, members.map((m) => [
      revisionId, m.globalId, m.name?.slice(0, 255) ?? null, m.tag?.slice(0, 120) ?? null, m.ifcClass,
      m.storey?.slice(0, 160) ?? null, m.assembly?.slice(0, 160) ?? null, m.profileName?.slice(0, 120) ?? null, m.gradeName?.slice(0, 120) ?? null,
      m.lengthMm, m.isTension, 'auto', m.holeCount, m.designForceN, m.forceSource, m.netAreaMm2, m.designCapacityN, m.utilisation,
      m.governing, m.band, m.warningCount, m.detailJson, now, now,
    ]));
    const rows = await MemberModel.findAll({ where: { revisionId }, attributes: ['id', 'globalId'], transaction, raw: true });
    const idOf = new Map(rows.map((r) => [r.globalId, r.id]));
    await batchInsert(transaction, 'member_forces', ['member_id', 'load_case', 'axial_n', 'source', 'created_at'],
      members.flatMap((m) => m.forces.map((f) => [idOf.get(m.globalId)!, f.loadCase.slice(0, 120), f.axialN, f.source, now])));
    await batchInsert(transaction, 'check_results', ['member_id', 'standard', 'engine_version', 'result', 'created_at'],
      members.filter((m) => m.resultJson).map((m) => [idOf.get(m.globalId)!, standard, ENGINE_VERSION, m.resultJson, now]));
    const [affected] = await RevisionModel.update(
      // The results version moves so that a retried job's rows replace any copy held in memory.
      { resultsVersion: literal('results_version + 1'), status: 'done', progress: 1, summary, schemaName: summary.schema, finishedAt: new Date(), heartbeatAt: new Date() },
      { where: { id: revisionId, claimedBy: owner, status: { [Op.notIn]: ['done', 'failed'] } }, transaction },
    );
    if (affected !== 1) throw new LostClaimError();
    return true;
  }).catch((err) => {
    if (err instanceof LostClaimError) return false;
    throw err;
  });
}

class LostClaimError extends Error {}
