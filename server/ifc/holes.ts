/**
 * Holes of a member, from IfcOpeningElement / IfcVoidingFeature (IfcRelVoidsElement) and from
 * circular boolean cutters in its body, expressed in the member's frame:
 * x along the member from its start, (u, v) in the engine's section-plane frame.
 */
import { type Body, readBody, type SweptSolid } from './body-geometry.ts';
import { cutterShape } from './cutter-shapes.ts';
import { type Mat4, multiply, transformDir, transformPoint } from './mat4.ts';
import type { MemberFrame } from './member-frame.ts';
import type { ModelContext } from './model-context.ts';
import { objectPlacement } from './placements.ts';
import { type Affine2, applyAffine, piercedThickness, sectionAxisOf } from './profile-geometry.ts';
import type { RelationsIndex } from './relations-index.ts';
import { ref, str } from './step-values.ts';
import type { ExtractedHole, HoleSource, Vec3 } from './types.ts';

const r2 = (v: number) => Math.round(v * 100) / 100 + 0; // + 0 turns -0 into 0

/** World point and direction → hole in the member frame; null when the axis runs along the member. */
export function holeInFrame(
  frame: MemberFrame,
  centreWorld: Vec3,
  dirWorld: Vec3,
  diameter: number | null,
  source: HoleSource,
  fallbackThickness: number | null,
): ExtractedHole | null {
  const p = transformPoint(frame.fromWorld, centreWorld);
  const d = transformDir(frame.fromWorld, dirWorld);
  const dl = Math.hypot(d[0], d[1], d[2]) || 1;
  if (Math.abs(d[2] / dl) > 0.7) return null;
  const map: Affine2 = frame.profile?.toSection ?? [1, 0, 0, 0, 1, 0];
  let [u, v] = applyAffine(map, p[0], p[1]);
  const axis = sectionAxisOf(map, d[0], d[1]);
  const section = frame.profile?.section;
  if (source === 'bolt-derived' && section) {
    // A bolt's centre is not the plate's: put the through-thickness coordinate mid-plate.
    const mid = section.shape === 'flat' ? 0 : section.shape === 'angle' ? section.thickness / 2 : null;
    if (mid !== null && axis === 'v') v = mid;
    if (mid !== null && axis === 'u') u = mid;
  }
  return {
    x: r2(frame.sSign * p[2]),
    u: r2(u),
    v: r2(v),
    diameter: diameter === null ? null : r2(diameter),
    thickness: piercedThickness(frame.profile?.section ?? null, axis) ?? (fallbackThickness === null ? null : r2(fallbackThickness)),
    axis,
    source,
  };
}

function holeFromCutter(
  ctx: ModelContext,
  frame: MemberFrame,
  toWorld: Mat4,
  cutter: SweptSolid,
  source: HoleSource,
  example: string,
): ExtractedHole | null {
  const shape = cutterShape(ctx, cutter.profileId);
  if (shape.kind === 'other') {
    ctx.warnings.add('hole.non-circular', 'A cut or opening that is not round or a slot was treated as a cut, not a bolt hole.', `${example} (${shape.reason})`);
    return null;
  }
  const m = multiply(toWorld, cutter.toPlacement);
  const mid: Vec3 = [shape.cx + (cutter.dir[0] * cutter.depth) / 2, shape.cy + (cutter.dir[1] * cutter.depth) / 2, (cutter.dir[2] * cutter.depth) / 2];
  const centre = transformPoint(m, mid);
  const dir = transformDir(m, cutter.dir);
  const diameter = shape.kind === 'circle' ? 2 * shape.radius : shape.width;
  const hole = holeInFrame(frame, centre, dir, diameter, source, cutter.depth);
  if (!hole) {
    ctx.warnings.add('hole.along-member-axis', 'A round cut runs along the member axis and is not a bolt hole.', example);
    return null;
  }
  if (shape.kind === 'slot') {
    hole.slot = { length: r2(shape.length), width: r2(shape.width) };
  }
  return hole;
}

const OPENING_ELEMENT = new TextEncoder().encode('IFCOPENINGELEMENT');

/** An opening's GlobalId, body and placement references: from the text for a plain IfcOpeningElement, else its line (null when there is none). */
function openingRefs(ctx: ModelContext, id: number): { gid: string | null; representation: number | undefined; placement: number | undefined } | null {
  const fromText = ctx.classUpper(id) === 'IFCOPENINGELEMENT' ? ctx.refsFromTextAt(id, OPENING_ELEMENT, 5, 2) : null;
  if (fromText) return { gid: ctx.stringAt(id, OPENING_ELEMENT, 0, 'GlobalId'), placement: fromText[0], representation: fromText[1] };
  const op = ctx.line(id);
  return op ? { gid: str(op.GlobalId), representation: ref(op.Representation), placement: ref(op.ObjectPlacement) } : null;
}

export function extractHoles(ctx: ModelContext, ix: RelationsIndex, memberId: number, placement: Mat4, body: Body, frame: MemberFrame, label: string): ExtractedHole[] {
  const holes: ExtractedHole[] = [];
  for (const openingId of ix.openings.get(memberId) ?? []) {
    const op = openingRefs(ctx, openingId);
    if (!op) continue;
    const isFeature = ctx.classUpper(openingId) === 'IFCVOIDINGFEATURE';
    const gid = op.gid ?? `#${openingId}`;
    const obody = readBody(ctx, op.representation);
    const world = objectPlacement(ctx, op.placement);
    const solids = [...obody.extrusions, ...obody.cutters];
    if (solids.length === 0) {
      ctx.warnings.add('hole.no-geometry', 'An opening has no swept-solid body, so its position is unknown.', gid);
      continue;
    }
    for (const s of solids) {
      const h = holeFromCutter(ctx, frame, world, s, isFeature ? 'voiding-feature' : 'opening', gid);
      if (h) holes.push({ ...h, featureGlobalId: gid });
    }
  }
  for (const c of body.cutters) {
    const h = holeFromCutter(ctx, frame, placement, c, 'boolean-cut', `${label} #${c.solidId}`);
    if (h) holes.push(h);
  }
  return holes.sort((a, b) => a.x - b.x || a.u - b.u || a.v - b.v);
}
