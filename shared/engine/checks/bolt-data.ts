/**
 * Bolt data shared by the connection checks. Diameters mm, areas mm², stresses MPa.
 */

/** ISO 261 coarse thread pitches (mm) by nominal diameter; common practice. */
const COARSE_PITCH: Record<number, number> = { 10: 1.5, 12: 1.75, 14: 2, 16: 2, 18: 2.5, 20: 2.5, 22: 2.5, 24: 3, 27: 3, 30: 3.5, 33: 3.5, 36: 4, 39: 4, 42: 4.5, 48: 5 };

function pitch(d: number): number {
  const p = COARSE_PITCH[d];
  if (p === undefined) throw new RangeError(`no coarse thread pitch known for M${d}`);
  return p;
}

/** Plain shank area πd²/4, mm² (AS 4100 Ao; AISC Ab; EN A). */
export function shankArea(d: number): number {
  return (Math.PI * d * d) / 4;
}

/**
 * Tensile stress area As = π/4·(d − 0.9382·P)², mm² (ISO 898-1; common practice).
 * M20 → 245 mm². Used by EN 1993-1-8 Table 3.4 when threads are in the shear plane.
 */
export function stressArea(d: number): number {
  return (Math.PI / 4) * (d - 0.9382 * pitch(d)) ** 2;
}

/**
 * Minor-diameter (core) area Ac = π/4·(d − 1.22687·P)², mm² (AS 1275 thread form;
 * common practice). M20 → 225 mm². AS 4100 9.3.2.1 uses it for threads in the shear plane
 * (from memory).
 */
export function coreArea(d: number): number {
  return (Math.PI / 4) * (d - 1.22687 * pitch(d)) ** 2;
}

/** ISO property classes: nominal fub (MPa) per EN 1993-1-8 Table 3.1 (from memory). */
export const ISO_FUB: Record<string, number> = { '4.6': 400, '4.8': 400, '5.6': 500, '5.8': 500, '6.8': 600, '8.8': 800, '10.9': 1000 };

/** AS 4100 Table 9.3.1 minimum tensile strength of bolts fuf, MPa (from memory). */
export const AS_FUF: Record<string, number> = { '4.6': 400, '8.8': 830 };

/** AISC bolt group (Table J3.2 grouping): A = A325/F1852/F3125 A325, B = A490/F2280, C = F3043. */
export type AiscBoltGroup = 'A' | 'B' | 'C';

/** Normalise a bolt grade string: "8.8/S" → "8.8", "A325-X" → "A325". */
export function normaliseBoltGrade(g: string): string {
  const s = g.toUpperCase().replace(/\s+/g, '');
  const iso = /(\d{1,2}\.\d)/.exec(s);
  if (iso) return iso[1];
  return s;
}

/** AISC group for a grade name, or null when it is not an ASTM structural bolt. */
export function aiscGroup(g: string): AiscBoltGroup | null {
  const s = g.toUpperCase().replace(/[\s_]+/g, '');
  if (/A325|F1852|GROUP-?A|^A$/.test(s)) return 'A';
  if (/A490|F2280|GROUP-?B|^B$/.test(s)) return 'B';
  if (/F3043|F3111|GROUP-?C|^C$/.test(s)) return 'C';
  return null;
}
