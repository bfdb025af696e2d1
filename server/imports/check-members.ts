import { locateOnStrip, identifyGrade, type CheckResult, type MemberCheckInputRaw } from '@shared/engine';
import type { StandardId } from '@shared/api/projects';
import type { MemberDetail, MemberEndDetail, StripHole } from '@shared/api/member-detail';
import { bandOf, type ResultBand } from '@shared/api/results';
import { designForceFrom } from '@shared/forces/design-force';
import type { ExtractedHole, ExtractedMember, ExtractedModel } from '../ifc/types';
import { CapacityChecks, type EndChecks } from './capacity-checks';

export interface CheckSettings {
  standard: StandardId;
  defaultGrade: string;
  /** Forces from an engineer's forces table by GlobalId (N, tension positive); they beat the model's. */
  tableForces?: Map<string, { loadCase: string; axialN: number }[]>;
}

/** One member ready to store: summary columns, detail JSON, forces, and the governing result. */
export interface MemberRecord {
  globalId: string;
  name: string | null;
  tag: string | null;
  ifcClass: string;
  storey: string | null;
  assembly: string | null;
  profileName: string | null;
  gradeName: string | null;
  lengthMm: number | null;
  isTension: boolean;
  holeCount: number;
  designForceN: number | null;
  forceSource: string | null;
  netAreaMm2: number | null;
  designCapacityN: number | null;
  utilisation: number | null;
  governing: string | null;
  band: ResultBand;
  warningCount: number;
  detail: MemberDetail;
  forces: { loadCase: string; axialN: number; source: string }[];
  result: CheckResult | null;
}

const DEFAULT_BOLT_GRADE: Record<StandardId, string> = { as4100: '8.8', en1993: '8.8', 'aisc360-lrfd': 'A325', 'aisc360-asd': 'A325' };

function engineStandard(s: StandardId): Pick<MemberCheckInputRaw, 'standard' | 'method'> {
  if (s === 'aisc360-lrfd') return { standard: 'aisc360', method: 'lrfd' };
  if (s === 'aisc360-asd') return { standard: 'aisc360', method: 'asd' };
  return { standard: s };
}

/** Splits holes into the two member ends (x measured from that end) and places them on the developed strip. */
function endsOf(m: ExtractedMember, warnings: string[]): Omit<MemberEndDetail, 'designCapacity' | 'governing' | 'boltGrade'>[] {
  const section = m.profile.section;
  if (!section || !m.holes.length) return [];
  const length = m.length ?? Math.max(...m.holes.map((h) => h.x)) * 2;
  const byEnd: Record<'start' | 'end', ExtractedHole[]> = { start: [], end: [] };
  for (const h of m.holes) byEnd[h.x <= length / 2 ? 'start' : 'end'].push(h);
  const ends = [];
  for (const end of ['start', 'end'] as const) {
    const holes: StripHole[] = [];
    for (const h of byEnd[end]) {
      const at = locateOnStrip(section, { u: h.u, v: h.v }, 1.0);
      if (!at) {
        warnings.push(`A hole at x = ${h.x.toFixed(0)} mm (u ${h.u.toFixed(1)}, v ${h.v.toFixed(1)}) is not on the section's material; it was left out.`);
        continue;
      }
      holes.push({
        x: end === 'start' ? h.x : length - h.x,
        y: at.y,
        d: h.slot ? h.slot.width : h.diameter,
        t: h.thickness ?? at.t,
        element: at.element,
        source: h.source,
        featureGlobalId: h.featureGlobalId,
      });
    }
    if (!holes.length) continue;
    const withBolt = byEnd[end].find((h) => h.boltDiameter);
    ends.push({ end, holes, boltDiameter: withBolt?.boltDiameter ?? null, boltGroupGlobalId: withBolt?.boltGroupGlobalId ?? null });
  }
  return ends;
}

