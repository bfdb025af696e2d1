/**
 * Material and profile-set lookup. IFC4 puts IfcMaterialProfileSetUsage on the occurrence and
 * the profile set on the type; IFC2X3 only has IfcMaterial / IfcMaterialList. Occurrence
 * associations win over the type's.
 */
import type { ModelContext } from './model-context.ts';
import { findProperty, type PropertySets, pressureMPa, readPropertyContainer } from './property-sets.ts';
import type { RelationsIndex } from './relations-index.ts';
import { num, ref, refs, str } from './step-values.ts';
import type { MaterialInfo, MaterialSource } from './types.ts';

export interface MaterialLookup {
  material: MaterialInfo | null;
  materialId?: number;
  /** IfcProfileDef from a material profile set, when there is one. */
  profileId?: number;
  cardinalPoint?: number;
}

/** The material `matId` names, found by way of `source`. */
function named(ctx: ModelContext, matId: number | undefined, source: MaterialSource, profileId?: number): MaterialLookup {
  const m = ctx.line(matId);
  const name = str(m?.Name);
  return { material: name ? { name, source } : null, materialId: name ? matId : undefined, profileId };
}

function resolve(ctx: ModelContext, id: number, depth = 0): MaterialLookup | null {
  const l = ctx.line(id);
  if (!l || depth > 4) return null;
  const cls = ctx.classUpper(id);
  switch (cls) {
    case 'IFCMATERIAL':
      return named(ctx, id, 'material');
    case 'IFCMATERIALPROFILESETUSAGE':
    case 'IFCMATERIALPROFILESETUSAGETAPERING': {
      const r = resolve(ctx, ref(l.ForProfileSet) ?? -1, depth + 1);
      return r ? { ...r, cardinalPoint: num(l.CardinalPoint) } : null;
    }
    case 'IFCMATERIALPROFILESET': {
      const first = refs(l.MaterialProfiles)[0];
      return first !== undefined ? resolve(ctx, first, depth + 1) : null;
    }
    case 'IFCMATERIALPROFILE':
    case 'IFCMATERIALPROFILEWITHOFFSETS':
      return named(ctx, ref(l.Material), 'material-profile-set', ref(l.Profile));
    case 'IFCMATERIALLIST':
      return named(ctx, refs(l.Materials)[0], 'material-list');
    case 'IFCMATERIALLAYERSETUSAGE':
      return resolve(ctx, ref(l.ForLayerSet) ?? -1, depth + 1);
    case 'IFCMATERIALLAYERSET': {
      const layer = ctx.line(refs(l.MaterialLayers)[0]);
      return named(ctx, ref(layer?.Material), 'material-layer-set');
    }
    case 'IFCMATERIALCONSTITUENTSET': {
      const c = ctx.line(refs(l.MaterialConstituents)[0]);
      return named(ctx, ref(c?.Material), 'material');
    }
    default:
      return null;
  }
}

function strengths(ctx: ModelContext, ix: RelationsIndex, materialId: number | undefined, info: MaterialInfo): void {
  for (const pid of ix.materialProperties.get(materialId ?? -1) ?? []) {
    const cls = ctx.classUpper(pid);
    if (cls === 'IFCMECHANICALSTEELMATERIALPROPERTIES') {
      const l = ctx.line(pid);
      const fy = num(l?.YieldStress);
      const fu = num(l?.UltimateStress);
      if (fy !== undefined) info.yieldStress = fy * ctx.units.pressureToMPa;
      if (fu !== undefined) info.ultimateStress = fu * ctx.units.pressureToMPa;
      if (fy !== undefined || fu !== undefined) info.strengthSource = 'ifc2x3-steel-properties';
      continue;
    }
    const c = readPropertyContainer(ctx, pid);
    if (!c) continue;
    const sets: PropertySets = new Map([[c.name, c.props]]);
    const fy = pressureMPa(ctx, findProperty(sets, ['YieldStress']));
    const fu = pressureMPa(ctx, findProperty(sets, ['UltimateStress']));
    if (fy !== undefined) info.yieldStress = fy;
    if (fu !== undefined) info.ultimateStress = fu;
    if ((fy !== undefined || fu !== undefined) && (c.name === 'Pset_MaterialSteel' || c.name === 'Pset_MaterialMechanical')) {
      info.strengthSource = c.name;
    }
  }
}

export function materialOf(ctx: ModelContext, ix: RelationsIndex, elementId: number, psets: PropertySets): MaterialLookup {
  const candidates = [...(ix.materials.get(elementId) ?? [])];
  const typeId = ix.typeOf.get(elementId);
  if (typeId !== undefined) candidates.push(...(ix.materials.get(typeId) ?? []));
  let best: MaterialLookup | null = null;
  for (const id of candidates) {
    const r = resolve(ctx, id);
    if (!r) continue;
    if (!best) best = r;
    else {
      // Keep the first material but take a profile from a later (e.g. type) association.
      if (!best.material && r.material) best = { ...r, profileId: best.profileId ?? r.profileId, cardinalPoint: best.cardinalPoint ?? r.cardinalPoint };
      if (best.profileId === undefined && r.profileId !== undefined) best.profileId = r.profileId;
    }
  }
  if (best?.material) {
    strengths(ctx, ix, best.materialId, best.material);
    return best;
  }
  // Vendor property ('Grade', 'Material') when no material is associated.
  const grade = findProperty(psets, ['Grade', 'Material', 'SteelGrade']);
  if (grade && typeof grade.value === 'string' && grade.value.trim()) {
    return { ...(best ?? {}), material: { name: grade.value.trim(), source: 'property' } };
  }
  return best ?? { material: null };
}
