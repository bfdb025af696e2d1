import type { Transaction } from 'sequelize';
import { checkMemberRaw, type MemberCheckInputRaw } from '@shared/engine';
import { bandOf } from '@shared/api/results';
import type { MemberDetail } from '@shared/api/member-detail';
import { MemberModel } from '../../db/models/member';
import { CheckResultModel } from '../../db/models/check-result';
import { ENGINE_VERSION } from '../../imports/engine-version';

/**
 * Runs the engine again for one member from its stored input, with a new design force
 * (N, tension positive; null = unknown) and optional input changes, and stores the result.
 * Returns false when the member has no stored input (its section was never understood).
 */
export async function recheckMember(
  member: MemberModel,
  standard: string,
  change: { force: number | null; forceSource: string | null; input?: (input: MemberCheckInputRaw) => MemberCheckInputRaw },
  transaction: Transaction,
): Promise<boolean> {
  const detail = member.detail as MemberDetail;
  member.designForceN = change.force;
  member.forceSource = change.forceSource;
  if (!detail.checkInput) {
    await member.save({ transaction });
    return false;
  }
  const base = { ...(detail.checkInput as MemberCheckInputRaw), force: change.force };
  const input = change.input ? change.input(base) : base;
  const result = checkMemberRaw(input);
  member.set({
    netAreaMm2: result.netArea,
    designCapacityN: result.designCapacity,
    utilisation: result.utilisation,
    governing: result.governing,
    band: bandOf(result.utilisation),
  });
  await member.save({ transaction });
  await CheckResultModel.destroy({ where: { memberId: member.id, standard }, transaction });
  await CheckResultModel.create({ memberId: member.id, standard, engineVersion: ENGINE_VERSION, result }, { transaction });
  return true;
}
