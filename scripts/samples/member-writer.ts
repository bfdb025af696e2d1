/**
 * Writes authored members into an IfcBuilder: extruded body, material (profile set in IFC4),
 * holes as IfcOpeningElement + IfcRelVoidsElement or as boolean cuts, bolt groups as
 * IfcMechanicalFastener (mapped items or one per bolt), design forces as property sets.
 */
import type { Handle } from 'web-ifc';
import { parseSectionName } from '../../shared/catalogue/index.ts';
import type { IfcBuilder, V3 } from './ifc-builder.ts';
import type { AuthoredBoltGroup, AuthoredHole, AuthoredMember } from './kestrel-yard.ts';

type H = Handle<any>;

export interface WrittenMember {
  handle: H;
  placement: H;
}

const sub = (a: V3, b: V3): V3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const unit = (a: V3): V3 => {
  const l = Math.hypot(...a);
  return [a[0] / l, a[1] / l, a[2] / l];
};

export const memberLength = (m: AuthoredMember) => Math.round(Math.hypot(...sub(m.end, m.start)));

function profileEntity(b: IfcBuilder, m: AuthoredMember): H {
  const p = m.profile;
  const area = b.enumOf('IfcProfileTypeEnum', 'AREA');
  const pos = b.profilePosition();
  const ifc2x3 = b.schema === 'IFC2X3';
  switch (p.kind) {
    case 'angle':
      return ifc2x3
        ? b.add('IfcLShapeProfileDef', area, b.label(p.name), pos, b.pos(p.legA), b.pos(p.legB), b.pos(p.t), null, null, null, null, null)
        : b.add('IfcLShapeProfileDef', area, b.label(p.name), pos, b.pos(p.legA), b.pos(p.legB), b.pos(p.t), null, null, null);
    case 'flat':
      return b.add('IfcRectangleProfileDef', area, b.label(p.name), pos, b.pos(p.width), b.pos(p.t));
    case 'round':
      return b.add('IfcCircleProfileDef', area, b.label(p.name), pos, b.pos(p.d / 2));
    case 'named': {
      const s = parseSectionName(p.name);
      if (!s || s.shape !== 'i') throw new Error(`no I-section for ${p.name}`);
      const common = [area, b.label(p.name), pos, b.pos(s.flangeWidth), b.pos(s.depth), b.pos(s.webThickness), b.pos(s.flangeThickness), s.rootRadius ? b.len(s.rootRadius) : null];
      return ifc2x3 ? b.add('IfcIShapeProfileDef', ...common) : b.add('IfcIShapeProfileDef', ...common, null, null);
    }
  }
}

/** Hole centre and direction in the member's profile/extrusion coordinates (inverse of the reader's section map). */
export function holeLocal(m: AuthoredMember, h: AuthoredHole): { centre: V3; dir: V3 } {
  const p = m.profile;
  if (p.kind === 'angle') {
    // Section frame: u = y + legA/2, v = x + legB/2 (heel at the box corner).
    const centre: V3 = [h.v - p.legB / 2, h.u - p.legA / 2, h.x];
    return { centre, dir: h.axis === 'v' ? [1, 0, 0] : [0, 1, 0] };
  }
  return { centre: [h.u, h.v, h.x], dir: h.axis === 'v' ? [0, 1, 0] : [1, 0, 0] };
}

function cylinder(b: IfcBuilder, centre: V3, dir: V3, diameter: number, depth: number): H {
  const start: V3 = [centre[0] - (dir[0] * depth) / 2, centre[1] - (dir[1] * depth) / 2, centre[2] - (dir[2] * depth) / 2];
  return b.extrusion(b.circle(diameter / 2), b.placement3d(start, dir, [0, 0, 1]), depth);
}

