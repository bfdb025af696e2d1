/**
 * IfcProfileDef → ProfileGeometry. Parameterised profiles give the section directly; arbitrary
 * outlines are recognised as flats or angles where possible, otherwise the profile name is
 * looked up in the catalogue.
 */
import { parseSectionName } from '../../shared/catalogue/index.ts';
import type { Section } from '../../shared/engine/section-types.ts';
import type { ModelContext } from './model-context.ts';
import { IDENTITY, type Mat4, multiply } from './mat4.ts';
import { axisPlacement, pointMm } from './placements.ts';
import { type ProfileGeometry, angleFromOutline, centred, flatFromBox, parametricMap } from './profile-geometry.ts';
import { num, ref, refs, str } from './step-values.ts';

export interface ReadProfile {
  geometry: ProfileGeometry;
  /** Profile coordinates → swept-solid xy plane (the profile's Position). */
  position: Mat4;
  /** True when the section came from the profile's parameters or outline, false when from its name. */
  fromParameters: boolean;
}

const r3 = (v: number | undefined) => (v === undefined ? undefined : Math.round(v * 1000) / 1000);

/** A length attribute in mm to three decimals (a plain function: under tsx a closure made per call is also named per call). */
function mmOf(ctx: ModelContext, v: unknown): number | undefined {
  return r3(ctx.mm(num(v)));
}

function parametricSection(ctx: ModelContext, cls: string, p: any): Section | null {
  switch (cls) {
    case 'IFCISHAPEPROFILEDEF':
    case 'IFCISHAPEPROFILEDEFSTANDARDCASE': {
      const s: Section = { shape: 'i', depth: mmOf(ctx, p.OverallDepth) ?? 0, flangeWidth: mmOf(ctx, p.OverallWidth) ?? 0, webThickness: mmOf(ctx, p.WebThickness) ?? 0, flangeThickness: mmOf(ctx, p.FlangeThickness) ?? 0 };
      if (mmOf(ctx, p.FilletRadius) !== undefined) s.rootRadius = mmOf(ctx, p.FilletRadius);
      return s;
    }
    case 'IFCLSHAPEPROFILEDEF': {
      const depth = mmOf(ctx, p.Depth) ?? 0;
      const s: Section = { shape: 'angle', legA: depth, legB: mmOf(ctx, p.Width) ?? depth, thickness: mmOf(ctx, p.Thickness) ?? 0 };
      if (mmOf(ctx, p.FilletRadius) !== undefined) s.rootRadius = mmOf(ctx, p.FilletRadius);
      if (mmOf(ctx, p.EdgeRadius) !== undefined) s.toeRadius = mmOf(ctx, p.EdgeRadius);
      return s;
    }
    case 'IFCUSHAPEPROFILEDEF': {
      const s: Section = { shape: 'channel', depth: mmOf(ctx, p.Depth) ?? 0, flangeWidth: mmOf(ctx, p.FlangeWidth) ?? 0, webThickness: mmOf(ctx, p.WebThickness) ?? 0, flangeThickness: mmOf(ctx, p.FlangeThickness) ?? 0 };
      if (mmOf(ctx, p.FilletRadius) !== undefined) s.rootRadius = mmOf(ctx, p.FilletRadius);
      if (mmOf(ctx, p.EdgeRadius) !== undefined) s.toeRadius = mmOf(ctx, p.EdgeRadius);
      return s;
    }
    case 'IFCTSHAPEPROFILEDEF': {
      const s: Section = { shape: 'tee', depth: mmOf(ctx, p.Depth) ?? 0, flangeWidth: mmOf(ctx, p.FlangeWidth) ?? 0, webThickness: mmOf(ctx, p.WebThickness) ?? 0, flangeThickness: mmOf(ctx, p.FlangeThickness) ?? 0 };
      if (mmOf(ctx, p.FilletRadius) !== undefined) s.rootRadius = mmOf(ctx, p.FilletRadius);
      return s;
    }
    case 'IFCCIRCLEPROFILEDEF':
      return { shape: 'round-bar', diameter: r3(2 * (ctx.mm(num(p.Radius)) ?? 0)) ?? 0 };
    case 'IFCCIRCLEHOLLOWPROFILEDEF':
      return { shape: 'chs', diameter: r3(2 * (ctx.mm(num(p.Radius)) ?? 0)) ?? 0, thickness: mmOf(ctx, p.WallThickness) ?? 0 };
    case 'IFCRECTANGLEHOLLOWPROFILEDEF': {
      const s: Section = { shape: 'rhs', depth: mmOf(ctx, p.YDim) ?? 0, width: mmOf(ctx, p.XDim) ?? 0, thickness: mmOf(ctx, p.WallThickness) ?? 0 };
      if (mmOf(ctx, p.OuterFilletRadius) !== undefined) s.outerRadius = mmOf(ctx, p.OuterFilletRadius);
      return s;
    }
    default:
      return null;
  }
}

