import type { PreparedMember } from './prepare-member.ts';
import { fmt, type Recorder } from './trace.ts';
import { clearDistances } from './common-steps.ts';
import { blocks } from './block-geometry.ts';
import { blockShearJ4 } from './block-shear.ts';
import { aiscGroup, shankArea, type AiscBoltGroup } from './bolt-data.ts';
import { MPA_PER_KSI } from '../units.ts';

// Table J3.2 nominal shear stress Fnv, ksi: [threads included (N), excluded (X)]. From memory;
// the 360-05 A325-X value is confirmed via design-rules C12.
const FNV_05: Record<AiscBoltGroup, [number, number]> = { A: [48, 60], B: [60, 75], C: [60, 75] };
const FNV_10: Record<AiscBoltGroup, [number, number]> = { A: [54, 68], B: [68, 84], C: [90, 113] };

/**
 * Nominal shear stress Fnv (MPa) of AISC Table J3.2 for an edition ("360-05", "360-10",
 * "360-16", "360-22"). 360-05 values differ (A325 48/60 ksi); Group C is not in 360-05.
 */
export function aiscFnv(group: AiscBoltGroup, threadsIncluded: boolean, edition: string): number {
  const table = edition === '360-05' ? FNV_05 : FNV_10;
  if (edition === '360-05' && group === 'C') throw new RangeError('Group C bolts are not in AISC 360-05');
  return table[group][threadsIncluded ? 0 : 1] * MPA_PER_KSI;
}

/**
 * Nominal bolt-group shear strength Rn = n·planes·Fnv·Ab (AISC 360 J3.6, eq. J3-1), N.
 * Long end-loaded joints: 360-10 on reduce Fnv by 0.833 beyond 38 in (950 mm);
 * 360-05 by 0.80 beyond 50 in (1270 mm) (both from memory).
 */
export function aiscBoltShear(n: number, d: number, group: AiscBoltGroup, threadsIncluded: boolean, planes: number, edition: string, jointLength = 0): { Rn: number; Fnv: number; longJoint: number } {
  const longJoint = edition === '360-05' ? (jointLength > 1270 ? 0.8 : 1) : jointLength > 950 ? 0.833 : 1;
  const Fnv = aiscFnv(group, threadsIncluded, edition) * longJoint;
  return { Rn: n * planes * Fnv * shankArea(d), Fnv, longJoint };
}

