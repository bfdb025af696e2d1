import type { MemberCheckInput } from '../schemas.ts';
import type { CheckResult } from './types.ts';
import { Recorder, fmt } from './trace.ts';
import { prepareMember, type PreparedMember } from './prepare-member.ts';
import { areaSteps, clearDistances, finish } from './common-steps.ts';
import { ktAs4100 } from './kt-as4100.ts';
import { blocks } from './block-geometry.ts';
import { blockShearJ4 } from './block-shear.ts';
import { AS_FUF, coreArea, normaliseBoltGrade, shankArea } from './bolt-data.ts';

/**
 * AS 4100 tension member check (1998 incl. Amdt 1:2012; clause numbers of that edition,
 * believed unchanged in 2020 — from memory, see design-rules §1.1). Forces N, tension positive.
 *   φNt = 0.9·min(Ag·fy, 0.85·kt·An·fu)   (Cl. 7.1, 7.2; φ Table 3.4)
 * With bolts: bolt shear (9.3.2.1), ply bearing/tear-out (9.3.2.4), block shear (9.1.9, 2020 form).
 */
export function checkAs4100(input: MemberCheckInput): CheckResult {
  const rec = new Recorder();
  // Every result names the edition it follows, so reports and exports never have to guess.
  rec.assume('edition', 'AS 4100-1998 incl. Amdt 1:2012; block shear in the AS 4100:2020 form', 'clause numbers of that edition; believed unchanged in AS 4100:2020 (from memory)');
  const m = prepareMember(input, rec);
  const { fy, fu } = m.steel;
  const An = areaSteps(m, rec, 'AS 4100 Cl. 9.1.10 (from memory)');
  const phi = 0.9;
  rec.assume('φ', phi, 'AS 4100 Table 3.4, member in axial tension (from memory; NZS 3404 Table 3.3(1) parallel)');
  const ny = rec.step('Nty', 'gross-section yield', 'Ag·fy', `${fmt(m.Ag)} × ${fmt(fy)}`, m.Ag * fy, 'N', 'AS 4100 Cl. 7.2 (from memory)');
  const auto = ktAs4100(m.section, m.connected);
  const kt = input.overrides.kt ?? auto.kt;
  rec.assume('kt', kt, input.overrides.kt !== undefined ? 'override' : `AS 4100 ${auto.basis}`);
  if (input.overrides.kt === undefined && auto.judgement) rec.warn(`kt = ${auto.kt}: ${auto.basis}; confirm the case.`);
  rec.step('kt', 'correction factor for force distribution', 'Table 7.3.2', String(kt), kt, '', 'AS 4100 Cl. 7.3');
  const nf = rec.step('Ntf', 'net-section fracture', '0.85·kt·An·fu', `0.85 × ${fmt(kt)} × ${fmt(An)} × ${fmt(fu)}`, 0.85 * kt * An * fu, 'N', 'AS 4100 Cl. 7.2 (from memory)');
  rec.mode('gross yield', rec.step('φNty', 'design yield capacity', 'φ·Ag·fy', `${phi} × ${fmt(ny)}`, phi * ny, 'N', 'AS 4100 Cl. 7.1'), 'AS 4100 Cl. 7.2');
  rec.mode('net fracture', rec.step('φNtf', 'design fracture capacity', 'φ·0.85·kt·An·fu', `${phi} × ${fmt(nf)}`, phi * nf, 'N', 'AS 4100 Cl. 7.1'), 'AS 4100 Cl. 7.2');
  if (input.bolts) boltModes(m, rec);
  return finish('AS 4100-1998 incl. Amdt 1:2012', m, rec, An);
}