/** Points of a closed polyline outline, in profile coordinates (mm); null for curved outlines. */
function outlinePoints(ctx: ModelContext, curveId: number | undefined): [number, number][] | null {
  if (!ctx.isA(curveId, 'IfcPolyline')) return null;
  return refs(ctx.line(curveId)?.Points).map((pid) => {
    const p = pointMm(ctx, pid);
    return [p[0], p[1]];
  });
}

export function readProfile(ctx: ModelContext, profileId: number | undefined, depth = 0): ReadProfile | null {
  const p = ctx.line(profileId);
  if (!p || depth > 4) return null;
  const cls = ctx.classUpper(profileId);
  const name = str(p.ProfileName);
  const position = p.Position ? axisPlacement(ctx, ref(p.Position)) : IDENTITY.slice();

  const section = parametricSection(ctx, cls, p);
  if (section) {
    const { toSection, box } = parametricMap(section);
    return { geometry: { name, section, box, toSection, approximate: false }, position, fromParameters: true };
  }
  if (cls === 'IFCRECTANGLEPROFILEDEF' || cls === 'IFCROUNDEDRECTANGLEPROFILEDEF') {
    const x = ctx.mm(num(p.XDim)) ?? 0;
    const y = ctx.mm(num(p.YDim)) ?? 0;
    const box = { minX: -x / 2, maxX: x / 2, minY: -y / 2, maxY: y / 2 };
    const flat = flatFromBox(box);
    return { geometry: { name, section: flat.section, box, toSection: flat.toSection, approximate: false }, position, fromParameters: true };
  }
  if (cls === 'IFCDERIVEDPROFILEDEF') {
    const parent = readProfile(ctx, ref(p.ParentProfile), depth + 1);
    if (!parent) return null;
    // The operator moves the parent profile; fold it into the position.
    const op = ctx.line(ref(p.Operator));
    const opM = op ? axisLikeOperator(ctx, op) : IDENTITY.slice();
    return { ...parent, geometry: { ...parent.geometry, name: name ?? parent.geometry.name }, position: multiply(position, multiply(opM, parent.position)) };
  }
  if (cls === 'IFCARBITRARYCLOSEDPROFILEDEF' || cls === 'IFCARBITRARYPROFILEDEFWITHVOIDS') {
    const pts = outlinePoints(ctx, ref(p.OuterCurve));
    const named = parseSectionName(name);
    if (pts && pts.length >= 4) {
      const xs = pts.map((q) => q[0]);
      const ys = pts.map((q) => q[1]);
      const box = { minX: Math.min(...xs), maxX: Math.max(...xs), minY: Math.min(...ys), maxY: Math.max(...ys) };
      const distinct = new Set(pts.map((q) => `${q[0].toFixed(3)},${q[1].toFixed(3)}`)).size;
      if (distinct === 4) {
        const flat = flatFromBox(box);
        return { geometry: { name, section: flat.section, box, toSection: flat.toSection, approximate: false }, position, fromParameters: true };
      }
      const thickness = named?.shape === 'angle' ? named.thickness : undefined;
      if (distinct === 6 && thickness !== undefined) {
        const a = angleFromOutline(pts, thickness);
        if (a) return { geometry: { name, section: a.section, box: a.box, toSection: a.toSection, approximate: false }, position, fromParameters: false };
      }
      return { geometry: { name, section: named, box, toSection: centred(box), approximate: true }, position, fromParameters: false };
    }
    if (named) {
      const { toSection, box } = parametricMap(named);
      return { geometry: { name, section: named, box, toSection, approximate: true }, position, fromParameters: false };
    }
    return null;
  }
  // Other parameterised shapes (C, Z, ellipse…) are not sections the engine checks; keep the name.
  const named = parseSectionName(name);
  if (named) {
    const { toSection, box } = parametricMap(named);
    return { geometry: { name, section: named, box, toSection, approximate: true }, position, fromParameters: false };
  }
  return { geometry: { name, section: null, box: { minX: 0, maxX: 0, minY: 0, maxY: 0 }, toSection: [1, 0, 0, 0, 1, 0], approximate: true }, position, fromParameters: false };
}

function axisLikeOperator(ctx: ModelContext, op: any): Mat4 {
  const o = pointMm(ctx, ref(op.LocalOrigin));
  const m = IDENTITY.slice();
  m[12] = o[0];
  m[13] = o[1];
  return m;
}
