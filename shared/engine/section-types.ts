/**
 * Cross-section descriptions the engine accepts. All lengths in mm.
 *
 * This file is a contract between the IFC reader (server/ifc) and the engine:
 * the reader produces these shapes from IFC profile definitions or catalogue names,
 * the engine derives gross area, centroid and the developed strip from them.
 *
 * Section-plane frame used by `locateOnStrip` (the reader converts IFC profile
 * coordinates into it):
 *  - flat:    origin at the centre; u across the width, v through the thickness.
 *  - angle:   origin at the heel's outer corner; u along the outer face of leg A
 *             (towards A's toe), v along the outer face of leg B (towards B's toe).
 *  - channel: origin at the outer back of the web, mid-depth; u along the flanges
 *             (towards the toes), v along the depth.
 *  - i, tee:  origin at the centre of the flange width at the flange's outer face
 *             (tee) or at the centroid of the bounding box (i); u across the flange
 *             width, v along the depth.
 *  - round-bar, chs, rhs: origin at the centre.
 */
export type Section =
  | { shape: 'flat'; width: number; thickness: number }
  | {
      shape: 'angle';
      legA: number;
      legB: number;
      thickness: number;
      rootRadius?: number;
      toeRadius?: number;
      /** Leg through which the member is bolted; defaults to A. */
      connectedLeg?: 'A' | 'B';
    }
  | {
      shape: 'channel' | 'i' | 'tee';
      depth: number;
      flangeWidth: number;
      webThickness: number;
      flangeThickness: number;
      rootRadius?: number;
      toeRadius?: number;
    }
  | { shape: 'round-bar'; diameter: number }
  | { shape: 'chs'; diameter: number; thickness: number }
  | { shape: 'rhs'; depth: number; width: number; thickness: number; outerRadius?: number };

export type SectionShape = Section['shape'];
