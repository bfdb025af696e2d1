import type { MemberCheckInput } from '../schemas.ts';
import type { CheckResult } from './types.ts';
import { Recorder, fmt } from './trace.ts';
import { prepareMember, type PreparedMember } from './prepare-member.ts';
import { areaSteps, finish } from './common-steps.ts';
import { angleOneLegNu } from './angle-en-3-10-3.ts';
import { enConnectionModes } from './en1993-connection.ts';

/**
 * EN 1993-1-1 6.2.3 / EN 1993-1-8 tension check (2005 generation; γ values are
 * National Annex settings — recommended γM0 = 1.00, γM2 = 1.25). Forces N, tension positive.
 *   Npl,Rd = A·fy/γM0 (eq. 6.6);  Nu,Rd = 0.9·Anet·fu/γM2 (eq. 6.7)
 *   angle by one leg, one bolt row: Nu,Rd from EN 1993-1-8 3.10.3 (β2/β3), still capped by Npl,Rd.
 */
export function checkEn1993(input: MemberCheckInput): CheckResult {
  const rec = new Recorder();
  rec.assume('edition', 'EN 1993-1-1:2005 and EN 1993-1-8:2005 (first generation)', 'partial factors and fy/fu source as set for the national annex');
  const m = prepareMember(input, rec);
  const gM0 = input.overrides.gammaM0 ?? 1.0;
  const gM2 = input.overrides.gammaM2 ?? 1.25;
  rec.assume('γM0', gM0, input.overrides.gammaM0 !== undefined ? 'override' : 'EN 1993-1-1 6.1 recommended value (check the National Annex)');
  rec.assume('γM2', gM2, input.overrides.gammaM2 !== undefined ? 'override' : 'EN 1993-1-1 6.1 / EN 1993-1-8 Table 2.1 recommended value (check the National Annex)');
  rec.assume('fy/fu source', input.settings.gradeSource === 'table-3.1' ? 'EN 1993-1-1 Table 3.1' : 'product standard (EN 10025-2)', 'setting (National Annex choice)');
  const { fy, fu } = m.steel;
  const An = areaSteps(m, rec, 'EN 1993-1-1 6.2.2.2');
  const npl = rec.step('Npl,Rd', 'plastic resistance of the gross section', 'A·fy/γM0', `${fmt(m.Ag)} × ${fmt(fy)} / ${gM0}`, (m.Ag * fy) / gM0, 'N', 'EN 1993-1-1 6.2.3(2) eq. 6.6');
  rec.mode('gross yield (Npl,Rd)', npl, 'EN 1993-1-1 eq. 6.6');
  const angle = angleRule(m);
  if (angle) {
    const { Nu, beta } = angleOneLegNu({ ...angle, Anet: angle.Anet, fu, gammaM2: gM2 });
    if (beta !== null) {
      rec.step(angle.bolts === 2 ? 'β2' : 'β3', `reduction factor, ${angle.bolts} bolts in one row, p1 = ${fmt(angle.p1)} mm`, '0.4/0.5 at p1 ≤ 2.5·d0 … 0.7 at p1 ≥ 5·d0, linear', `p1/d0 = ${fmt(angle.p1 / angle.d0)}`, beta, '', 'EN 1993-1-8 3.10.3 Table 3.8');
      if (angle.smallerLeg) rec.step('Anet', 'net area of an equal angle with legs equal to the smaller (connected) leg', 'An − t·(b_long − b_short)', `${fmt(An)} − ${fmt(angle.t)} × ${fmt(angle.legDiff)}`, angle.Anet, 'mm²', 'EN 1993-1-8 3.10.3(2)');
    }
    const sub = beta === null ? `2.0 × (${fmt(angle.e2)} − 0.5 × ${fmt(angle.d0)}) × ${fmt(angle.t)} × ${fmt(fu)} / ${gM2}` : `${fmt(beta)} × ${fmt(angle.Anet)} × ${fmt(fu)} / ${gM2}`;
    const nu = rec.step('Nu,Rd', 'ultimate resistance, angle connected by one leg', beta === null ? '2.0·(e2 − 0.5·d0)·t·fu/γM2' : 'β·Anet·fu/γM2', sub, Nu, 'N', `EN 1993-1-8 3.10.3 eq. ${beta === null ? '3.11' : angle.bolts === 2 ? '3.12' : '3.13'}`);
    rec.mode('net fracture, angle by one leg (Nu,Rd)', nu, 'EN 1993-1-8 3.10.3');
  } else {
    if (m.section.shape !== 'flat' && m.connected !== 'all') {
      rec.warn('Member connected through some of its elements with no explicit EN rule (two bolt rows in an angle leg, channel by the web, tee by the flange …): eq. 6.7 used as is; review the eccentricity.');
    }
    const nu = rec.step('Nu,Rd', 'ultimate resistance of the net section', '0.9·Anet·fu/γM2', `0.9 × ${fmt(An)} × ${fmt(fu)} / ${gM2}`, (0.9 * An * fu) / gM2, 'N', 'EN 1993-1-1 6.2.3(2) eq. 6.7');
    rec.mode('net fracture (Nu,Rd)', nu, 'EN 1993-1-1 eq. 6.7');
  }
  if (input.bolts) enConnectionModes(m, rec, gM0, gM2);
  return finish('EN 1993-1-1:2005 / EN 1993-1-8:2005', m, rec, An);
}

/** The data for 3.10.3 when it applies: a single angle with one row of bolts in the connected leg. */
function angleRule(m: PreparedMember) {
  const s = m.section;
  if (s.shape !== 'angle' || m.lines.length !== 1) return null;
  const line = m.lines[0];
  const t = s.thickness;
  const legB = m.connected === 'leg B';
  const [own, other] = legB ? [s.legB, s.legA] : [s.legA, s.legB];
  const holes = line.holes;
  const p1 = m.input.bolts?.pitch ?? (holes.length > 1 ? Math.min(...holes.slice(1).map((h, i) => h.x - holes[i].x)) : 0);
  const e2 = m.input.bolts?.edgeDistance ?? (legB ? m.strip.width - line.y : line.y);
  const smallerLeg = own < other;
  const legDiff = other - own;
  const An = Math.min(m.net.netArea, m.Ag);
  return { bolts: holes.length, p1, d0: holes[0].d, e2, t, smallerLeg, legDiff, Anet: smallerLeg ? An - t * legDiff : An };
}
