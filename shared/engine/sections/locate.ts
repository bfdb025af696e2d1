import type { Section } from '../section-types.ts';
import { developedStrip, type StripSegment } from './developed-strip.ts';

/** Where a hole sits on the developed strip: y (mm), pierced thickness t (mm), element and branch. */
export interface StripLocation {
  y: number;
  t: number;
  element: string;
  part: number;
}

// Helpers take what they need as arguments instead of closing over it: this runs for every
// hole of an import, and a closure per call costs more than the test it makes.
function inside(tol: number, a: number, lo: number, hi: number): boolean {
  return a >= lo - tol && a <= hi + tol;
}

function clamp(a: number, lo: number, hi: number): number {
  return Math.min(Math.max(a, lo), hi);
}

function onSegment(segs: readonly Readonly<StripSegment>[], i: number, y: number): StripLocation {
  const g = segs[i];
  return { y: clamp(y, g.y0, g.y1), t: g.t, element: g.element, part: g.part };
}

/**
 * Map a hole centre given in the section-plane frame of section-types.ts (u, v in mm)
 * to the developed strip (conventions in developed-strip.ts). Returns null when the
 * point is not on material (outside the outline, or in the void of a hollow section).
 * `tolerance` (mm, default 0.5) absorbs model round-off at faces.
 * A point in the square where two elements overlap (angle heel, channel corner) is
 * mapped to the junction of the centre-lines: a hole there is unusual and its gauge
 * to either leg is ambiguous.
 */
export function locateOnStrip(s: Section, p: { u: number; v: number }, tolerance = 0.5): StripLocation | null {
  const { u, v } = p;
  const tol = tolerance;
  const segs = developedStrip(s).segments;
  switch (s.shape) {
    case 'flat':
      return inside(tol, u, -s.width / 2, s.width / 2) && inside(tol, v, -s.thickness / 2, s.thickness / 2) ? onSegment(segs, 0, u + s.width / 2) : null;
    case 'angle': {
      const t = s.thickness;
      if (!inside(tol, u, 0, s.legA) || !inside(tol, v, 0, s.legB)) return null;
      if (u > t + tol && v > t + tol) return null; // inside the re-entrant corner, off material
      if (u >= t && v <= t + tol) return onSegment(segs, 0, s.legA - u);
      if (v >= t && u <= t + tol) return onSegment(segs, 1, s.legA + v - t);
      return onSegment(segs, 0, s.legA - t / 2); // heel square
    }
    case 'channel': {
      const { depth: h, flangeWidth: bf, webThickness: tw, flangeThickness: tf } = s;
      if (!inside(tol, u, 0, bf) || !inside(tol, v, -h / 2, h / 2)) return null;
      const inFlange = Math.abs(v) >= h / 2 - tf - tol;
      const a = bf - tw / 2;
      if (u > tw + tol) {
        if (!inFlange) return null;
        return v < 0 ? onSegment(segs, 0, bf - u) : onSegment(segs, 2, a + (h - tf) + (u - tw / 2));
      }
      if (inFlange && u > tw / 2 + tol) return v < 0 ? onSegment(segs, 0, bf - u) : onSegment(segs, 2, a + (h - tf) + (u - tw / 2));
      return onSegment(segs, 1, a + v + (h - tf) / 2);
    }
    case 'i': {
      const { depth: h, flangeWidth: bf, webThickness: tw, flangeThickness: tf } = s;
      if (!inside(tol, u, -bf / 2, bf / 2) || !inside(tol, v, -h / 2, h / 2)) return null;
      if (Math.abs(v) >= h / 2 - tf) return v < 0 ? onSegment(segs, 0, u + bf / 2) : onSegment(segs, 2, bf + h - tf + u + bf / 2);
      if (!inside(tol, u, -tw / 2, tw / 2)) return null;
      return onSegment(segs, 1, bf + v + (h - tf) / 2);
    }
    case 'tee': {
      // v is measured from the flange's outer face into the stem; its sign is ignored.
      const { depth: h, flangeWidth: bf, webThickness: tw, flangeThickness: tf } = s;
      const d = Math.abs(v);
      if (!inside(tol, d, 0, h)) return null;
      if (d <= tf) return inside(tol, u, -bf / 2, bf / 2) ? onSegment(segs, 0, u + bf / 2) : null;
      return inside(tol, u, -tw / 2, tw / 2) ? onSegment(segs, 1, bf + d - tf / 2) : null;
    }
    case 'rhs': {
      const { width: B, depth: H, thickness: t } = s;
      if (!inside(tol, u, -B / 2, B / 2) || !inside(tol, v, -H / 2, H / 2)) return null;
      const a = (B - t) / 2;
      const b = (H - t) / 2;
      if (Math.abs(v) >= H / 2 - t - tol) {
        const x = clamp(u, -a, a);
        return v < 0 ? onSegment(segs, 0, x + a) : onSegment(segs, 2, 2 * a + 2 * b + (a - x));
      }
      if (Math.abs(u) < B / 2 - t - tol) return null; // in the void
      const w = clamp(v, -b, b);
      return u > 0 ? onSegment(segs, 1, 2 * a + w + b) : onSegment(segs, 3, 4 * a + 2 * b + (b - w));
    }
    case 'chs': {
      const r = Math.hypot(u, v);
      if (!inside(tol, r, s.diameter / 2 - s.thickness, s.diameter / 2)) return null;
      let theta = Math.atan2(v, u);
      if (theta < 0) theta += 2 * Math.PI;
      return onSegment(segs, 0, ((s.diameter - s.thickness) / 2) * theta);
    }
    case 'round-bar': {
      // A cross-hole along v removes d × the chord at offset u.
      const R = s.diameter / 2;
      if (Math.hypot(u, v) > R + tol) return null;
      const x = clamp(u, -R, R);
      return { y: x + R, t: 2 * Math.sqrt(R * R - x * x), element: 'bar', part: 0 };
    }
  }
}
