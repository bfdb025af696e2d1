import type { Section } from '../section-types.ts';

/** One element of the developed strip: y from y0 to y1 (mm) with thickness t (mm). */
export interface StripSegment {
  element: string;
  y0: number;
  y1: number;
  t: number;
  /** Branch number: chains only link holes on the same part (see net-area StripHole.part). */
  part: number;
}

/** The developed (unfolded centre-line) strip of a section. */
export interface DevelopedStrip {
  /** Total developed width, mm. */
  readonly width: number;
  readonly segments: readonly Readonly<StripSegment>[];
  /** True for I and tee: elements meet at a junction with three branches. */
  readonly branched: boolean;
  /** True for CHS/RHS: the strip is a ring cut open at y = 0. */
  readonly closed: boolean;
}

/**
 * Developed strip of a section, along the centre-line of each element (EN 1993-1-1
 * 6.2.2.2(5) and AISC 360-16 B4.3b measure gauges this way; AS 4100 9.1.10 from memory).
 * Conventions, y in mm:
 *  - flat: y = 0 at one edge (u = −width/2).
 *  - angle: y = 0 at the toe of leg A, along A's centre-line to the heel, then along
 *    leg B to its toe; width = legA + legB − t. A back mark ga on A sits at y = legA − ga,
 *    gb on B at y = legA + gb − t, so the gauge across the heel is ga + gb − t.
 *  - channel: y = 0 at the toe of the lower flange (v < 0), along that flange's
 *    centre-line to the web, up the web (between flange centre-lines), along the upper
 *    flange to its toe; width = 2·bf − tw + h − tf. One unbranched strip.
 *  - i: three parts laid end to end (not geometrically joined): lower flange tip to tip
 *    (0…bf, from u = −bf/2), web between flange centre-lines (bf…bf + h − tf, from the
 *    lower flange), upper flange tip to tip (from u = −bf/2).
 *  - tee: flange tip to tip (0…bf), then the stem from the flange centre-line to its toe.
 *  - rhs: mid-wall perimeter cut at the corner (u, v) = (−, −), running along the lower
 *    wall (+u), the right wall (+v), the upper wall (−u), the left wall (−v); corners sharp.
 *  - chs: mid-wall circle, y = rm·θ with θ measured from +u towards +v.
 *  - round-bar: y across the diameter (a cross-hole pierces the full bar).
 */
export function developedStrip(s: Section): DevelopedStrip {
  // A check asks for the strip of one section several times (each hole, net area, width
  // check); sections are never changed once made, so the strip is worked out once per object.
  let strip = strips.get(s);
  if (!strip) strips.set(s, (strip = buildStrip(s)));
  return strip;
}

const strips = new WeakMap<Section, DevelopedStrip>();

function seg(element: string, y0: number, len: number, t: number, part = 0): StripSegment {
  return { element, y0, y1: y0 + len, t, part };
}

function buildStrip(s: Section): DevelopedStrip {
  switch (s.shape) {
    case 'flat':
      return strip([seg('plate', 0, s.width, s.thickness)]);
    case 'angle': {
      const t = s.thickness;
      return strip([seg('leg A', 0, s.legA - t / 2, t), seg('leg B', s.legA - t / 2, s.legB - t / 2, t)]);
    }
    case 'channel': {
      const a = s.flangeWidth - s.webThickness / 2;
      const w = s.depth - s.flangeThickness;
      return strip([seg('lower flange', 0, a, s.flangeThickness), seg('web', a, w, s.webThickness), seg('upper flange', a + w, a, s.flangeThickness)]);
    }
    case 'i': {
      const bf = s.flangeWidth;
      const w = s.depth - s.flangeThickness;
      return strip([seg('lower flange', 0, bf, s.flangeThickness, 0), seg('web', bf, w, s.webThickness, 1), seg('upper flange', bf + w, bf, s.flangeThickness, 2)], true);
    }
    case 'tee':
      return strip([seg('flange', 0, s.flangeWidth, s.flangeThickness, 0), seg('web', s.flangeWidth, s.depth - s.flangeThickness / 2, s.webThickness, 1)], true);
    case 'rhs': {
      const a = s.width - s.thickness;
      const b = s.depth - s.thickness;
      const t = s.thickness;
      return strip([seg('lower wall', 0, a, t), seg('right wall', a, b, t), seg('upper wall', a + b, a, t), seg('left wall', 2 * a + b, b, t)], false, true);
    }
    case 'chs':
      return strip([seg('wall', 0, Math.PI * (s.diameter - s.thickness), s.thickness)], false, true);
    case 'round-bar':
      return strip([seg('bar', 0, s.diameter, s.diameter)]);
  }
}

function strip(segments: StripSegment[], branched = false, closed = false): DevelopedStrip {
  return { width: segments[segments.length - 1].y1, segments, branched, closed };
}

/** Developed width in mm (see developedStrip for the conventions). */
export function developedWidth(s: Section): number {
  return developedStrip(s).width;
}

/**
 * The element at developed position y (mm), or null when y is off the strip.
 * On a boundary the earlier element wins (for an angle, the heel belongs to leg A).
 * `tolerance` (mm) accepts round-off just past either end.
 */
export function segmentAt(s: Section, y: number, tolerance = 0.5): Readonly<StripSegment> | null {
  const { segments, width } = developedStrip(s);
  if (!(y >= -tolerance && y <= width + tolerance)) return null;
  return segments.find((g) => y <= g.y1) ?? segments[segments.length - 1];
}
