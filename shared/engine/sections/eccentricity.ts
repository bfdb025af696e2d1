import type { Section } from '../section-types.ts';
import { filletArea, filletCentroid, grossArea } from './gross-area.ts';

/** Which elements carry the end connection. */
export type ConnectedElements = 'all' | 'leg A' | 'leg B' | 'flanges' | 'flange' | 'web';

/**
 * Connection eccentricity x̄ for shear lag (AISC 360-16 Table D3.1, Case 2: distance
 * from the connection plane to the centroid of the part of the section on one side of
 * it; Commentary Fig. C-D3.1), in mm. Returns null where the engine has no rule (the
 * caller must then supply x̄ or U).
 *  - angle by one leg: centroid distance from the outer face of the connected leg.
 *  - channel by the web: centroid distance from the back of the web.
 *  - i by the flanges: centroid of the half section (a tee) from the flange's outer face.
 *  - i by the web: centroid of the half section split at the web mid-plane, from the web face.
 *  - tee by the flange: centroid distance from the flange's outer face.
 *  - chs (Case 5): D/π; rhs single concentric gusset (Case 6): (B² + 2BH)/(4(B + H)),
 *    B measured perpendicular to the gusset (taken here as the width).
 *  - flat, or all elements connected: 0.
 */
export function connectionEccentricity(s: Section, connected: ConnectedElements): number | null {
  if (connected === 'all' || s.shape === 'flat' || s.shape === 'round-bar') return 0;
  switch (s.shape) {
    case 'angle': {
      const t = s.thickness;
      // Outer faces: leg A's along u (v = 0), leg B's along v (u = 0).
      const other = connected === 'leg B' ? s.legA : s.legB;
      const fr = filletArea(s.rootRadius);
      const ft = filletArea(s.toeRadius);
      const cr = filletCentroid(s.rootRadius);
      const ct = filletCentroid(s.toeRadius);
      // Moments about the connected leg's outer face: connected leg, then the other leg beyond t,
      // root fillet, toe of the connected leg, toe of the other leg.
      const ownLen = connected === 'leg B' ? s.legB : s.legA;
      const m = ownLen * t * (t / 2) + (other - t) * t * (t + (other - t) / 2) + fr * (t + cr) - ft * (t - ct) - ft * (other - ct);
      return m / grossArea(s);
    }
    case 'channel': {
      if (connected !== 'web') return null;
      const { depth: h, flangeWidth: bf, webThickness: tw, flangeThickness: tf } = s;
      const m = h * tw * (tw / 2) + 2 * (bf - tw) * tf * (tw + (bf - tw) / 2)
        + 2 * filletArea(s.rootRadius) * (tw + filletCentroid(s.rootRadius)) - 2 * filletArea(s.toeRadius) * (bf - filletCentroid(s.toeRadius));
      return m / grossArea(s);
    }
    case 'i': {
      const { depth: h, flangeWidth: bf, webThickness: tw, flangeThickness: tf } = s;
      const fr = filletArea(s.rootRadius);
      const ft = filletArea(s.toeRadius);
      if (connected === 'flanges' || connected === 'flange') {
        const hw = h / 2 - tf;
        const a = bf * tf + hw * tw + 2 * fr - 2 * ft;
        const m = bf * tf * (tf / 2) + hw * tw * (tf + hw / 2) + 2 * fr * (tf + filletCentroid(s.rootRadius)) - 2 * ft * (tf - filletCentroid(s.toeRadius));
        return m / a;
      }
      if (connected === 'web') {
        const out = (bf - tw) / 2;
        const a = h * (tw / 2) + 2 * out * tf + 2 * fr - 2 * ft;
        const m = h * (tw / 2) * (tw / 4) + 2 * out * tf * (tw / 2 + out / 2) + 2 * fr * (tw / 2 + filletCentroid(s.rootRadius)) - 2 * ft * (bf / 2 - filletCentroid(s.toeRadius));
        return m / a - tw / 2;
      }
      return null;
    }
    case 'tee': {
      if (connected !== 'flange' && connected !== 'flanges') return null;
      const { depth: h, flangeWidth: bf, webThickness: tw, flangeThickness: tf } = s;
      const m = bf * tf * (tf / 2) + (h - tf) * tw * (tf + (h - tf) / 2) + 2 * filletArea(s.rootRadius) * (tf + filletCentroid(s.rootRadius)) - 2 * filletArea(s.toeRadius) * (tf - filletCentroid(s.toeRadius));
      return m / grossArea(s);
    }
    case 'chs':
      return s.diameter / Math.PI;
    case 'rhs':
      return (s.width ** 2 + 2 * s.width * s.depth) / (4 * (s.width + s.depth));
  }
}

/**
 * Gross area of the directly connected elements, mm² (AISC 360-16 D3: for open
 * sections U need not be less than this over Ag). Null for hollow sections and
 * plates, where the floor does not apply.
 */
export function connectedElementArea(s: Section, connected: ConnectedElements): number | null {
  switch (s.shape) {
    case 'angle':
      return (connected === 'leg B' ? s.legB : s.legA) * s.thickness;
    case 'channel':
      return connected === 'web' ? s.depth * s.webThickness : connected === 'flanges' ? 2 * s.flangeWidth * s.flangeThickness : null;
    case 'i':
      return connected === 'web' ? (s.depth - 2 * s.flangeThickness) * s.webThickness : connected === 'flanges' ? 2 * s.flangeWidth * s.flangeThickness : null;
    case 'tee':
      return connected === 'web' ? (s.depth - s.flangeThickness) * s.webThickness : s.flangeWidth * s.flangeThickness;
    default:
      return null;
  }
}