function boltModes(m: PreparedMember, rec: Recorder): void {
  const b = m.input.bolts!;
  const grade = normaliseBoltGrade(b.grade);
  const fuf = AS_FUF[grade];
  if (fuf === undefined) {
    rec.warn(`Bolt grade "${b.grade}" has no AS 4100 fuf (4.6 or 8.8 expected): bolt checks skipped.`);
    return;
  }
  const n = b.count ?? m.holes.filter((h) => h.connected).length;
  const df = b.diameter;
  const lj = m.l;
  const kr = lj < 300 ? 1 : lj <= 1300 ? 1.075 - lj / 4000 : 0.75;
  rec.step('kr', 'reduction factor for lap length lj', 'lj < 300: 1.0; ≤ 1300: 1.075 − lj/4000; else 0.75', `lj = ${fmt(lj)}`, kr, '', 'AS 4100 Table 9.3.2.1 (from memory)');
  const nn = b.threadsInShearPlane ? b.shearPlanes : 0;
  const nx = b.shearPlanes - nn;
  const Ac = coreArea(df);
  const Ao = shankArea(df);
  const vf = rec.step('Vf', 'nominal shear capacity of one bolt', '0.62·fuf·kr·(nn·Ac + nx·Ao)', `0.62 × ${fuf} × ${fmt(kr)} × (${nn} × ${fmt(Ac)} + ${nx} × ${fmt(Ao)})`, 0.62 * fuf * kr * (nn * Ac + nx * Ao), 'N', 'AS 4100 Cl. 9.3.2.1 (from memory)');
  const phiB = 0.8;
  rec.mode('bolt shear', rec.step('φVf,group', `bolt group in shear (${n} bolts)`, 'n·φ·Vf', `${n} × ${phiB} × ${fmt(vf)}`, n * phiB * vf, 'N', 'AS 4100 Cl. 9.3.2.1'), 'AS 4100 Cl. 9.3.2.1 (from memory)');
  // Ply bearing: 3.2·df·tp·fup, capped by tear-out ae·tp·fup (ae = clear distance + df/2).
  const plies = [{ name: 'member', t: m.holes.find((h) => h.connected)?.t ?? 0, fu: m.steel.fu, e1: b.endDistance }, ...b.plies.map((p, i) => ({ name: `ply ${i + 1}`, t: p.thickness, fu: p.fu, e1: p.endDistance }))];
  let bearingTotal = Infinity;
  for (const ply of plies) {
    const geo = clearDistances(m, ply.e1, (d) => d);
    if (geo.some((g) => g.lc === null)) rec.warn(`AS 4100 ply bearing (${ply.name}): end distance not given, tear-out at the end bolts not checked.`);
    const sum = geo.reduce((a, g) => a + Math.min(3.2 * df * ply.t * ply.fu, g.lc === null ? Infinity : (g.lc + df / 2) * ply.t * ply.fu), 0) * (n / Math.max(geo.length, 1));
    const cap = rec.step(`φVb (${ply.name})`, `ply bearing, ${ply.name} (t = ${fmt(ply.t)} mm, fup = ${fmt(ply.fu)} MPa)`, 'φ·Σ min(3.2·df·tp·fup, ae·tp·fup)', `0.9 × ${fmt(sum)}`, 0.9 * sum, 'N', 'AS 4100 Cl. 9.3.2.4 (from memory)');
    bearingTotal = Math.min(bearingTotal, cap);
  }
  rec.mode('ply bearing', bearingTotal, 'AS 4100 Cl. 9.3.2.4 (from memory)');
  const found = blocks(m, (d) => d);
  if (found.reason) {
    rec.warn(found.reason);
    return;
  }
  const kbs = m.input.overrides.ubs ?? 1;
  let best = Infinity;
  for (const blk of found.blocks) {
    const r = blockShearJ4(blk, m.steel.fy, m.steel.fu, kbs);
    best = Math.min(best, rec.step('φRbs', `block shear, ${blk.description}`, 'φ·min(0.6·fu·Anv + kbs·fu·Ant, 0.6·fy·Agv + kbs·fu·Ant)', `0.75 × min(0.6×${fmt(m.steel.fu)}×${fmt(blk.Anv)} + ${kbs}×${fmt(m.steel.fu)}×${fmt(blk.Ant)}, 0.6×${fmt(m.steel.fy)}×${fmt(blk.Agv)} + ${kbs}×${fmt(m.steel.fu)}×${fmt(blk.Ant)})`, 0.75 * r.Rn, 'N', 'AS 4100:2020 Cl. 9.1.9 (from memory)'));
  }
  rec.assume('φ (block shear)', 0.75, 'AS 4100:2020 Cl. 9.1.9 (from memory, low confidence: may be 0.9)');
  rec.mode('block shear', best, 'AS 4100:2020 Cl. 9.1.9 (from memory)');
}
