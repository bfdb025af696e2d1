/**
 * Bolt groups: IfcMechanicalFastener as one bolt or one group (one IfcMappedItem per bolt,
 * offsets in MappingTarget), and IFC2X3 IfcFastener written for bolts. Diameters come from
 * the occurrence, its type, Pset_MechanicalFastenerBolt or vendor properties, in that order.
 */
import * as W from 'web-ifc';
import { type Mat4, multiply, normalize, transformDir, transformPoint } from './mat4.ts';
import type { ModelContext } from './model-context.ts';
import { extrusion, mappedItem, representationItems, representations } from './body-geometry.ts';
import { axisPlacement, objectPlacement, pointMm, transformOperator } from './placements.ts';
import { findProperty, lengthMm, propertySetsOf } from './property-sets.ts';
import type { RelationsIndex } from './relations-index.ts';
import { enumValue, num, ref, refs, str } from './step-values.ts';
import type { ExtractedBoltGroup, Vec3 } from './types.ts';

const r2 = (v: number) => Math.round(v * 100) / 100 + 0; // + 0 turns -0 into 0

interface Piece {
  /** Frame of one bolt (world, mm). */
  m: Mat4;
  /** Box of its geometry in that frame, when faceted/extruded geometry exists. */
  box: { min: Vec3; max: Vec3 } | null;
  extrusionDir?: Vec3;
}

type ItemBox = { box: Piece['box']; extrusionDir?: Vec3 };

// Boxes by representation id, per read: bolts of one kind map one representation, and its box
// (in its own frame) is the same for every bolt that maps it. Callers only read what they get.
const boxesOfRead = new WeakMap<ModelContext, Map<number, ItemBox>>();

function itemBox(ctx: ModelContext, repId: number | undefined): ItemBox {
  if (repId === undefined) return itemBoxOf(ctx, repId);
  let boxes = boxesOfRead.get(ctx);
  if (!boxes) boxesOfRead.set(ctx, (boxes = new Map()));
  let found = boxes.get(repId);
  if (!found) boxes.set(repId, (found = itemBoxOf(ctx, repId)));
  return found;
}

function itemBoxOf(ctx: ModelContext, repId: number | undefined): ItemBox {
  let box: Piece['box'] = null;
  let extrusionDir: Vec3 | undefined;
  const grow = (p: Vec3) => {
    if (!box) box = { min: [...p] as Vec3, max: [...p] as Vec3 };
    else for (let i = 0; i < 3; i++) {
      box.min[i] = Math.min(box.min[i], p[i]);
      box.max[i] = Math.max(box.max[i], p[i]);
    }
  };
  let budget = 4000;
  for (const it of representationItems(ctx, repId)) {
    const cls = ctx.classUpper(it);
    if (cls === 'IFCEXTRUDEDAREASOLID') {
      const e = extrusion(ctx, it);
      if (!e) continue;
      const pos = axisPlacement(ctx, e.position);
      const d = numListDir(ctx, e.direction);
      const depth = ctx.mm(e.depth) ?? 0;
      grow(transformPoint(pos, [0, 0, 0]));
      grow(transformPoint(pos, [d[0] * depth, d[1] * depth, d[2] * depth]));
      extrusionDir = normalize(transformDir(pos, d));
    } else if (cls === 'IFCFACETEDBREP') {
      const l = ctx.line(it);
      for (const f of refs(ctx.line(ref(l?.Outer))?.CfsFaces)) for (const b of refs(ctx.line(f)?.Bounds)) for (const p of refs(ctx.line(ref(ctx.line(b)?.Bound))?.Polygon)) {
        if (budget-- > 0) grow(pointMm(ctx, p));
      }
    }
  }
  return { box, extrusionDir };
}

function numListDir(ctx: ModelContext, id: number | undefined): Vec3 {
  const d = (ctx.line(id)?.DirectionRatios ?? [0, 0, 1]).map((v: unknown) => num(v) ?? 0);
  return normalize([d[0] ?? 0, d[1] ?? 0, d[2] ?? 1]);
}

function pieces(ctx: ModelContext, placement: Mat4, shapeId: number | undefined): Piece[] {
  // Representations with their ids: the line cache is small, so a line read again may be another object.
  const reps = representations(ctx, shapeId);
  const bodyRep = reps.find((r) => r.ident === 'body') ?? reps[0];
  if (!bodyRep) return [];
  const mapped = bodyRep.items.filter((i) => ctx.isA(i, 'IfcMappedItem'));
  if (mapped.length > 0) {
    return mapped.map((i) => {
      const { target, origin, representation } = mappedItem(ctx, i);
      const m = multiply(placement, multiply(transformOperator(ctx, target), axisPlacement(ctx, origin)));
      return { m, ...itemBox(ctx, representation) };
    });
  }
  return [{ m: placement, ...itemBox(ctx, bodyRep.id) }];
}

/**
 * The shank direction in a piece's frame. IFC says local z; some exports model the bolt along
 * another local axis, so the geometry's extent closest to the nominal length decides when known.
 */
function shankAxis(p: Piece, nominalLength: number | null): number {
  if (p.extrusionDir) return -1;
  if (!p.box) return 2;
  const ext = [0, 1, 2].map((i) => p.box!.max[i] - p.box!.min[i]);
  if (nominalLength) {
    const diffs = ext.map((e) => Math.abs(e - nominalLength));
    return diffs.indexOf(Math.min(...diffs));
  }
  return ext.indexOf(Math.max(...ext));
}

