/**
 * Recognises the profile of a cutting solid (opening body or boolean second operand) as a
 * round hole, a slot, or something else (cope, notch, rounded rectangle). Only the first two
 * are bolt holes.
 */
import type { ModelContext } from './model-context.ts';
import { transformPoint, type Mat4 } from './mat4.ts';
import type { Vec3 } from './types.ts';
import { axisPlacement, pointMm } from './placements.ts';
import { num, ref, refs } from './step-values.ts';

export type CutterShape =
  | { kind: 'circle'; cx: number; cy: number; radius: number }
  | { kind: 'slot'; cx: number; cy: number; length: number; width: number; alongX: boolean }
  | { kind: 'other'; reason: string };

const TOL = 0.01; // mm

function circleOf(ctx: ModelContext, circleId: number | undefined): { cx: number; cy: number; r: number } | null {
  const c = ctx.line(circleId);
  if (!c || !ctx.isA(circleId, 'IfcCircle')) return null;
  const m = axisPlacement(ctx, ref(c.Position));
  const [cx, cy] = transformPoint(m, [0, 0, 0]);
  return { cx, cy, r: ctx.mm(num(c.Radius)) ?? 0 };
}

/** A composite curve made only of arcs on one circle is that circle. */
function compositeAsCircle(ctx: ModelContext, curveId: number | undefined): { cx: number; cy: number; r: number } | null {
  const segs = refs(ctx.line(curveId)?.Segments);
  if (segs.length === 0) return null;
  let first: { cx: number; cy: number; r: number } | null = null;
  for (const s of segs) {
    const parent = ref(ctx.line(s)?.ParentCurve);
    const basis = ctx.isA(parent, 'IfcTrimmedCurve') ? ref(ctx.line(parent)?.BasisCurve) : parent;
    const c = circleOf(ctx, basis);
    if (!c) return null;
    if (!first) first = c;
    else if (Math.abs(c.cx - first.cx) > TOL || Math.abs(c.cy - first.cy) > TOL || Math.abs(c.r - first.r) > TOL) return null;
  }
  return first;
}

function polylineBox(ctx: ModelContext, curveId: number | undefined): { w: number; h: number; cx: number; cy: number } | null {
  const cls = ctx.classUpper(curveId);
  const pts: number[][] = [];
  const collect = (id: number | undefined) => {
    const c = ctx.classUpper(id);
    if (c === 'IFCPOLYLINE') for (const p of refs(ctx.line(id)?.Points)) pts.push(pointMm(ctx, p));
    if (c === 'IFCTRIMMEDCURVE') collect(ref(ctx.line(id)?.BasisCurve));
    if (c === 'IFCCIRCLE') {
      const k = circleOf(ctx, id);
      if (k) pts.push([k.cx - k.r, k.cy - k.r], [k.cx + k.r, k.cy + k.r]);
    }
  };
  if (cls === 'IFCCOMPOSITECURVE') for (const s of refs(ctx.line(curveId)?.Segments)) collect(ref(ctx.line(s)?.ParentCurve));
  else collect(curveId);
  if (pts.length === 0) return null;
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  return { w: x1 - x0, h: y1 - y0, cx: (x0 + x1) / 2, cy: (y0 + y1) / 2 };
}

/** A point of the profile's plane placed by its Position (none: as it is). */
function inProfilePlane(pos: Mat4 | null, x: number, y: number): Vec3 {
  return pos ? transformPoint(pos, [x, y, 0]) : [x, y, 0];
}

const CIRCLE_PROFILE_DEF = new TextEncoder().encode('IFCCIRCLEPROFILEDEF');

/** Shape of a cutting profile, in the coordinates of the swept solid's Position (mm). */
export function cutterShape(ctx: ModelContext, profileId: number | undefined): CutterShape {
  // Bolt holes are round: their Position (argument 2) and Radius (3) straight from the text, no line object.
  const position = profileId !== undefined && ctx.classUpper(profileId) === 'IFCCIRCLEPROFILEDEF' ? ctx.refsFromTextAt(profileId, CIRCLE_PROFILE_DEF, 2, 1) : null;
  if (position) {
    const [cx, cy] = inProfilePlane(position[0] === undefined ? null : axisPlacement(ctx, position[0]), 0, 0);
    return { kind: 'circle', cx, cy, radius: ctx.mm(ctx.realAt(profileId, CIRCLE_PROFILE_DEF, 3, 'Radius')) ?? 0 };
  }
  const p = ctx.line(profileId);
  if (!p) return { kind: 'other', reason: 'no profile' };
  const cls = ctx.classUpper(profileId);
  const pos = p.Position ? axisPlacement(ctx, ref(p.Position)) : null;
  if (cls === 'IFCCIRCLEPROFILEDEF') {
    const [cx, cy] = inProfilePlane(pos, 0, 0);
    return { kind: 'circle', cx, cy, radius: ctx.mm(num(p.Radius)) ?? 0 };
  }
  if (cls === 'IFCROUNDEDRECTANGLEPROFILEDEF') {
    const x = ctx.mm(num(p.XDim)) ?? 0;
    const y = ctx.mm(num(p.YDim)) ?? 0;
    const r = ctx.mm(num(p.RoundingRadius)) ?? 0;
    const [cx, cy] = inProfilePlane(pos, 0, 0);
    const small = Math.min(x, y);
    if (Math.abs(r - small / 2) > TOL) return { kind: 'other', reason: 'rounded rectangle' };
    if (Math.abs(x - y) <= TOL) return { kind: 'circle', cx, cy, radius: r };
    return { kind: 'slot', cx, cy, length: Math.max(x, y), width: small, alongX: x > y };
  }
  if (cls === 'IFCARBITRARYCLOSEDPROFILEDEF') {
    const curve = ref(p.OuterCurve);
    const circle = circleOf(ctx, curve) ?? (ctx.isA(curve, 'IfcCompositeCurve') ? compositeAsCircle(ctx, curve) : null);
    if (circle) return { kind: 'circle', cx: circle.cx, cy: circle.cy, radius: circle.r };
    const box = ctx.isA(curve, 'IfcCompositeCurve') ? polylineBox(ctx, curve) : null;
    const arcs = box ? compositeArcRadius(ctx, curve) : null;
    if (box && arcs !== null && Math.abs(Math.min(box.w, box.h) - 2 * arcs) <= TOL) {
      return { kind: 'slot', cx: box.cx, cy: box.cy, length: Math.max(box.w, box.h), width: Math.min(box.w, box.h), alongX: box.w > box.h };
    }
    return { kind: 'other', reason: arcs !== null ? 'rounded outline' : 'polygonal outline' };
  }
  return { kind: 'other', reason: cls.replace(/^IFC/, '').toLowerCase() };
}

/** The common radius of all arcs in a composite curve, or null when there are none or they differ. */
function compositeArcRadius(ctx: ModelContext, curveId: number | undefined): number | null {
  let r: number | null = null;
  for (const s of refs(ctx.line(curveId)?.Segments)) {
    const parent = ref(ctx.line(s)?.ParentCurve);
    const basis = ctx.isA(parent, 'IfcTrimmedCurve') ? ref(ctx.line(parent)?.BasisCurve) : parent;
    const c = circleOf(ctx, basis);
    if (!c) continue;
    if (r === null) r = c.r;
    else if (Math.abs(r - c.r) > TOL) return null;
  }
  return r;
}
