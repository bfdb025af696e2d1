/**
 * The member's engineering frame: x, y in profile coordinates, z along the member, built as
 * World ← ObjectPlacement ← ExtrudedAreaSolid.Position ← profile Position. Faceted members
 * (no swept solid) get a frame from the box of their vertices: z along the longest extent.
 */
import { parseSectionName } from '../../shared/catalogue/index.ts';
import type { Body } from './body-geometry.ts';
import { type Mat4, cross, fromAxes, invert, multiply, norm, normalize, sub, transformPoint } from './mat4.ts';
import type { ModelContext } from './model-context.ts';
import { type ProfileGeometry, flatFromBox, parametricMap } from './profile-geometry.ts';
import { type ReadProfile, readProfile } from './profiles.ts';
import type { AxisSource, Vec3 } from './types.ts';

export interface MemberFrame {
  toWorld: Mat4;
  fromWorld: Mat4;
  /** Distance along the member is sSign · z. */
  sSign: 1 | -1;
  length: number | null;
  axis: { start: Vec3; end: Vec3 } | null;
  axisSource: AxisSource;
  profile: ProfileGeometry | null;
  /** Where the profile came from: parameters/outline of the swept area, or only its name. */
  profileFrom: 'swept-area' | 'name' | 'none';
}

function withFrame(toWorld: Mat4, rest: Omit<MemberFrame, 'toWorld' | 'fromWorld'>): MemberFrame {
  return { toWorld, fromWorld: invert(toWorld), ...rest };
}

function axisFrom(toWorld: Mat4, profile: ProfileGeometry | null, sSign: 1 | -1, length: number): { start: Vec3; end: Vec3 } {
  const b = profile?.box;
  const cx = b ? (b.minX + b.maxX) / 2 : 0;
  const cy = b ? (b.minY + b.maxY) / 2 : 0;
  return { start: transformPoint(toWorld, [cx, cy, 0]), end: transformPoint(toWorld, [cx, cy, sSign * length]) };
}

/** Profile from a name only, fitted to a faceted body's cross-section box where that helps. */
function namedProfile(name: string | null, box: ProfileGeometry['box'] | null): ProfileGeometry | null {
  const section = parseSectionName(name);
  if (!section) return null;
  if (section.shape === 'flat' && box) {
    const f = flatFromBox(box);
    return { name, section, box, toSection: f.toSection, approximate: false };
  }
  const p = parametricMap(section);
  return { name, section, box: box ?? p.box, toSection: p.toSection, approximate: true };
}

export function buildMemberFrame(ctx: ModelContext, placement: Mat4, body: Body, fallbackName: string | null): MemberFrame {
  const main = [...body.extrusions].sort((a, b) => b.depth - a.depth)[0];
  if (main) {
    const read: ReadProfile | null = readProfile(ctx, main.profileId);
    const profileM = read?.position ?? fromAxes([0, 0, 0], [1, 0, 0], [0, 1, 0], [0, 0, 1]);
    const toWorld = multiply(placement, multiply(main.toPlacement, profileM));
    const sSign: 1 | -1 = main.dir[2] < 0 ? -1 : 1;
    let profile = read?.geometry ?? null;
    let profileFrom: MemberFrame['profileFrom'] = read ? (read.fromParameters ? 'swept-area' : 'name') : 'none';
    if (!profile?.section) {
      const named = namedProfile(fallbackName, profile?.box ?? null);
      if (named) {
        profile = named;
        profileFrom = 'name';
      }
    }
    // Oblique extrusions: the length along the member is the depth times the axial component.
    const length = main.depth * Math.abs(main.dir[2] || 1);
    return withFrame(toWorld, { sSign, length, axis: axisFrom(toWorld, profile, sSign, length), axisSource: 'extrusion', profile, profileFrom });
  }
  if (body.brepBox) {
    const { min, max } = body.brepBox;
    const ext = [max[0] - min[0], max[1] - min[1], max[2] - min[2]];
    const k = ext.indexOf(Math.max(...ext));
    const e = (i: number): Vec3 => [i === 0 ? 1 : 0, i === 1 ? 1 : 0, i === 2 ? 1 : 0];
    const ix = (k + 1) % 3;
    const iy = (k + 2) % 3;
    const origin: Vec3 = [0, 0, 0];
    origin[ix] = (min[ix] + max[ix]) / 2;
    origin[iy] = (min[iy] + max[iy]) / 2;
    origin[k] = min[k];
    const toWorld = multiply(placement, fromAxes(origin, e(ix), e(iy), e(k)));
    const box = { minX: -ext[ix] / 2, maxX: ext[ix] / 2, minY: -ext[iy] / 2, maxY: ext[iy] / 2 };
    const profile = namedProfile(fallbackName, box) ?? { name: fallbackName, section: null, box, toSection: [1, 0, 0, 0, 1, 0] as ProfileGeometry['toSection'], approximate: true };
    return withFrame(toWorld, { sSign: 1, length: ext[k], axis: axisFrom(toWorld, { ...profile, box }, 1, ext[k]), axisSource: 'brep-extent', profile: { ...profile, box }, profileFrom: profile.section ? 'name' : 'none' });
  }
  if (body.axisLine) {
    const [a, b] = body.axisLine;
    const z = normalize(sub(b, a));
    const xHint: Vec3 = Math.abs(z[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
    const x = normalize(cross(xHint, z));
    const toWorld = multiply(placement, fromAxes(a, x, cross(z, x), z));
    const length = norm(sub(b, a));
    const profile = namedProfile(fallbackName, null);
    return withFrame(toWorld, { sSign: 1, length, axis: axisFrom(toWorld, null, 1, length), axisSource: 'axis-representation', profile, profileFrom: profile ? 'name' : 'none' });
  }
  const profile = namedProfile(fallbackName, null);
  return withFrame(placement, { sSign: 1, length: null, axis: null, axisSource: 'none', profile, profileFrom: profile ? 'name' : 'none' });
}
