import type { PreparedMember } from './prepare-member.ts';
import { connectedElementArea } from '../sections/eccentricity.ts';
import { fmt, type Recorder } from './trace.ts';

/**
 * Shear-lag factor U, AISC 360-16 Table D3.1 (cases from reproductions of the table;
 * 360-22 wording from memory). Dimensionless.
 *  Case 1: every element connected → 1.0.
 *  Case 2: 1 − x̄/l; Case 7 (W/M/S/HP/tees) and Case 8 (angles) may be used instead —
 *          the larger is taken ("if U is also computed by Case 2, the larger may be used").
 *  D3 floor for open shapes: U ≥ connected gross area / Ag (from memory).
 */
export function shearLagU(m: PreparedMember, rec: Recorder): number {
  const o = m.input.overrides.U;
  if (o !== undefined) {
    rec.assume('U', o, 'override');
    return rec.step('U', 'shear-lag factor (override)', 'U', String(o), o, '', 'AISC 360-16 D3');
  }
  const s = m.section;
  if (m.connected === 'all' || s.shape === 'flat' || s.shape === 'round-bar') {
    rec.assume('U case', 'Table D3.1 Case 1', 'force transmitted directly to every element');
    return rec.step('U', 'shear-lag factor, Case 1', 'U = 1.0', '1.0', 1, '', 'AISC 360-16 Table D3.1 Case 1');
  }
  const candidates: Array<{ u: number; name: string }> = [];
  if (m.xBar !== null && m.l > 0) {
    const u2 = 1 - m.xBar / m.l;
    candidates.push({ u: u2, name: 'Case 2' });
    rec.step('U2', 'shear-lag factor, Case 2', '1 − x̄/l', `1 − ${fmt(m.xBar)}/${fmt(m.l)}`, u2, '', 'AISC 360-16 Table D3.1 Case 2');
  }
  const n = m.perLine;
  if (!m.welded && s.shape === 'angle' && n >= 3) {
    const u8 = n >= 4 ? 0.8 : 0.6;
    candidates.push({ u: u8, name: 'Case 8' });
    rec.step('U8', `shear-lag factor, Case 8 (${n} fasteners per line)`, '≥ 4 per line: 0.80; 3 per line: 0.60', String(n), u8, '', 'AISC 360-16 Table D3.1 Case 8');
  }
  if (!m.welded && (s.shape === 'i' || s.shape === 'tee')) {
    if ((m.connected === 'flanges' || m.connected === 'flange') && n >= 3) {
      // For tees d is the parent section's depth: 2 × the tee depth (from memory).
      const d = s.shape === 'tee' ? 2 * s.depth : s.depth;
      const u7 = s.flangeWidth >= (2 / 3) * d ? 0.9 : 0.85;
      candidates.push({ u: u7, name: 'Case 7' });
      rec.step('U7', 'shear-lag factor, Case 7 (flange connected, ≥ 3 per line)', 'bf ≥ 2d/3: 0.90; else 0.85', `bf = ${fmt(s.flangeWidth)}, 2d/3 = ${fmt((2 / 3) * d)}`, u7, '', 'AISC 360-16 Table D3.1 Case 7');
    } else if (m.connected === 'web' && n >= 4) {
      candidates.push({ u: 0.7, name: 'Case 7' });
      rec.step('U7', 'shear-lag factor, Case 7 (web connected, ≥ 4 per line)', '0.70', '0.70', 0.7, '', 'AISC 360-16 Table D3.1 Case 7');
    }
  }
  let best = candidates.reduce<{ u: number; name: string } | null>((a, c) => (a === null || c.u > a.u ? c : a), null);
  const connectedArea = connectedElementArea(s, m.connected);
  if (connectedArea !== null) {
    const floor = connectedArea / m.Ag;
    rec.step('Umin', 'floor for open sections', 'connected gross area / Ag', `${fmt(connectedArea)} / ${fmt(m.Ag)}`, floor, '', 'AISC 360-16 D3 (from memory)');
    if (best === null || floor > best.u) best = { u: floor, name: 'D3 open-section floor' };
  }
  if (best === null) {
    rec.warn('No Table D3.1 case could be evaluated (x̄ or l unknown): U = 1.0 used; supply U or the connection length.');
    best = { u: 1, name: 'none (U = 1.0, unverified)' };
  }
  if (best.u <= 0) {
    rec.warn('Case 2 gave U ≤ 0 (connection too short for its eccentricity); U set to 0.');
    best = { u: 0, name: best.name };
  }
  rec.assume('U case', best.name, 'AISC 360-16 Table D3.1 (larger of Case 2 and Case 7/8 where both apply)');
  return rec.step('U', `shear-lag factor (${best.name} governs)`, 'max of the applicable cases', candidates.map((c) => `${c.name} ${fmt(c.u)}`).join(', ') || best.name, best.u, '', 'AISC 360-16 D3, Table D3.1');
}
