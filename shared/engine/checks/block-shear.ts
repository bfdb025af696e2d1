/**
 * Block shear / block tearing nominal resistances, N. Areas mm², stresses MPa.
 */

/** Areas of one block, mm². */
export interface BlockAreas {
  Agv: number;
  Anv: number;
  Agt: number;
  Ant: number;
}

/**
 * AISC 360-16 J4.3 (eq. J4-5, same from 360-05 on; from memory, arithmetic checked on
 * design-rules C8/C8b): Rn = 0.6·Fu·Anv + Ubs·Fu·Ant ≤ 0.6·Fy·Agv + Ubs·Fu·Ant.
 * The same form serves AS 4100:2020 9.1.9 with kbs in place of Ubs (from memory).
 * @returns nominal Rn in N (before φ or Ω).
 */
export function blockShearJ4(a: BlockAreas, fy: number, fu: number, ubs: number): { Rn: number; rupture: number; yieldCap: number } {
  const rupture = 0.6 * fu * a.Anv + ubs * fu * a.Ant;
  const yieldCap = 0.6 * fy * a.Agv + ubs * fu * a.Ant;
  return { Rn: Math.min(rupture, yieldCap), rupture, yieldCap };
}

/**
 * Pre-2005 AISC LRFD two-branch rule (design-rules §5.2, C8): if Fu·Ant ≥ 0.6·Fu·Anv,
 * Rn = 0.6·Fy·Agv + Fu·Ant (shear yield + tension fracture); otherwise
 * Rn = 0.6·Fu·Anv + Fy·Agt (shear fracture + tension yield). N.
 */
export function blockShearLrfd1999(a: BlockAreas, fy: number, fu: number): number {
  return fu * a.Ant >= 0.6 * fu * a.Anv ? 0.6 * fy * a.Agv + fu * a.Ant : 0.6 * fu * a.Anv + fy * a.Agt;
}

/**
 * EN 1993-1-8 3.10.2 block tearing (2005 generation; via SBE Part 5): design value, N.
 *  concentric (eq. 3.9):  Veff,1,Rd = fu·Ant/γM2 + (1/√3)·fy·Anv/γM0
 *  eccentric  (eq. 3.10): Veff,2,Rd = 0.5·fu·Ant/γM2 + (1/√3)·fy·Anv/γM0
 */
export function blockTearingEn(a: BlockAreas, fy: number, fu: number, gammaM0: number, gammaM2: number, eccentric: boolean): number {
  return ((eccentric ? 0.5 : 1) * fu * a.Ant) / gammaM2 + (fy * a.Anv) / (Math.sqrt(3) * gammaM0);
}
