/**
 * EN 1993-1-8 3.10.3: single angle in tension connected by one row of bolts in one leg
 * (2005 generation; clause text and β breakpoints via the SBE worked examples). Lengths mm,
 * areas mm², stresses MPa.
 */

/**
 * Reduction factor β2 (2 bolts) or β3 (3 or more bolts), Table 3.8: constant below
 * p1 = 2.5·d0 and above 5·d0, linear between.
 */
export function betaAngle(bolts: number, p1: number, d0: number): number {
  const [lo, hi] = bolts === 2 ? [0.4, 0.7] : [0.5, 0.7];
  const r = (p1 - 2.5 * d0) / (2.5 * d0);
  return lo + (hi - lo) * Math.min(Math.max(r, 0), 1);
}

/**
 * Nu,Rd of a single angle by 3.10.3, N:
 *   1 bolt:  2.0·(e2 − 0.5·d0)·t·fu/γM2   (eq. 3.11)
 *   2 bolts: β2·Anet·fu/γM2               (eq. 3.12)
 *   ≥ 3:     β3·Anet·fu/γM2               (eq. 3.13)
 * e2 is the edge distance across the force to the connected leg's free edge (from memory).
 */
export function angleOneLegNu(p: { bolts: number; p1: number; d0: number; e2: number; t: number; Anet: number; fu: number; gammaM2: number }): { Nu: number; beta: number | null } {
  if (p.bolts <= 1) return { Nu: (2 * (p.e2 - 0.5 * p.d0) * p.t * p.fu) / p.gammaM2, beta: null };
  const beta = betaAngle(p.bolts, p.p1, p.d0);
  return { Nu: (beta * p.Anet * p.fu) / p.gammaM2, beta };
}