/** Bolt shear, bearing/tear-out and block shear of the end connection (AISC 360 J3.6, J3.10, J4.3). */
export function aiscConnectionModes(m: PreparedMember, rec: Recorder, edition: string, lrfd: boolean): void {
  const b = m.input.bolts!;
  const factor = lrfd ? 0.75 : 0.5; // φ = 0.75 or 1/Ω = 1/2.00 for all three modes
  const fTxt = lrfd ? '0.75 ×' : '1/2.00 ×';
  const group = aiscGroup(b.grade);
  const n = b.count ?? m.holes.filter((h) => h.connected).length;
  let perBoltShear = Infinity;
  if (group === null) rec.warn(`Bolt grade "${b.grade}" is not an AISC group A/B/C bolt: bolt shear skipped.`);
  else {
    const r = aiscBoltShear(n, b.diameter, group, b.threadsInShearPlane, b.shearPlanes, edition, m.l);
    if (r.longJoint < 1) rec.warn(`Long end-loaded joint (l = ${fmt(m.l)} mm): Fnv reduced by ${r.longJoint}.`);
    rec.step('Fnv', `nominal shear stress, group ${group}, threads ${b.threadsInShearPlane ? 'included' : 'excluded'}`, 'Table J3.2', edition, r.Fnv, 'MPa', `AISC ${edition} Table J3.2`);
    const cap = rec.step(lrfd ? 'φRn' : 'Rn/Ω', `bolt shear, ${n} bolts × ${b.shearPlanes} plane(s)`, 'n·planes·Fnv·Ab', `${fTxt} ${n} × ${b.shearPlanes} × ${fmt(r.Fnv)} × ${fmt(shankArea(b.diameter))}`, factor * r.Rn, 'N', `AISC ${edition} J3.6`);
    rec.mode('bolt shear', cap, `AISC ${edition} J3.6`);
    perBoltShear = cap / n;
  }
  // Bearing and tear-out per bolt per ply (360-16 J3.10): min(2.4·d·t·Fu, 1.2·lc·t·Fu), or 3.0/1.5 when deformation is not a consideration.
  const [kb, kt] = b.deformationConsidered ? [2.4, 1.2] : [3.0, 1.5];
  const plies = [{ name: 'member', t: m.holes.find((h) => h.connected)?.t ?? 0, fu: m.steel.fu, e1: b.endDistance }, ...b.plies.map((p, i) => ({ name: `ply ${i + 1}`, t: p.thickness, fu: p.fu, e1: p.endDistance }))];
  let bearing = Infinity;
  let groupSum = 0;
  const perBolt: number[] = [];
  for (const ply of plies) {
    const geo = clearDistances(m, ply.e1, (d) => d);
    if (geo.some((g) => g.lc === null)) rec.warn(`AISC J3.10 (${ply.name}): end distance not given, tear-out at the end bolts not checked.`);
    const each = geo.map((g) => factor * Math.min(kb * b.diameter * ply.t * ply.fu, g.lc === null ? Infinity : kt * g.lc * ply.t * ply.fu));
    each.forEach((v, i) => (perBolt[i] = Math.min(perBolt[i] ?? Infinity, v)));
    const sum = each.reduce((a, v) => a + v, 0) * (n / Math.max(each.length, 1));
    bearing = Math.min(bearing, rec.step(lrfd ? 'φRn' : 'Rn/Ω', `bearing and tear-out, ${ply.name} (t = ${fmt(ply.t)} mm, Fu = ${fmt(ply.fu)} MPa)`, `Σ min(${kb}·d·t·Fu, ${kt}·lc·t·Fu)`, `${fTxt} Σ over ${each.length} holes`, sum, 'N', 'AISC 360-16 J3.10'));
  }
  if (Number.isFinite(bearing)) rec.mode('bearing and tear-out', bearing, 'AISC 360-16 J3.10');
  groupSum = perBolt.reduce((a, v) => a + Math.min(v, perBoltShear), 0) * (n / Math.max(perBolt.length, 1));
  if (Number.isFinite(groupSum) && groupSum < Math.min(bearing, perBoltShear * n) - 1e-6) {
    rec.mode('bolt group (per-bolt minimum)', rec.step(lrfd ? 'φRn' : 'Rn/Ω', 'bolt group: Σ per bolt of min(shear, bearing, tear-out)', 'Σ min(...)', '', groupSum, 'N', 'AISC 360-16 J3.6, J3.10'), 'AISC 360-16 J3.6, J3.10');
  }
  const found = blocks(m, (_d, deducted) => deducted);
  if (found.reason) {
    rec.warn(found.reason);
    return;
  }
  const ubs = m.input.overrides.ubs ?? 1;
  rec.assume('Ubs', ubs, m.input.overrides.ubs !== undefined ? 'override' : 'AISC 360-16 J4.3: uniform tension stress');
  let best = Infinity;
  for (const blk of found.blocks) {
    const r = blockShearJ4(blk, m.steel.fy, m.steel.fu, ubs);
    best = Math.min(best, rec.step(lrfd ? 'φRn' : 'Rn/Ω', `block shear, ${blk.description}`, 'min(0.6·Fu·Anv + Ubs·Fu·Ant, 0.6·Fy·Agv + Ubs·Fu·Ant)', `${fTxt} min(0.6×${fmt(m.steel.fu)}×${fmt(blk.Anv)} + ${ubs}×${fmt(m.steel.fu)}×${fmt(blk.Ant)}, 0.6×${fmt(m.steel.fy)}×${fmt(blk.Agv)} + ${ubs}×${fmt(m.steel.fu)}×${fmt(blk.Ant)})`, factor * r.Rn, 'N', 'AISC 360-16 J4.3'));
  }
  rec.mode('block shear', best, 'AISC 360-16 J4.3');
}
