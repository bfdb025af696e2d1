/**
 * One structural member candidate (IfcMember, IfcBeam, IfcColumn, IfcPlate and subtypes) →
 * ExtractedMember, plus the frame kept internally for bolt association.
 */
import { readBody } from './body-geometry.ts';
import { readMemberForces } from './forces.ts';
import { extractHoles } from './holes.ts';
import { buildMemberFrame, type MemberFrame } from './member-frame.ts';
import { materialOf } from './materials.ts';
import type { ModelContext } from './model-context.ts';
import { objectPlacement } from './placements.ts';
import { readProfile } from './profiles.ts';
import { findProperty, propertySetsOf, readPropertyContainer, readPropertyContainers } from './property-sets.ts';
import type { RelationsIndex } from './relations-index.ts';
import { enumValue, num, ref, str } from './step-values.ts';
import { tensionSignals } from './tension-signals.ts';
import { parseSectionName } from '../../shared/catalogue/index.ts';
import type { ExtractedMember, ForcePsetSpec, ProfileInfo } from './types.ts';

export interface MemberWork {
  member: ExtractedMember;
  frame: MemberFrame;
}

const r2 = (v: number) => Math.round(v * 100) / 100 + 0; // + 0 turns -0 into 0
const round3 = (v: [number, number, number]): [number, number, number] => [r2(v[0]), r2(v[1]), r2(v[2])];

function usefulEnum(x: unknown): string | null {
  const v = enumValue(x);
  return v && v !== 'NOTDEFINED' ? v : null;
}

export function storeyOf(ctx: ModelContext, ix: RelationsIndex, id: number): string | null {
  let cur: number | undefined = id;
  for (let i = 0; i < 8 && cur !== undefined; i++) {
    const s = ix.containedIn.get(cur);
    if (s !== undefined) return str(ctx.line(s)?.Name) ?? str(ctx.line(s)?.GlobalId);
    cur = ix.parentOf.get(cur);
  }
  return null;
}

function profileInfo(ctx: ModelContext, ix: RelationsIndex, frame: MemberFrame, setProfileId: number | undefined, names: (string | null)[]): ProfileInfo {
  let info: ProfileInfo | null = null;
  let profileId: number | undefined;
  if (setProfileId !== undefined) {
    const p = readProfile(ctx, setProfileId);
    if (p?.geometry.section) {
      info = { name: p.geometry.name, section: p.geometry.section, source: 'material-profile-set' };
      profileId = setProfileId;
    }
  }
  if (!info && frame.profileFrom === 'swept-area' && frame.profile?.section) {
    info = { name: frame.profile.name, section: frame.profile.section, source: 'swept-area' };
  }
  if (!info) {
    for (const n of [frame.profile?.name ?? null, ...names]) {
      const section = parseSectionName(n);
      if (section) {
        // The frame may have fitted the named section to the body (flats); prefer that.
        info = { name: n, section: frame.profile?.section && frame.profile.name === n ? frame.profile.section : section, source: 'catalogue-name' };
        break;
      }
    }
  }
  info ??= { name: frame.profile?.name ?? names.find((n) => n) ?? null, section: null, source: 'none' };
  // Stated area: IFC4 Pset_ProfileMechanical on the profile definition.
  for (const pid of ix.profileDefProperties.get(profileId ?? -1) ?? []) {
    const c = readPropertyContainer(ctx, pid);
    const a = c?.props.get('CrossSectionArea');
    if (a && typeof a.value === 'number') info.areaFromModel = r2(a.value * ctx.units.areaToMm2);
  }
  return info;
}

/** IFC2X3: IfcStructuralProfileProperties through IfcRelAssociatesProfileProperties. */
function ifc2x3ProfileProperties(ctx: ModelContext, ix: RelationsIndex, id: number): ProfileInfo | null {
  for (const ppId of ix.profileProperties.get(id) ?? []) {
    const pp = ctx.line(ppId);
    const p = readProfile(ctx, ref(pp?.ProfileDefinition));
    const area = num(pp?.CrossSectionArea);
    const name = str(pp?.ProfileName) ?? p?.geometry.name ?? null;
    const section = p?.geometry.section ?? parseSectionName(name);
    if (section || area !== undefined) {
      const info: ProfileInfo = { name, section, source: 'ifc2x3-profile-properties' };
      if (area !== undefined) info.areaFromModel = r2(area * ctx.units.areaToMm2);
      return info;
    }
  }
  return null;
}