export function writeMember(b: IfcBuilder, m: AuthoredMember, guid: unknown, storeyPlacement: H, materials: Map<string, H>): WrittenMember {
  const len = memberLength(m);
  const placement = b.localPlacement(storeyPlacement, m.start, unit(sub(m.end, m.start)), m.xAxis);
  const profile = profileEntity(b, m);
  let body = b.extrusion(profile, b.placement3d([0, 0, 0]), len);
  let repType = 'SweptSolid';
  if (m.holeStyle === 'boolean') {
    for (const h of m.holes) {
      const { centre, dir } = holeLocal(m, h);
      body = b.add('IfcBooleanResult', b.enumOf('IfcBooleanOperator', 'DIFFERENCE'), body, cylinder(b, centre, dir, h.diameter, h.thickness + 2));
    }
    repType = 'CSG';
  }
  const shape = b.bodyShape([body], repType);
  const ifc2x3 = b.schema === 'IFC2X3';
  // IFC2X3 has no PredefinedType on members: the role goes into ObjectType.
  const objectType = ifc2x3 ? (m.objectType ?? m.predefinedType) : m.objectType;
  const attrs = [guid, b.ownerHistory, b.label(m.name), null, b.label(objectType), placement, shape, b.id(m.key)];
  const handle = ifc2x3 ? b.add(m.ifcClass, ...attrs) : b.add(m.ifcClass, ...attrs, b.enumOf('', m.predefinedType));

  // Material: IFC4 profile set usage (the same profile instance as the body), IFC2X3 plain material.
  let mat = materials.get(m.material);
  if (!mat) {
    mat = ifc2x3 ? b.add('IfcMaterial', b.label(m.material)) : b.add('IfcMaterial', b.label(m.material), null, b.label('Steel'));
    materials.set(m.material, mat);
  }
  let relating: H = mat;
  if (!ifc2x3) {
    const mp = b.add('IfcMaterialProfile', b.label(m.profile.name), null, mat, profile, null, null);
    const set = b.add('IfcMaterialProfileSet', b.label(m.profile.name), null, [mp], null);
    relating = b.add('IfcMaterialProfileSetUsage', set, new b.S.IfcCardinalPointReference(5), null);
  }
  b.add('IfcRelAssociatesMaterial', b.guid(), b.ownerHistory, null, null, [handle], relating);

  if (m.holeStyle === 'opening') {
    for (const h of m.holes) {
      const { centre, dir } = holeLocal(m, h);
      const opPlacement = b.localPlacement(placement, [0, 0, 0]);
      const opShape = b.bodyShape([cylinder(b, centre, dir, h.diameter, h.thickness)]);
      const opAttrs = [b.guid(), b.ownerHistory, b.label('Bolt hole'), null, b.label('BoltHole'), opPlacement, opShape, null];
      const opening = ifc2x3 ? b.add('IfcOpeningElement', ...opAttrs) : b.add('IfcOpeningElement', ...opAttrs, b.enumOf('', 'OPENING'));
      b.add('IfcRelVoidsElement', b.guid(), b.ownerHistory, null, null, handle, opening);
    }
  }
  for (const f of m.forces) {
    b.propertySet('Gaugeline_MemberForces', [['AxialForce', new b.S.IfcForceMeasure(f.N)], ['LoadCase', b.label(f.loadCase)]], [handle]);
  }
  return { handle, placement };
}

/** Bolt group(s) through some of a member's holes; returns the fastener handles. */
export function writeBolts(b: IfcBuilder, m: AuthoredMember, g: AuthoredBoltGroup, memberPlacement: H): H[] {
  const ifc2x3 = b.schema === 'IFC2X3';
  const holes = g.holes.map((i) => holeLocal(m, m.holes[i]));
  const dir = holes[0].dir;
  const fastener = (placement: H, shape: H, count: number): H => {
    const attrs = [b.guid(), b.ownerHistory, b.label(`Bolt group ${g.key}`), null, null, placement, shape, b.id(g.key), b.pos(g.diameter), b.pos(g.length)];
    const f = ifc2x3 ? b.add('IfcMechanicalFastener', ...attrs) : b.add('IfcMechanicalFastener', ...attrs, b.enumOf('', 'BOLT'));
    b.propertySet('Gaugeline_BoltGroup', [
      ['BoltHoleDiameter', b.pos(g.holeDiameter)], ['BoltGrade', b.label(g.grade)], ['BoltCount', new b.S.IfcInteger(count)],
    ], [f]);
    if (!ifc2x3) b.propertySet('Pset_MechanicalFastenerBolt', [['ThreadDiameter', b.pos(g.diameter)]], [f]);
    return f;
  };
  const shank = (at: V3) => b.extrusion(b.circle(g.diameter / 2), b.placement3d(at), g.length);
  if (g.style === 'group') {
    const rep = b.add('IfcShapeRepresentation', b.bodyContext, b.label('Body'), b.label('SweptSolid'), [shank([0, 0, -g.length / 2])]);
    const map = b.add('IfcRepresentationMap', b.placement3d([0, 0, 0], dir, [0, 0, 1]), rep);
    const items = holes.map((h) => b.add('IfcMappedItem', map, b.add('IfcCartesianTransformationOperator3D', null, null, b.point(h.centre), null, null)));
    const shapeRep = b.add('IfcShapeRepresentation', b.bodyContext, b.label('Body'), b.label('MappedRepresentation'), items);
    return [fastener(b.localPlacement(memberPlacement, [0, 0, 0]), b.add('IfcProductDefinitionShape', null, null, [shapeRep]), holes.length)];
  }
  return holes.map((h) => fastener(b.localPlacement(memberPlacement, h.centre, dir, [0, 0, 1]), b.bodyShape([shank([0, 0, -g.length / 2])]), 1));
}
