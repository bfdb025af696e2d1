/**
 * Minimum yield and tensile strengths (MPa) by product standard and thickness band (mm).
 * All tables from memory (design-rules §7) unless noted; verify against the purchased
 * standards before relying on a band edge.
 */

/** A thickness band: applies while t ≤ upTo (mm); fy and fu in MPa. */
export interface Band {
  upTo: number;
  fy: number;
  fu: number;
}

export interface GradeTable {
  /** Display name, e.g. "AS/NZS 3678-350". */
  grade: string;
  /** Standard the values come from. */
  standard: string;
  bands: Band[];
  /** True where the band edge is "t < limit" rather than "t ≤ limit" (AS/NZS 3679.1). */
  strictEdges?: boolean;
}

const as3678 = (g: number, fy: number[], fu: number): GradeTable => ({
  grade: `AS/NZS 3678-${g}`,
  standard: 'AS/NZS 3678 via AS 4100 Table 2.1 (from memory)',
  bands: [8, 12, 20, 50, 80, 150].map((upTo, i) => ({ upTo, fy: fy[i], fu })),
});

export const AS3678: Record<string, GradeTable> = {
  '250': as3678(250, [280, 260, 250, 250, 240, 230], 410),
  '300': as3678(300, [320, 310, 300, 280, 270, 260], 430),
  '350': as3678(350, [360, 360, 350, 340, 340, 330], 450),
};

export const AS3679: Record<string, GradeTable> = {
  '300': { grade: 'AS/NZS 3679.1-300', standard: 'AS/NZS 3679.1 via AS 4100 Table 2.1 (from memory)', strictEdges: true,
    bands: [{ upTo: 11, fy: 320, fu: 440 }, { upTo: 17.000001, fy: 300, fu: 440 }, { upTo: Infinity, fy: 280, fu: 440 }] },
  '350': { grade: 'AS/NZS 3679.1-350', standard: 'AS/NZS 3679.1 via AS 4100 Table 2.1 (from memory)', strictEdges: true,
    bands: [{ upTo: 11, fy: 360, fu: 480 }, { upTo: 40.000001, fy: 340, fu: 480 }, { upTo: Infinity, fy: 330, fu: 480 }] },
};

// ASTM values in MPa as the metric designations give them (A36/A36M: 250/400; 50 ksi grades: 345/450).
export const ASTM: Record<string, GradeTable> = {
  A36: { grade: 'ASTM A36', standard: 'ASTM A36/A36M (from memory)', bands: [{ upTo: 203.2, fy: 250, fu: 400 }, { upTo: Infinity, fy: 220, fu: 400 }] },
  'A572-50': { grade: 'ASTM A572 Gr 50', standard: 'ASTM A572/A572M (from memory)', bands: [{ upTo: Infinity, fy: 345, fu: 450 }] },
  A992: { grade: 'ASTM A992', standard: 'ASTM A992/A992M (from memory)', bands: [{ upTo: Infinity, fy: 345, fu: 450 }] },
};

/** EN 10025-2 ReH bands (≤16, ≤40, ≤63, ≤80, ≤100, ≤150) and Rm minimum (t < 3, 3…100, 100…150). */
const en = (g: number, reh: number[], rm: [number, number, number]): GradeTable => {
  const edges = [16, 40, 63, 80, 100, 150];
  const bands: Band[] = [];
  // Merge the ReH bands with the Rm bands (Rm changes at 3 and 100 mm).
  bands.push({ upTo: 3 - 1e-9, fy: reh[0], fu: rm[0] });
  edges.forEach((upTo, i) => bands.push({ upTo, fy: reh[i], fu: upTo <= 100 ? rm[1] : rm[2] }));
  return { grade: `S${g}`, standard: 'EN 10025-2 (product standard, from memory)', bands };
};

export const EN10025: Record<string, GradeTable> = {
  S235: en(235, [235, 225, 215, 215, 215, 195], [360, 360, 350]),
  S275: en(275, [275, 265, 255, 245, 235, 225], [430, 410, 400]),
  S355: en(355, [355, 345, 335, 325, 315, 295], [510, 470, 450]),
};

/** EN 1993-1-1 Table 3.1 (simplified: t ≤ 40 and 40 < t ≤ 80 mm), from memory. */
export const EN1993_TABLE_3_1: Record<string, GradeTable> = {
  S235: { grade: 'S235', standard: 'EN 1993-1-1 Table 3.1 (from memory)', bands: [{ upTo: 40, fy: 235, fu: 360 }, { upTo: 80, fy: 215, fu: 360 }] },
  S275: { grade: 'S275', standard: 'EN 1993-1-1 Table 3.1 (from memory)', bands: [{ upTo: 40, fy: 275, fu: 430 }, { upTo: 80, fy: 255, fu: 410 }] },
  S355: { grade: 'S355', standard: 'EN 1993-1-1 Table 3.1 (from memory)', bands: [{ upTo: 40, fy: 355, fu: 510 }, { upTo: 80, fy: 335, fu: 470 }] },
};

/** The band for thickness t (mm), or null when t is beyond the table. */
export function bandFor(table: GradeTable, t: number): Band | null {
  return table.bands.find((b) => t <= b.upTo && !(table.strictEdges && t === b.upTo && Number.isInteger(b.upTo))) ?? null;
}