export interface BoltWork {
  group: ExtractedBoltGroup;
  /** Half the shank length used for the geometric association, mm. */
  halfLength: number;
  slot?: { x: number; y: number };
}

export function fastenerIds(ctx: ModelContext): number[] {
  const ids = new Set(ctx.idsOfType(W.IFCMECHANICALFASTENER, true));
  if (ctx.schema === 'IFC2X3') {
    // IFC2X3 IfcFastener also covers welds; keep only the bolt-like ones.
    for (const id of ctx.idsOfType(W.IFCFASTENER, true)) {
      const l = ctx.line(id);
      const text = `${str(l?.Name) ?? ''} ${str(l?.ObjectType) ?? ''}`;
      if (/bolt|bout|schraube|screw|anchor/i.test(text) && !/weld|las/i.test(text)) ids.add(id);
    }
  }
  return [...ids].sort((a, b) => a - b);
}

export function extractBoltGroup(ctx: ModelContext, ix: RelationsIndex, id: number): BoltWork | null {
  const l = ctx.line(id);
  if (!l) return null;
  const type = ctx.line(ix.typeOf.get(id));
  const pt = enumValue(l.PredefinedType) ?? enumValue(type?.PredefinedType);
  if (pt && !['BOLT', 'ANCHORBOLT', 'USERDEFINED', 'NOTDEFINED', 'SCREW', 'RIVET'].includes(pt)) return null;
  const globalId = str(l.GlobalId) ?? `#${id}`;
  const psets = propertySetsOf(ctx, ix, id);
  const diameter = ctx.mm(num(l.NominalDiameter)) ?? ctx.mm(num(type?.NominalDiameter)) ?? lengthMm(ctx, findProperty(psets, ['ThreadDiameter', 'Bolt size', 'BoltDiameter', 'Bolt diameter', 'NominalDiameter']));
  const length = ctx.mm(num(l.NominalLength)) ?? ctx.mm(num(type?.NominalLength)) ?? lengthMm(ctx, findProperty(psets, ['Bolt length', 'BoltLength', 'ThreadLength', 'NominalLength']));
  const holeDiameter = lengthMm(ctx, findProperty(psets, ['Bolt hole diameter', 'BoltHoleDiameter', 'HoleDiameter', 'Hole diameter']));
  const gradeProp = findProperty(psets, ['BoltGrade', 'Bolt grade', 'Grade', 'Property class', 'PropertyClass']);
  const countProp = findProperty(psets, ['Bolt count', 'BoltCount', 'NumberOfBolts']);

  const placement = objectPlacement(ctx, ref(l.ObjectPlacement));
  const ps = pieces(ctx, placement, ref(l.Representation));
  const positions: Vec3[] = [];
  let axis: Vec3 = normalize(transformDir(placement, [0, 0, 1]));
  ps.forEach((p, i) => {
    const k = shankAxis(p, length ?? null);
    const centreLocal: Vec3 = p.box ? [(p.box.min[0] + p.box.max[0]) / 2, (p.box.min[1] + p.box.max[1]) / 2, (p.box.min[2] + p.box.max[2]) / 2] : [0, 0, 0];
    positions.push(transformPoint(p.m, centreLocal).map(r2) as Vec3);
    if (i === 0) {
      const local: Vec3 = k === -1 ? p.extrusionDir! : [k === 0 ? 1 : 0, k === 1 ? 1 : 0, k === 2 ? 1 : 0];
      axis = normalize(transformDir(p.m, local));
    }
  });
  const mappedCount = ps.length > 1 || (ps.length === 1 && ps[0].m !== placement) ? ps.length : 0;
  const propCount = typeof countProp?.value === 'number' ? countProp.value : undefined;
  if (propCount !== undefined && mappedCount > 0 && propCount !== mappedCount) {
    ctx.warnings.add('bolt.count-mismatch', "A bolt group's count property differs from the number of bolts modelled; the modelled bolts are used.", globalId);
  }
  const boltCount = mappedCount > 0 ? mappedCount : propCount ?? 1;
  const group: ExtractedBoltGroup = {
    globalId, expressId: id, ifcClass: ctx.className(id), name: str(l.Name),
    nominalDiameter: diameter === undefined ? null : r2(diameter), nominalLength: length === undefined ? null : r2(length),
    boltCount, positions, axis: axis.map((v) => Math.round(v * 1e6) / 1e6) as Vec3,
    memberGlobalIds: [], associatedBy: 'none',
    countSource: mappedCount > 0 ? 'mapped-items' : propCount !== undefined ? 'property' : 'single',
  };
  if (holeDiameter !== undefined) group.holeDiameter = r2(holeDiameter);
  if (gradeProp && gradeProp.value !== null) group.grade = String(gradeProp.value);
  if (diameter === undefined) ctx.warnings.add('bolt.no-diameter', 'A bolt group has no diameter.', globalId);
  const sx = lengthMm(ctx, findProperty(psets, ['Slotted hole x']));
  const sy = lengthMm(ctx, findProperty(psets, ['Slotted hole y']));
  const work: BoltWork = { group, halfLength: Math.max((length ?? 0) / 2, 15) };
  if ((sx ?? 0) > 0 || (sy ?? 0) > 0) work.slot = { x: sx ?? 0, y: sy ?? 0 };
  return work;
}
