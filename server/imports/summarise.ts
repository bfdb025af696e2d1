import type { RevisionSummary } from '@shared/api/models';
import type { ExtractedModel } from '../ifc/types';
import type { MemberRecord } from './check-members';

/** What a person needs to judge an import: what was found, checked, and not understood. */
export function summarise(model: ExtractedModel, members: MemberRecord[], timings: Record<string, number>): RevisionSummary {
  const tension = members.filter((m) => m.isTension);
  const notSteel = model.members.filter((m) => m.notSteelReason).length;
  const warnings = [...model.warnings];
  if (notSteel) warnings.push({ code: 'member.not-steel', message: 'Elements exported as members that are not steel members (nuts, washers, anchors…) were left out.', count: notSteel, examples: model.members.filter((m) => m.notSteelReason).slice(0, 3).map((m) => `${m.globalId} ${m.objectType ?? m.name ?? ''}`.trim()) });
  const defaulted = members.filter((m) => m.detail.steel?.fromDefault);
  if (defaulted.length) warnings.push({ code: 'member.default-grade', message: "The steel grade was not recognised; the project's default grade was used.", count: defaulted.length, examples: defaulted.slice(0, 3).map((m) => m.globalId) });
  return {
    schema: model.schemaIdentifier,
    lengthUnit: model.units.lengthUnitName,
    candidates: members.length,
    tensionMembers: tension.length,
    checked: tension.filter((m) => m.designCapacityN !== null).length,
    withoutForce: tension.filter((m) => m.designForceN === null).length,
    boltGroups: model.boltGroups.length,
    holes: model.members.reduce((n, m) => n + m.holes.length, 0),
    countsByClass: model.counts,
    warnings,
    timings: Object.fromEntries(Object.entries(timings).map(([k, v]) => [k, Math.round(v)])),
  };
}
