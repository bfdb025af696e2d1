import { Op, literal, type Sequelize } from 'sequelize';
import type { RevisionSummary } from '@shared/api/models';
import { MemberModel } from '../db/models/member';
import { MemberForceModel } from '../db/models/member-force';
import { CheckResultModel } from '../db/models/check-result';
import { RevisionModel } from '../db/models/revision';
import { ENGINE_VERSION } from './engine-version';
import type { MemberRecord } from './check-members';

const CHUNK = 1000;

async function inChunks<T>(items: T[], write: (chunk: T[]) => Promise<unknown>): Promise<void> {
  for (let i = 0; i < items.length; i += CHUNK) await write(items.slice(i, i + CHUNK));
}

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
  members: MemberRecord[],
): Promise<boolean> {
  return sequelize.transaction(async (transaction) => {
    // A retried job may have left nothing (writes are atomic), but be sure.
    await MemberModel.destroy({ where: { revisionId }, transaction });
    await inChunks(members, (chunk) =>
      MemberModel.bulkCreate(
        chunk.map((m) => ({
          revisionId,
          globalId: m.globalId,
          name: m.name?.slice(0, 255) ?? null,
          tag: m.tag?.slice(0, 120) ?? null,
          ifcClass: m.ifcClass,
          storey: m.storey?.slice(0, 160) ?? null,
          assembly: m.assembly?.slice(0, 160) ?? null,
          profileName: m.profileName?.slice(0, 120) ?? null,
          gradeName: m.gradeName?.slice(0, 120) ?? null,
          lengthMm: m.lengthMm,
          isTension: m.isTension,
          holeCount: m.holeCount,
          designForceN: m.designForceN,
          forceSource: m.forceSource,
          netAreaMm2: m.netAreaMm2,
          designCapacityN: m.designCapacityN,
          utilisation: m.utilisation,
          governing: m.governing,
          band: m.band,
          warningCount: m.warningCount,
          detail: m.detail,
        })),
        { transaction },
      ),
    );
    const rows = await MemberModel.findAll({ where: { revisionId }, attributes: ['id', 'globalId'], transaction, raw: true });
    const idOf = new Map(rows.map((r) => [r.globalId, r.id]));
    const forces = members.flatMap((m) => m.forces.map((f) => ({ memberId: idOf.get(m.globalId)!, loadCase: f.loadCase.slice(0, 120), axialN: f.axialN, source: f.source })));
    await inChunks(forces, (chunk) => MemberForceModel.bulkCreate(chunk, { transaction }));
    const results = members.filter((m) => m.result).map((m) => ({ memberId: idOf.get(m.globalId)!, standard, engineVersion: ENGINE_VERSION, result: m.result! }));
    await inChunks(results, (chunk) => CheckResultModel.bulkCreate(chunk, { transaction }));
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
