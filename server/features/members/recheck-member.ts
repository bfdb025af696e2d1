import type { Transaction } from 'sequelize';
import { checkMemberRaw, withoutForce, type MemberCheckInputRaw } from '@shared/engine';
import { bandOf } from '@shared/api/results';
import type { MemberDetail } from '@shared/api/member-detail';
import type { ActiveOverrides } from '@shared/api/overrides';
import { MemberModel } from '../../db/models/member';
import { CheckCapacityModel, CheckResultModel } from '../../db/models/check-result';
import { ENGINE_VERSION } from '../../imports/engine-version';

/** The stored engine input with the engineer's overrides applied. */
export function applyOverrides(input: MemberCheckInputRaw, overrides: ActiveOverrides | undefined): MemberCheckInputRaw {
  if (!overrides) return input;
  const steel = { ...input.steel };
  if (overrides.grade) {
    steel.grade = String(overrides.grade.value);
    delete steel.fy;
    delete steel.fu;
  }
  if (overrides.fy && overrides.fu) Object.assign(steel, { fy: Number(overrides.fy.value), fu: Number(overrides.fu.value) });
  return {
    ...input,
    steel,
    overrides: {
      ...input.overrides,
      ...(overrides.kt ? { kt: Number(overrides.kt.value) } : {}),
      ...(overrides.U ? { U: Number(overrides.U.value) } : {}),
      ...(overrides.holeDiameter ? { holeDiameter: Number(overrides.holeDiameter.value) } : {}),
    },
  };
}

/**
 * Runs the engine again for one member from its stored input and stores the result.
 * `modelForce` is the design force from the model or a forces file (N, tension positive);
 * an engineer's force override beats it. Returns false when the member has no stored
 * input (its section was never understood).
 */
export async function recheckMember(
  member: MemberModel,
  standard: string,
  modelForce: { force: number | null; source: string | null },
  transaction: Transaction,
): Promise<boolean> {
  const detail = member.detail as MemberDetail;
  // The table shows the grade the check used: an override's, else the model's material.
  member.gradeName = detail.overrides?.grade ? String(detail.overrides.grade.value) : (detail.material?.name ?? null);
  const forced = detail.overrides?.designForceN;
  member.designForceN = forced ? Number(forced.value) : modelForce.force;
  member.forceSource = forced ? 'override' : modelForce.source;
  if (!detail.checkInput) {
    await member.save({ transaction });
    return false;
  }
  const input = applyOverrides({ ...(detail.checkInput as MemberCheckInputRaw), force: member.designForceN }, detail.overrides);
  const result = checkMemberRaw(input);
  member.set({
    netAreaMm2: result.netArea,
    designCapacityN: result.designCapacity,
    utilisation: result.utilisation,
    governing: result.governing,
    band: bandOf(result.utilisation),
  });
  await member.save({ transaction });
  // The member gets a capacity of its own (its input may now differ from the import's); one
  // that no other member's result uses any more goes with the old result.
  const old = await CheckResultModel.findOne({ where: { memberId: member.id, standard }, transaction });
  const capacity = await CheckCapacityModel.create({ revisionId: member.revisionId, importKey: null, body: withoutForce(result) }, { transaction });
  await old?.destroy({ transaction });
  await CheckResultModel.create({ memberId: member.id, standard, engineVersion: ENGINE_VERSION, capacityId: capacity.id }, { transaction });
  if (old && !(await CheckResultModel.findOne({ where: { capacityId: old.capacityId }, attributes: ['id'], transaction }))) {
    await CheckCapacityModel.destroy({ where: { id: old.capacityId }, transaction });
  }
  return true;
}
