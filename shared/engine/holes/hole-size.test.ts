import { describe, expect, it } from 'vitest';
import { deductedWidth, holeSize } from './index.ts';
import { IN } from '../../../tests/support/us-units.ts';

describe('hole sizes', () => {
  it('AS 4100: bolt + 2 mm up to M24, + 3 mm above (Cl. 14.3.5.2, from memory; common practice)', () => {
    expect([16, 20, 24, 30, 36].map((d) => holeSize('as4100', d).width)).toEqual([18, 22, 26, 33, 39]);
  });
  it('AISC Table J3.3M (Brockenbrough & Merritt, Structural Steel Designer\'s Handbook, Table 5.11)', () => {
    expect([16, 20, 22, 24, 27, 30, 36].map((d) => holeSize('aisc360', d).width)).toEqual([18, 22, 24, 27, 30, 33, 39]);
    expect(holeSize('aisc360', 20, 'oversize').width).toBe(24);
    expect(holeSize('aisc360', 24, 'short-slot')).toMatchObject({ width: 27, length: 32 });
    expect(holeSize('aisc360', 36, 'long-slot')).toMatchObject({ width: 39, length: 90 });
  });
  it('AISC Table J3.3 imperial: 3/4 in bolt → 13/16 in hole, deducted 7/8 in with the B4.3b allowance (AISC Design Examples D.1/D.9)', () => {
    const h = holeSize('aisc360', 0.75 * IN, 'standard', true);
    expect(h.width / IN).toBeCloseTo(13 / 16, 9);
    expect(deductedWidth('aisc360', h.width, IN / 16) / IN).toBeCloseTo(7 / 8, 9);
    expect(holeSize('aisc360', 1.25 * IN, 'standard', true).width / IN).toBeCloseTo(1.375, 9);
  });
  it('EN 1090-2 Table 11 nominal clearances', () => {
    expect([12, 14, 16, 20, 22, 24, 27, 30, 36].map((d) => holeSize('en1993', d).width - d)).toEqual([1, 1, 2, 2, 2, 2, 3, 3, 3]);
    expect([12, 14, 20, 24, 30].map((d) => holeSize('en1993', d, 'oversize').width - d)).toEqual([3, 4, 4, 6, 8]);
    expect(holeSize('en1993', 20, 'short-slot').length).toBe(26);
    expect(holeSize('en1993', 20, 'long-slot').length).toBe(50);
  });
  it('only AISC adds an allowance to the deducted width', () => {
    expect(deductedWidth('aisc360', 22)).toBe(24);
    expect(deductedWidth('as4100', 22)).toBe(22);
    expect(deductedWidth('en1993', 22)).toBe(22);
  });
});
