/**
 * Placement matrices computed from the IFC entities (not from web-ifc meshes, which are in
 * metres, Y-up and go through the geometry kernel). Translations are converted to mm here,
 * so every matrix that leaves this module maps to world millimetres.
 */
import type { ModelContext } from './model-context.ts';
import { IDENTITY, type Mat4, cross, dot, fromAxes, multiply, normalize, scaleTranslation, sub } from './mat4.ts';
import { num, ref } from './step-values.ts';
import type { Vec3 } from './types.ts';

export function pointMm(ctx: ModelContext, id: number | undefined): Vec3 {
  const c = ctx.numbers(id, 'point');
  const s = ctx.units.lengthToMm;
  return [(c[0] ?? 0) * s, (c[1] ?? 0) * s, (c[2] ?? 0) * s];
}

export function direction(ctx: ModelContext, id: number | undefined, fallback: Vec3): Vec3 {
  const d = ctx.numbers(id, 'direction');
  if (d.length < 2) return fallback;
  const v: Vec3 = [d[0], d[1], d[2] ?? 0];
  return Math.hypot(...v) < 1e-12 ? fallback : normalize(v);
}

function orthoFrame(z: Vec3, xHint: Vec3): { x: Vec3; y: Vec3; z: Vec3 } {
  let x = sub(xHint, [z[0] * dot(xHint, z), z[1] * dot(xHint, z), z[2] * dot(xHint, z)]);
  if (Math.hypot(...x) < 1e-9) {
    const alt: Vec3 = Math.abs(z[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0];
    x = sub(alt, [z[0] * dot(alt, z), z[1] * dot(alt, z), z[2] * dot(alt, z)]);
  }
  x = normalize(x);
  return { x, y: cross(z, x), z };
}

const AXIS2PLACEMENT3D = new TextEncoder().encode('IFCAXIS2PLACEMENT3D');
const LOCALPLACEMENT = new TextEncoder().encode('IFCLOCALPLACEMENT');

/** IfcAxis2Placement3D or IfcAxis2Placement2D → matrix (mm). Missing → identity. */
export function axisPlacement(ctx: ModelContext, id: number | undefined): Mat4 {
  // The common case, an IfcAxis2Placement3D of plain references, without a line object.
  const refs3d = id === undefined ? null : ctx.refsFromText(id, AXIS2PLACEMENT3D, 3);
  if (refs3d) {
    const [location, axis, refDirection] = refs3d;
    const z = direction(ctx, axis, [0, 0, 1]);
    const f = orthoFrame(z, direction(ctx, refDirection, [1, 0, 0]));
    return fromAxes(pointMm(ctx, location), f.x, f.y, f.z);
  }
  const p = ctx.line(id);
  if (!p) return IDENTITY.slice();
  const origin = pointMm(ctx, ref(p.Location));
  const cls = ctx.classUpper(id);
  if (cls === 'IFCAXIS2PLACEMENT2D') {
    const xd = direction(ctx, ref(p.RefDirection), [1, 0, 0]);
    const f = orthoFrame([0, 0, 1], [xd[0], xd[1], 0]);
    return fromAxes([origin[0], origin[1], 0], f.x, f.y, f.z);
  }
  const z = direction(ctx, ref(p.Axis), [0, 0, 1]);
  const f = orthoFrame(z, direction(ctx, ref(p.RefDirection), [1, 0, 0]));
  return fromAxes(origin, f.x, f.y, f.z);
}

const placementCache = new WeakMap<ModelContext, Map<number, Mat4>>();

/** World matrix (mm) of an ObjectPlacement, following PlacementRelTo. */
export function objectPlacement(ctx: ModelContext, id: number | undefined, depth = 0): Mat4 {
  if (id === undefined) return IDENTITY.slice();
  let cache = placementCache.get(ctx);
  if (!cache) placementCache.set(ctx, (cache = new Map()));
  const hit = cache.get(id);
  if (hit) return hit;
  let m: Mat4;
  const refsLocal = depth < 64 ? ctx.refsFromText(id, LOCALPLACEMENT, 2) : null;
  const p = refsLocal ? null : ctx.line(id);
  if (refsLocal || (p && ctx.classUpper(id) === 'IFCLOCALPLACEMENT' && depth < 64)) {
    const rel = axisPlacement(ctx, refsLocal ? refsLocal[1] : ref(p.RelativePlacement));
    const parent = refsLocal ? refsLocal[0] : ref(p.PlacementRelTo);
    m = parent !== undefined ? multiply(objectPlacement(ctx, parent, depth + 1), rel) : rel;
  } else {
    // Grid or linear placements: let web-ifc resolve them (file units) and scale.
    try {
      m = scaleTranslation(ctx.api.GetWorldTransformMatrix(ctx.modelID, id), ctx.units.lengthToMm);
    } catch {
      ctx.warnings.add('placement.unresolved', 'A placement could not be resolved; identity used.', `#${id}`);
      m = IDENTITY.slice();
    }
  }
  cache.set(id, m);
  return m;
}

/** IfcCartesianTransformationOperator3D (MappedItem.MappingTarget) → matrix (mm). */
export function transformOperator(ctx: ModelContext, id: number | undefined): Mat4 {
  const t = ctx.line(id);
  if (!t) return IDENTITY.slice();
  const o = pointMm(ctx, ref(t.LocalOrigin));
  const s = num(t.Scale) ?? 1;
  const x0 = direction(ctx, ref(t.Axis1), [1, 0, 0]);
  const z0 = direction(ctx, ref(t.Axis3), [0, 0, 1]);
  const f = orthoFrame(z0, x0);
  const s2 = num(t.Scale2) ?? s;
  const s3 = num(t.Scale3) ?? s;
  const m = fromAxes(o, f.x, f.y, f.z);
  for (let i = 0; i < 3; i++) {
    m[i] *= s;
    m[4 + i] *= s2;
    m[8 + i] *= s3;
  }
  return m;
}