function steelSpec(m: ExtractedMember, settings: CheckSettings, warnings: string[]): { spec: MemberCheckInputRaw['steel']; fromDefault: boolean } {
  const mat = m.material;
  if (mat?.yieldStress && mat.ultimateStress) return { spec: { fy: mat.yieldStress, fu: mat.ultimateStress }, fromDefault: false };
  if (mat?.name && identifyGrade(mat.name)) return { spec: { grade: mat.name }, fromDefault: false };
  warnings.push(mat?.name
    ? `The material "${mat.name}" is not a steel grade Gaugeline knows; the project's default grade ${settings.defaultGrade} was used.`
    : `No material is given; the project's default grade ${settings.defaultGrade} was used.`);
  return { spec: { grade: settings.defaultGrade }, fromDefault: true };
}

/**
 * Checks one extracted member to the project's standard; never throws for bad data, it warns.
 * `checks` answers ends already checked in this import with the same input.
 */
export function checkExtractedMember(m: ExtractedMember, settings: CheckSettings, boltGrades: Map<string, string>, checks: EndChecks = new CapacityChecks()): MemberRecord {
  const warnings: string[] = [];
  const ends = endsOf(m, warnings);
  const forces = [
    ...m.forces.map((f) => ({ loadCase: f.loadCase, axialN: f.axialForce, source: f.source as string })),
    ...(settings.tableForces?.get(m.globalId) ?? []).map((f) => ({ ...f, source: 'forces-csv' })),
  ];
  const { force, source } = designForceFrom(forces);
  const isTension = m.isTensionCandidate || (force !== null && force > 0);
  const { spec, fromDefault } = steelSpec(m, settings, warnings);
  const section = m.profile.section;
  if (!section) warnings.push(`The section "${m.profile.name ?? 'unnamed'}" could not be understood, so the member was not checked.`);

  let best: { result: CheckResult; input: MemberCheckInputRaw; end: number } | null = null;
  const endDetails: MemberEndDetail[] = [];
  // Every member with a section is checked (a forces file may later put any of them in
  // tension); whether it counts as a tension member only decides how it is listed.
  if (section) {
    const cases = ends.length ? ends : [null];
    cases.forEach((end, index) => {
      const boltGrade = end?.boltGroupGlobalId ? boltGrades.get(end.boltGroupGlobalId) : undefined;
      const input: MemberCheckInputRaw = {
        ...engineStandard(settings.standard),
        section,
        grossArea: m.profile.areaFromModel,
        steel: spec,
        holes: end ? end.holes.map((h) => ({ x: h.x, y: h.y, ...(h.d ? { d: h.d } : {}) })) : [],
        bolts: end?.boltDiameter ? { diameter: end.boltDiameter, grade: boltGrade ?? DEFAULT_BOLT_GRADE[settings.standard], count: end.holes.length } : undefined,
        force,
      };
      try {
        const result = checks.check(input);
        endDetails.push({ ...(end ?? { end: 'start', holes: [], boltDiameter: null, boltGroupGlobalId: null }), boltGrade: input.bolts?.grade ?? null, designCapacity: result.designCapacity, governing: result.governing });
        if (!best || result.designCapacity < best.result.designCapacity) best = { result, input, end: index };
      } catch (err) {
        warnings.push(`The ${end?.end ?? 'member'} end could not be checked: ${(err as Error).message}`);
        if (end) endDetails.push({ ...end, boltGrade: null, designCapacity: null, governing: null });
      }
    });
  }
  if (isTension && force === null) warnings.push(forces.length ? 'No load case puts this member in tension.' : 'No design force is known for this member.');

  const result: CheckResult | null = (best as { result: CheckResult } | null)?.result ?? null;
  const steel = result ? steelFromAssumptions(result, spec, fromDefault) : null;
  const detail: MemberDetail = {
    objectType: m.objectType,
    predefinedType: m.predefinedType,
    assemblyGlobalId: m.assembly?.globalId ?? null,
    profile: { name: m.profile.name, section: m.profile.section, source: m.profile.source, areaFromModel: m.profile.areaFromModel },
    material: m.material ? { name: m.material.name, source: m.material.source, strengthSource: m.material.strengthSource, fy: m.material.yieldStress, fu: m.material.ultimateStress } : null,
    steel,
    tensionSignals: m.tensionSignals,
    axis: m.axis,
    ends: endDetails,
    checkInput: (best as { input: MemberCheckInputRaw } | null)?.input ?? null,
    warnings: [...warnings, ...(result?.warnings ?? [])],
  };
  const utilisation = result?.utilisation ?? null;
  return {
    globalId: m.globalId,
    name: m.name,
    tag: m.tag,
    ifcClass: m.ifcClass,
    storey: m.storey,
    assembly: m.assembly?.name ?? null,
    profileName: m.profile.name,
    gradeName: m.material?.name ?? null,
    lengthMm: m.length,
    isTension,
    holeCount: m.holes.length,
    designForceN: force,
    forceSource: source,
    netAreaMm2: result?.netArea ?? null,
    designCapacityN: result?.designCapacity ?? null,
    utilisation,
    governing: result?.governing ?? null,
    band: bandOf(utilisation),
    warningCount: detail.warnings.length,
    detail,
    forces,
    result,
  };
}

