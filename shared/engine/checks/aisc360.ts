import type { MemberCheckInput } from '../schemas.ts';
import type { CheckResult } from './types.ts';
import { Recorder, fmt } from './trace.ts';
import { prepareMember } from './prepare-member.ts';
import { areaSteps, finish } from './common-steps.ts';
import { shearLagU } from './shear-lag-aisc.ts';
import { aiscConnectionModes } from './aisc360-connection.ts';

/**
 * AISC 360-16 / 360-22 tension member check, LRFD or ASD (Chapter D; the D2 factors are
 * the same in both editions as far as known). Forces N, tension positive.
 *   yielding (D2a):  Pn = Fy·Ag,  φ = 0.90 / Ω = 1.67
 *   rupture  (D2b):  Pn = Fu·Ae,  Ae = U·An (D3),  φ = 0.75 / Ω = 2.00
 *   splice plates (J4.1b): An ≤ 0.85·Ag
 * With bolts: bolt shear (J3.6), bearing/tear-out (J3.10), block shear (J4.3).
 */
export function checkAisc360(input: MemberCheckInput): CheckResult {
  const rec = new Recorder();
  const m = prepareMember(input, rec);
  const edition = input.edition ?? '360-16';
  const lrfd = input.method !== 'asd';
  rec.assume('edition', `AISC ${edition} ${lrfd ? 'LRFD' : 'ASD'}`, 'input');
  const { fy, fu } = m.steel;
  let An = areaSteps(m, rec, 'AISC 360-16 B4.3b');
  if (input.role === 'splice-plate' && An > 0.85 * m.Ag) {
    An = rec.step('An', 'net area limited for a bolted splice plate', 'An ≤ 0.85·Ag', `0.85 × ${fmt(m.Ag)}`, 0.85 * m.Ag, 'mm²', 'AISC 360-16 J4.1(b)');
  }
  const U = shearLagU(m, rec);
  const Ae = rec.step('Ae', 'effective net area', 'U·An', `${fmt(U)} × ${fmt(An)}`, U * An, 'mm²', 'AISC 360-16 D3');
  const py = rec.step('Pn,y', 'nominal yield strength', 'Fy·Ag', `${fmt(fy)} × ${fmt(m.Ag)}`, fy * m.Ag, 'N', 'AISC 360-16 D2(a)');
  const pr = rec.step('Pn,r', 'nominal rupture strength', 'Fu·Ae', `${fmt(fu)} × ${fmt(Ae)}`, fu * Ae, 'N', 'AISC 360-16 D2(b)');
  const f = lrfd ? { y: 0.9, r: 0.75 } : { y: 1 / 1.67, r: 1 / 2.0 };
  const sym = (s: string) => (lrfd ? `φ${s}` : `${s}/Ω`);
  rec.mode('tensile yielding', rec.step(sym('Pn,y'), 'design yield strength', lrfd ? '0.90·Pn' : 'Pn/1.67', `${fmt(py)} ${lrfd ? '× 0.90' : '/ 1.67'}`, py * f.y, 'N', 'AISC 360-16 D2(a)'), 'AISC 360-16 D2(a)');
  rec.mode('tensile rupture', rec.step(sym('Pn,r'), 'design rupture strength', lrfd ? '0.75·Pn' : 'Pn/2.00', `${fmt(pr)} ${lrfd ? '× 0.75' : '/ 2.00'}`, pr * f.r, 'N', 'AISC 360-16 D2(b)'), 'AISC 360-16 D2(b)');
  if (input.bolts) aiscConnectionModes(m, rec, edition, lrfd);
  return finish(`AISC ${edition} ${lrfd ? 'LRFD' : 'ASD'}`, m, rec, An);
}
