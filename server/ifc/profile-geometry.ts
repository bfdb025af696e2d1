/**
 * The profile of a member as the reader needs it: the engine's Section, the outline box and
 * the map from IFC profile coordinates (bounding-box centred for parameterised profiles)
 * into the section-plane frame of shared/engine/section-types.ts.
 */
import type { Section } from '../../shared/engine/section-types.ts';

/** u = a·x + b·y + c, v = d·x + e·y + f */
export type Affine2 = [a: number, b: number, c: number, d: number, e: number, f: number];

export interface ProfileGeometry {
  name: string | null;
  section: Section | null;
  /** Outline box in profile coordinates (mm). */
  box: { minX: number; maxX: number; minY: number; maxY: number };
  toSection: Affine2;
  /** True when the map is a best guess (faceted bodies, unrecognised outlines). */
  approximate: boolean;
}

export const centred = (box: ProfileGeometry['box']): Affine2 => {
  const cx = (box.minX + box.maxX) / 2;
  const cy = (box.minY + box.maxY) / 2;
  return [1, 0, -cx, 0, 1, -cy];
};

export function applyAffine(m: Affine2, x: number, y: number): [number, number] {
  return [m[0] * x + m[1] * y + m[2], m[3] * x + m[4] * y + m[5]];
}

/** Which section axis a direction given in profile coordinates is parallel to. */
export function sectionAxisOf(m: Affine2, dx: number, dy: number): 'u' | 'v' {
  const du = m[0] * dx + m[1] * dy;
  const dv = m[3] * dx + m[4] * dy;
  return Math.abs(du) >= Math.abs(dv) ? 'u' : 'v';
}

/** Thickness of the plate a hole with this axis passes through. */
export function piercedThickness(section: Section | null, axis: 'u' | 'v'): number | null {
  if (!section) return null;
  switch (section.shape) {
    case 'flat':
      return section.thickness;
    case 'angle':
    case 'chs':
    case 'rhs':
      return section.thickness;
    case 'i':
    case 'channel':
    case 'tee':
      // The web lies along v (depth), so a hole across it runs along u; flanges lie along u.
      return axis === 'u' ? section.webThickness : section.flangeThickness;
    default:
      return null;
  }
}

/**
 * Section-plane maps for parameterised IFC profiles, whose origin is the bounding-box centre.
 *  - L: Depth along y (leg A), Width along x (leg B), heel at (−W/2, −D/2).
 *  - U: web on the −x side, flanges towards +x.
 *  - T: flange at +y.
 */
export function parametricMap(section: Section): { toSection: Affine2; box: ProfileGeometry['box'] } {
  switch (section.shape) {
    case 'angle': {
      const D = section.legA;
      const Wd = section.legB;
      return { toSection: [0, 1, D / 2, 1, 0, Wd / 2], box: { minX: -Wd / 2, maxX: Wd / 2, minY: -D / 2, maxY: D / 2 } };
    }
    case 'channel':
      return {
        toSection: [1, 0, section.flangeWidth / 2, 0, 1, 0],
        box: { minX: -section.flangeWidth / 2, maxX: section.flangeWidth / 2, minY: -section.depth / 2, maxY: section.depth / 2 },
      };
    case 'tee':
      return {
        toSection: [1, 0, 0, 0, -1, section.depth / 2],
        box: { minX: -section.flangeWidth / 2, maxX: section.flangeWidth / 2, minY: -section.depth / 2, maxY: section.depth / 2 },
      };
    case 'i':
      return {
        toSection: [1, 0, 0, 0, 1, 0],
        box: { minX: -section.flangeWidth / 2, maxX: section.flangeWidth / 2, minY: -section.depth / 2, maxY: section.depth / 2 },
      };
    case 'round-bar':
      return { toSection: [1, 0, 0, 0, 1, 0], box: { minX: -section.diameter / 2, maxX: section.diameter / 2, minY: -section.diameter / 2, maxY: section.diameter / 2 } };
    case 'chs':
      return { toSection: [1, 0, 0, 0, 1, 0], box: { minX: -section.diameter / 2, maxX: section.diameter / 2, minY: -section.diameter / 2, maxY: section.diameter / 2 } };
    case 'rhs':
      return { toSection: [1, 0, 0, 0, 1, 0], box: { minX: -section.width / 2, maxX: section.width / 2, minY: -section.depth / 2, maxY: section.depth / 2 } };
    case 'flat':
      // Width along x by convention of our own writer; outline-derived flats use flatFromBox.
      return { toSection: [1, 0, 0, 0, 1, 0], box: { minX: -section.width / 2, maxX: section.width / 2, minY: -section.thickness / 2, maxY: section.thickness / 2 } };
  }
}

/** A flat read from its outline box: u across the larger extent, v through the smaller. */
export function flatFromBox(box: ProfileGeometry['box']): { section: Section; toSection: Affine2 } {
  const w = box.maxX - box.minX;
  const h = box.maxY - box.minY;
  const [cx, cy] = [(box.minX + box.maxX) / 2, (box.minY + box.maxY) / 2];
  if (w >= h) return { section: { shape: 'flat', width: round(w), thickness: round(h) }, toSection: [1, 0, -cx, 0, 1, -cy] };
  return { section: { shape: 'flat', width: round(h), thickness: round(w) }, toSection: [0, 1, -cy, 1, 0, -cx] };
}

/**
 * An L outline given as a polygon: the heel is the box corner that is a vertex while the
 * diagonally opposite corner is not. Leg A runs along y from the heel, leg B along x.
 */
export function angleFromOutline(points: [number, number][], thickness: number): { section: Section; toSection: Affine2; box: ProfileGeometry['box'] } | null {
  if (points.length < 6) return null;
  const xs = points.map((p) => p[0]);
  const ys = points.map((p) => p[1]);
  const box = { minX: Math.min(...xs), maxX: Math.max(...xs), minY: Math.min(...ys), maxY: Math.max(...ys) };
  const tol = 1e-3 * Math.max(box.maxX - box.minX, box.maxY - box.minY, 1);
  const isVertex = (x: number, y: number) => points.some((p) => Math.abs(p[0] - x) < tol && Math.abs(p[1] - y) < tol);
  const corners: [number, number][] = [[box.minX, box.minY], [box.maxX, box.minY], [box.maxX, box.maxY], [box.minX, box.maxY]];
  for (let i = 0; i < 4; i++) {
    const [hx, hy] = corners[i];
    const [ox, oy] = corners[(i + 2) % 4];
    if (!isVertex(hx, hy) || isVertex(ox, oy)) continue;
    const sx = ox > hx ? 1 : -1;
    const sy = oy > hy ? 1 : -1;
    const legA = box.maxY - box.minY;
    const legB = box.maxX - box.minX;
    // u = distance from the heel along leg A (y), v = along leg B (x).
    return {
      section: { shape: 'angle', legA: round(legA), legB: round(legB), thickness },
      toSection: [0, sy, -sy * hy, sx, 0, -sx * hx],
      box,
    };
  }
  return null;
}

const round = (v: number) => Math.round(v * 1000) / 1000;
