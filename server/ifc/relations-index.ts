/**
 * Scans each relationship class once and builds lookup maps. Asking web-ifc for inverse
 * attributes per element is much slower on large files and differs between schemas
 * (IFC2X3 types hang off IsDefinedBy, IFC4 off IsTypedBy); one pass over the relations
 * works the same for all three schemas.
 */
import * as W from 'web-ifc';
import type { ModelContext } from './model-context.ts';
import { ref, refs } from './step-values.ts';

export interface RelationsIndex {
  /** element or type → property set / quantity ids */
  psets: Map<number, number[]>;
  /** occurrence → type object */
  typeOf: Map<number, number>;
  /** element or type → material select ids */
  materials: Map<number, number[]>;
  /** element → spatial structure element */
  containedIn: Map<number, number>;
  /** part → whole (IfcRelAggregates, IfcRelNests) */
  parentOf: Map<number, number>;
  /** whole → parts */
  partsOf: Map<number, number[]>;
  /** host element → opening / voiding feature ids */
  openings: Map<number, number[]>;
  /** realizing element (bolt, weld) → connected elements */
  realizes: Map<number, number[]>;
  /** both directions of IfcRelAssignsToProduct (and IFC2X3 IfcRelConnectsStructuralElement) */
  productLinks: Map<number, number[]>;
  /** structural member → structural activities (actions, reactions) */
  activities: Map<number, number[]>;
  /** object → groups it is assigned to */
  groupsOf: Map<number, number[]>;
  /** IFC2X3: element → IfcStructuralProfileProperties / IfcProfileProperties */
  profileProperties: Map<number, number[]>;
  /** material → IfcMaterialProperties / IFC2X3 material property entities */
  materialProperties: Map<number, number[]>;
  /** profile def → IfcProfileProperties (IFC4+) */
  profileDefProperties: Map<number, number[]>;
}

const DEFINES_BY_PROPERTIES = new TextEncoder().encode('IFCRELDEFINESBYPROPERTIES');
const ASSOCIATES_MATERIAL = new TextEncoder().encode('IFCRELASSOCIATESMATERIAL');
const VOIDS_ELEMENT = new TextEncoder().encode('IFCRELVOIDSELEMENT');

function push(map: Map<number, number[]>, key: number | undefined, value: number | undefined): void {
  if (key === undefined || value === undefined) return;
  const list = map.get(key);
  if (list) {
    if (!list.includes(value)) list.push(value);
  } else map.set(key, [value]);
}

/**
 * `scope` 'properties': only property sets and type objects (psets, typeOf) — what reading bolt
 * groups asks of the index (bolt-groups-read.ts); the other maps stay empty.
 */
