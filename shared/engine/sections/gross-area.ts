import type { Section } from '../section-types.ts';

/**
 * Area a fillet of radius r adds at a re-entrant corner (or a rounded corner removes), mm².
 * (1 − π/4)·r²: the square r × r less a quarter circle. Common practice.
 */
export function filletArea(r: number | undefined): number {
  return r ? (1 - Math.PI / 4) * r * r : 0;
}

/** Distance of a fillet's centroid from the corner square's re-entrant corner, along each axis: r·(10 − 3π)/(3·(4 − π)). */
export function filletCentroid(r: number | undefined): number {
  return r ? (r * (10 - 3 * Math.PI)) / (3 * (4 - Math.PI)) : 0;
}

/**
 * Gross cross-section area Ag in mm² from IFC-style profile parameters (mm).
 * Root radii add fillet area and toe/edge radii remove it, as in IfcLShapeProfileDef,
 * IfcUShapeProfileDef, IfcIShapeProfileDef and IfcTShapeProfileDef. Flange taper is
 * not modelled (parallel flanges). RHS corners: outer radius ro, inner ri = max(ro − t, 0).
 * A tabulated Ag, where known, should be preferred for the net-area arithmetic
 * (design-rules §2.6): callers pass it as an override.
 */
export function grossArea(s: Section): number {
  switch (s.shape) {
    case 'flat':
      return s.width * s.thickness;
    case 'angle': {
      const t = s.thickness;
      return t * (s.legA + s.legB - t) + filletArea(s.rootRadius) - 2 * filletArea(s.toeRadius);
    }
    case 'channel':
      return 2 * s.flangeWidth * s.flangeThickness + (s.depth - 2 * s.flangeThickness) * s.webThickness
        + 2 * filletArea(s.rootRadius) - 2 * filletArea(s.toeRadius);
    case 'i':
      return 2 * s.flangeWidth * s.flangeThickness + (s.depth - 2 * s.flangeThickness) * s.webThickness
        + 4 * filletArea(s.rootRadius) - 4 * filletArea(s.toeRadius);
    case 'tee':
      return s.flangeWidth * s.flangeThickness + (s.depth - s.flangeThickness) * s.webThickness
        + 2 * filletArea(s.rootRadius) - 2 * filletArea(s.toeRadius);
    case 'round-bar':
      return (Math.PI * s.diameter ** 2) / 4;
    case 'chs':
      return (Math.PI * (s.diameter ** 2 - (s.diameter - 2 * s.thickness) ** 2)) / 4;
    case 'rhs': {
      const t = s.thickness;
      const ro = s.outerRadius ?? 0;
      const ri = Math.max(ro - t, 0);
      return 2 * t * (s.width + s.depth - 2 * t) - (4 - Math.PI) * (ro * ro - ri * ri);
    }
  }
}