export function extractMember(ctx: ModelContext, ix: RelationsIndex, id: number, forceSpecs: ForcePsetSpec[]): MemberWork | null {
  const l = ctx.line(id);
  if (!l) return null;
  const ifcClass = ctx.className(id);
  const globalId = str(l.GlobalId) ?? `#${id}`;
  const name = str(l.Name);
  const objectType = str(l.ObjectType);
  const typeId = ix.typeOf.get(id);
  const type = ctx.line(typeId);
  const predefinedType = usefulEnum(l.PredefinedType) ?? usefulEnum(type?.PredefinedType);
  // The element's own sets are read once: for the merged view here and, per set, for the forces.
  const ownSets = readPropertyContainers(ctx, ix.psets.get(id));
  const psets = propertySetsOf(ctx, ix, id, ownSets);
  const parentId = ix.parentOf.get(id);
  const parent = ctx.isA(parentId, 'IfcElementAssembly') ? ctx.line(parentId) : null;
  const assembly = parent ? { globalId: str(parent.GlobalId) ?? `#${parentId}`, name: str(parent.Name), predefinedType: usefulEnum(parent.PredefinedType) } : null;

  const placement = objectPlacement(ctx, ref(l.ObjectPlacement));
  const body = readBody(ctx, ref(l.Representation));
  const profileProp = findProperty(psets, ['Profile', 'ProfileName', 'Section']);
  const nameCandidates = [typeof profileProp?.value === 'string' ? profileProp.value : null, objectType, name, str(type?.Name)];
  const frame = buildMemberFrame(ctx, placement, body, nameCandidates.find((n) => parseSectionName(n)) ?? objectType ?? name);
  const mat = materialOf(ctx, ix, id, psets);
  const profile = (ctx.schema === 'IFC2X3' && frame.profileFrom !== 'swept-area' ? ifc2x3ProfileProperties(ctx, ix, id) : null) ?? profileInfo(ctx, ix, frame, mat.profileId, nameCandidates);

  const holes = extractHoles(ctx, ix, id, placement, body, frame, globalId);
  const analysisTypes = (ix.productLinks.get(id) ?? []).filter((a) => ctx.isA(a, 'IfcStructuralCurveMember')).map((a) => enumValue(ctx.line(a)?.PredefinedType) ?? '');
  const sig = tensionSignals({
    ifcClass, name, objectType, typeName: str(type?.Name), predefinedType, profileName: profile.name, section: profile.section,
    length: frame.length, materialName: mat.material?.name ?? null, assemblyType: assembly?.predefinedType ?? null, analysisTypes,
  });

  if (!sig.notSteelReason) {
    if (profile.source === 'none') ctx.warnings.add('member.no-profile', 'No section could be read or recognised for a member.', `${globalId} (${name ?? ifcClass})`);
    if (!mat.material) ctx.warnings.add('member.no-material', 'A member has no material.', globalId);
    if (frame.axisSource === 'none') ctx.warnings.add('member.no-geometry', 'A member has no body or axis that could be read without meshing.', globalId);
  }
  const member: ExtractedMember = {
    globalId, expressId: id, ifcClass, name, tag: str(l.Tag), objectType, predefinedType,
    storey: storeyOf(ctx, ix, id), assembly, profile, material: mat.material,
    length: frame.length === null ? null : r2(frame.length),
    axis: frame.axis ? { start: round3(frame.axis.start), end: round3(frame.axis.end) } : null,
    axisSource: frame.axisSource,
    tensionSignals: sig.signals, isTensionCandidate: sig.candidate,
    holes, forces: readMemberForces(ctx, ix, id, forceSpecs, ownSets),
  };
  if (sig.notSteelReason) member.notSteelReason = sig.notSteelReason;
  return { member, frame };
}
