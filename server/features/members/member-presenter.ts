import type { MemberRow } from '@shared/api/members';
import type { MemberModel } from '../../db/models/member';

export function presentMemberRow(m: MemberModel): MemberRow {
  return {
    globalId: m.globalId,
    tag: m.tag,
    name: m.name,
    ifcClass: m.ifcClass,
    storey: m.storey,
    assembly: m.assembly,
    profile: m.profileName,
    grade: m.gradeName,
    lengthMm: m.lengthMm,
    isTension: m.isTension,
    inclusion: m.inclusion,
    holeCount: m.holeCount,
    designForceN: m.designForceN,
    forceSource: m.forceSource,
    netAreaMm2: m.netAreaMm2,
    designCapacityN: m.designCapacityN,
    utilisation: m.utilisation,
    governing: m.governing,
    band: m.band,
    warningCount: m.warningCount,
  };
}
