import { describe, expect, it } from 'vitest';
import { checkMemberRaw } from './check-member.ts';
import { ktAs4100 } from './kt-as4100.ts';
import { coreArea, shankArea } from './bolt-data.ts';

// AS 4100 clauses are from memory (design-rules §1.1, §4.1, §6.1); no published AS worked case is
// available, so these tests recompute the formulas independently.
const mode = (r: ReturnType<typeof checkMemberRaw>, name: string) => r.modes.find((m) => m.name === name)!.capacity;

describe('AS 4100 member capacity', () => {
  it('flat: φNt = 0.9·min(Ag·fy, 0.85·kt·An·fu) with kt = 1 (plate grade 300 at 10 mm: 310/430)', () => {
    const r = checkMemberRaw({ standard: 'as4100', section: { shape: 'flat', width: 200, thickness: 10 }, steel: { grade: 'AS/NZS 3678-300' }, holes: [{ x: 0, y: 50, d: 22 }, { x: 0, y: 150, d: 22 }], force: 400e3 });
    const An = 2000 - 2 * 22 * 10;
    expect(r.designCapacity).toBeCloseTo(0.9 * Math.min(2000 * 310, 0.85 * An * 430), 6);
    expect(r.governing).toBe('net fracture');
    expect(r.utilisation).toBeCloseTo(400e3 / r.designCapacity, 9);
  });
  it('unequal angle connected by the short leg: kt = 0.75; by the long leg: 0.85 (Table 7.3.2, from memory)', () => {
    expect(ktAs4100({ shape: 'angle', legA: 75, legB: 100, thickness: 8 }, 'leg A').kt).toBe(0.75);
    expect(ktAs4100({ shape: 'angle', legA: 100, legB: 75, thickness: 8 }, 'leg A').kt).toBe(0.85);
    expect(ktAs4100({ shape: 'angle', legA: 90, legB: 90, thickness: 8 }, 'leg B').kt).toBe(0.85);
    const r = checkMemberRaw({ standard: 'as4100', section: { shape: 'angle', legA: 75, legB: 100, thickness: 8, connectedLeg: 'A' }, steel: { fy: 300, fu: 440 }, holes: [{ x: 0, y: 35, d: 22 }, { x: 70, y: 35, d: 22 }] });
    const Ag = 8 * (75 + 100 - 8);
    expect(mode(r, 'net fracture')).toBeCloseTo(0.9 * 0.85 * 0.75 * (Ag - 22 * 8) * 440, 6);
  });
  it('kt override is used and reported', () => {
    const r = checkMemberRaw({ standard: 'as4100', section: { shape: 'angle', legA: 75, legB: 100, thickness: 8 }, steel: { fy: 300, fu: 440 }, overrides: { kt: 1 } });
    expect(r.assumptions.find((a) => a.name === 'kt')).toMatchObject({ value: 1, source: 'override' });
  });
  it('bolt shear M20 8.8, one plane: φVf = 92.6 kN threads included, 129 kN excluded (design-rules §6.1, derived)', () => {
    expect((0.8 * 0.62 * 830 * coreArea(20)) / 1000).toBeCloseTo(92.6, 0);
    const base = { standard: 'as4100' as const, section: { shape: 'flat' as const, width: 100, thickness: 20 }, steel: { fy: 300, fu: 440 }, holes: [{ x: 0, y: 50 }] };
    const inc = checkMemberRaw({ ...base, bolts: { diameter: 20, grade: '8.8/S', threadsInShearPlane: true } });
    const exc = checkMemberRaw({ ...base, bolts: { diameter: 20, grade: '8.8/S', threadsInShearPlane: false } });
    expect(Math.abs(mode(inc, 'bolt shear') / 92.6e3 - 1)).toBeLessThan(0.005);
    expect(Math.abs(mode(exc, 'bolt shear') / 129e3 - 1)).toBeLessThan(0.005);
    expect(mode(exc, 'bolt shear')).toBeCloseTo(0.8 * 0.62 * 830 * shankArea(20), 6);
    expect(inc.assumptions.find((a) => a.name === 'hole diameter')?.value).toBe('22');
  });
  it('ply bearing: end bolt limited by tear-out ae·tp·fup, ae = e1 − dh/2 + df/2', () => {
    const r = checkMemberRaw({ standard: 'as4100', section: { shape: 'flat', width: 100, thickness: 10 }, steel: { fy: 300, fu: 440 }, bolts: { diameter: 20, grade: '8.8', endDistance: 30 }, holes: [{ x: 0, y: 50 }] });
    expect(mode(r, 'ply bearing')).toBeCloseTo(0.9 * Math.min(3.2 * 20 * 10 * 440, (30 - 11 + 10) * 10 * 440), 6);
  });
  it('no positive force: utilisation null and a warning for compression', () => {
    const r = checkMemberRaw({ standard: 'as4100', section: { shape: 'flat', width: 100, thickness: 10 }, steel: { fy: 300, fu: 440 }, force: -10e3 });
    expect(r.utilisation).toBeNull();
    expect(r.warnings.join(' ')).toMatch(/not tensile/);
  });
});