/** The fy/fu the engine used (its assumptions `fy` and `fu`) with their source. */
function steelFromAssumptions(result: CheckResult, spec: MemberCheckInputRaw['steel'], fromDefault: boolean): MemberDetail['steel'] {
  const fy = result.assumptions.find((a) => a.name === 'fy');
  const fu = result.assumptions.find((a) => a.name === 'fu');
  if (!fy || !fu) return null;
  return { grade: spec.grade ?? 'stated fy/fu', fy: Number(fy.value), fu: Number(fu.value), source: fy.source, fromDefault };
}

/** The members to check: steel candidates, each GlobalId once. Members flagged as not steel (nuts, washers, anchors) are left out. */
function steelCandidates(model: ExtractedModel): ExtractedMember[] {
  const seen = new Set<string>();
  const duplicates: string[] = [];
  // GlobalIds must be unique, but real exports sometimes repeat one; keep the first and say so.
  const candidates = model.members.filter((m) => {
    if (m.notSteelReason) return false;
    if (seen.has(m.globalId)) return duplicates.push(`${m.globalId} ${m.name ?? ''}`.trim()) && false;
    seen.add(m.globalId);
    return true;
  });
  if (duplicates.length) {
    model.warnings.push({ code: 'member.duplicate-globalid', message: 'Several elements share one GlobalId; only the first of each was kept.', count: duplicates.length, examples: duplicates.slice(0, 3) });
  }
  return candidates;
}

const boltGradesOf = (model: ExtractedModel) => new Map(model.boltGroups.filter((b) => b.grade).map((b) => [b.globalId, b.grade!]));

/** Checks every steel candidate of a model. */
export function checkModel(model: ExtractedModel, settings: CheckSettings, onProgress?: (fraction: number) => void, checks: EndChecks = new CapacityChecks()): MemberRecord[] {
  const boltGrades = boltGradesOf(model);
  const candidates = steelCandidates(model);
  const records: MemberRecord[] = [];
  candidates.forEach((m, i) => {
    records.push(checkExtractedMember(m, settings, boltGrades, checks));
    if (onProgress && i % 250 === 0) onProgress(i / candidates.length);
  });
  return records;
}

/**
 * The same checks as checkModel, handed over in slices of `size` members as they are done;
 * the next slice waits for `onSlice` to finish, so a slow consumer bounds what is held.
 * `fraction` is the share of members checked so far.
 */
export async function checkModelInSlices(
  model: ExtractedModel,
  settings: CheckSettings,
  size: number,
  onSlice: (records: MemberRecord[], fraction: number) => Promise<void> | void,
  checks: EndChecks = new CapacityChecks(),
): Promise<void> {
  const boltGrades = boltGradesOf(model);
  const candidates = steelCandidates(model);
  for (let from = 0; from < candidates.length; from += size) {
    const slice = candidates.slice(from, from + size).map((m) => checkExtractedMember(m, settings, boltGrades, checks));
    await onSlice(slice, Math.min(1, (from + size) / candidates.length));
  }
}
