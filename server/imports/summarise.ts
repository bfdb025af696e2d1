import type { RevisionSummary } from '@shared/api/models';
import type { ExtractedModel } from '../ifc/types';
import type { MemberRecord } from './check-members';

/** What the summary needs from the checked members, gathered as they are checked (the records themselves can go). */
export interface MemberTally {
  candidates: number;
  tension: number;
  checked: number;
  withoutForce: number;
  defaulted: number;
  defaultedExamples: string[];
}

export const emptyTally = (): MemberTally => ({ candidates: 0, tension: 0, checked: 0, withoutForce: 0, defaulted: 0, defaultedExamples: [] });

/** Adds checked members to a tally (in place) and returns it. */
export function addToTally(tally: MemberTally, members: readonly MemberRecord[]): MemberTally {
  for (const m of members) {
    tally.candidates++;
    if (m.isTension) {
      tally.tension++;
      if (m.designCapacityN !== null) tally.checked++;
      if (m.designForceN === null) tally.withoutForce++;
    }
    if (m.detail.steel?.fromDefault) {
      tally.defaulted++;
      if (tally.defaultedExamples.length < 3) tally.defaultedExamples.push(m.globalId);
    }
  }
  return tally;
}

/** What a person needs to judge an import: what was found, checked, and not understood. */
export function summarise(model: ExtractedModel, tally: MemberTally, timings: Record<string, number>): RevisionSummary {
  const notSteel = model.members.filter((m) => m.notSteelReason).length;
  const warnings = [...model.warnings];
  if (notSteel) warnings.push({ code: 'member.not-steel', message: 'Elements exported as members that are not steel members (nuts, washers, anchors…) were left out.', count: notSteel, examples: model.members.filter((m) => m.notSteelReason).slice(0, 3).map((m) => `${m.globalId} ${m.objectType ?? m.name ?? ''}`.trim()) });
  if (tally.defaulted) warnings.push({ code: 'member.default-grade', message: "The steel grade was not recognised; the project's default grade was used.", count: tally.defaulted, examples: tally.defaultedExamples });
  return {
    schema: model.schemaIdentifier,
    lengthUnit: model.units.lengthUnitName,
    candidates: tally.candidates,
    tensionMembers: tally.tension,
    checked: tally.checked,
    withoutForce: tally.withoutForce,
    boltGroups: model.boltGroups.length,
    holes: model.members.reduce((n, m) => n + m.holes.length, 0),
    countsByClass: model.counts,
    warnings,
    timings: Object.fromEntries(Object.entries(timings).map(([k, v]) => [k, Math.round(v)])),
  };
}