export function buildRelationsIndex(ctx: ModelContext, scope: 'all' | 'properties' = 'all'): RelationsIndex {
  const ix: RelationsIndex = {
    psets: new Map(), typeOf: new Map(), materials: new Map(), containedIn: new Map(),
    parentOf: new Map(), partsOf: new Map(), openings: new Map(), realizes: new Map(),
    productLinks: new Map(), activities: new Map(), groupsOf: new Map(),
    profileProperties: new Map(), materialProperties: new Map(), profileDefProperties: new Map(),
  };

  // The three most numerous relationships are read for their references only (refsAt).
  for (const id of ctx.idsOfType(W.IFCRELDEFINESBYPROPERTIES)) {
    // IFC4 allows an IfcPropertySetDefinitionSet (a list) here; web-ifc 0.0.78 reads it as one
    // reference without an id, so such a set gives nothing either way.
    const defs = ctx.refsAt(id, DEFINES_BY_PROPERTIES, 5, 'RelatingPropertyDefinition', true);
    for (const o of ctx.refsAt(id, DEFINES_BY_PROPERTIES, 4, 'RelatedObjects')) for (const d of defs) push(ix.psets, o, d);
  }
  for (const id of ctx.idsOfType(W.IFCRELDEFINESBYTYPE)) {
    const r = ctx.line(id);
    const t = ref(r?.RelatingType);
    for (const o of refs(r?.RelatedObjects)) if (t !== undefined) ix.typeOf.set(o, t);
  }
  // Type objects carry their own property sets in HasPropertySets.
  for (const typeId of new Set(ix.typeOf.values())) {
    for (const p of refs(ctx.line(typeId)?.HasPropertySets)) push(ix.psets, typeId, p);
  }
  if (scope === 'properties') return ix;
  for (const id of ctx.idsOfType(W.IFCRELASSOCIATESMATERIAL)) {
    const material = ctx.refAt(id, ASSOCIATES_MATERIAL, 5, 'RelatingMaterial');
    for (const o of ctx.refsAt(id, ASSOCIATES_MATERIAL, 4, 'RelatedObjects')) push(ix.materials, o, material);
  }
  for (const id of ctx.idsOfType(W.IFCRELCONTAINEDINSPATIALSTRUCTURE)) {
    const r = ctx.line(id);
    const s = ref(r?.RelatingStructure);
    for (const o of refs(r?.RelatedElements)) if (s !== undefined) ix.containedIn.set(o, s);
  }
  for (const cls of [W.IFCRELAGGREGATES, W.IFCRELNESTS]) {
    for (const id of ctx.idsOfType(cls)) {
      const r = ctx.line(id);
      const whole = ref(r?.RelatingObject);
      for (const o of refs(r?.RelatedObjects)) {
        if (whole === undefined) continue;
        if (!ix.parentOf.has(o)) ix.parentOf.set(o, whole);
        push(ix.partsOf, whole, o);
      }
    }
  }
  for (const id of ctx.idsOfType(W.IFCRELVOIDSELEMENT)) {
    // Both references in one pass over the line where the text allows; else each as refAt reads it.
    const pair = ctx.refsFromTextAt(id, VOIDS_ELEMENT, 4, 2);
    if (pair) push(ix.openings, pair[0], pair[1]);
    else push(ix.openings, ctx.refAt(id, VOIDS_ELEMENT, 4, 'RelatingBuildingElement'), ctx.refAt(id, VOIDS_ELEMENT, 5, 'RelatedOpeningElement'));
  }
  for (const id of ctx.idsOfType(W.IFCRELCONNECTSWITHREALIZINGELEMENTS)) {
    const r = ctx.line(id);
    for (const b of refs(r?.RealizingElements)) {
      push(ix.realizes, b, ref(r?.RelatingElement));
      push(ix.realizes, b, ref(r?.RelatedElement));
    }
  }
  // Product assignment is written in both directions in real files: link both ways.
  for (const id of ctx.idsOfType(W.IFCRELASSIGNSTOPRODUCT)) {
    const r = ctx.line(id);
    const p = ref(r?.RelatingProduct);
    for (const o of refs(r?.RelatedObjects)) {
      push(ix.productLinks, p, o);
      push(ix.productLinks, o, p);
    }
  }
  if (ctx.schema === 'IFC2X3') {
    for (const id of ctx.idsOfType(W.IFCRELCONNECTSSTRUCTURALELEMENT)) {
      const r = ctx.line(id);
      push(ix.productLinks, ref(r?.RelatingElement), ref(r?.RelatedStructuralMember));
      push(ix.productLinks, ref(r?.RelatedStructuralMember), ref(r?.RelatingElement));
    }
    for (const id of ctx.idsOfType(W.IFCRELASSOCIATESPROFILEPROPERTIES)) {
      const r = ctx.line(id);
      for (const o of refs(r?.RelatedObjects)) push(ix.profileProperties, o, ref(r?.RelatingProfileProperties));
    }
    for (const id of ctx.idsOfType(W.IFCMECHANICALSTEELMATERIALPROPERTIES)) {
      push(ix.materialProperties, ref(ctx.line(id)?.Material), id);
    }
  } else {
    for (const id of ctx.idsOfType(W.IFCMATERIALPROPERTIES)) {
      push(ix.materialProperties, ref(ctx.line(id)?.Material), id);
    }
    for (const id of ctx.idsOfType(W.IFCPROFILEPROPERTIES)) {
      push(ix.profileDefProperties, ref(ctx.line(id)?.ProfileDefinition), id);
    }
  }
  for (const id of ctx.idsOfType(W.IFCRELCONNECTSSTRUCTURALACTIVITY)) {
    const r = ctx.line(id);
    push(ix.activities, ref(r?.RelatingElement), ref(r?.RelatedStructuralActivity));
  }
  for (const id of ctx.idsOfType(W.IFCRELASSIGNSTOGROUP, true)) {
    const r = ctx.line(id);
    const g = ref(r?.RelatingGroup);
    for (const o of refs(r?.RelatedObjects)) push(ix.groupsOf, o, g);
  }
  return ix;
}
