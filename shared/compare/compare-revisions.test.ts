import { describe, expect, it } from 'vitest';
import { compareRevisions, holeSignature, type ComparableMember } from './compare-revisions';
import { bandOf } from '../api/results';

const gid = (n: number) => `0Member${String(n).padStart(15, '0')}`;
function member(n: number, over: Partial<ComparableMember> = {}): ComparableMember {
  const utilisation = over.utilisation === undefined ? 0.5 : over.utilisation;
  return { globalId: gid(n), tag: `B${n}`, name: `Brace ${n}`, profile: 'EA 75x75x6', grade: 'S355', holeSignature: holeSignature([{ x: 40, y: 30, d: 22 }]), designForceN: 100_000, band: bandOf(utilisation), ...over, utilisation };
}

describe('compareRevisions', () => {
  it('lists only changed members, with every kind of change', () => {
    const before = [member(1), member(2), member(3), member(4), member(5), member(6)];
    const after = [
      member(1),
      member(2, { profile: 'EA 90x90x8', utilisation: 0.4 }),
      member(3, { holeSignature: holeSignature([{ x: 40, y: 30, d: 22 }, { x: 110, y: 30, d: 22 }]) }),
      member(4, { designForceN: 180_000, utilisation: 0.9 }),
      member(5, { grade: 'S275' }),
      member(7),
    ];
    const cmp = compareRevisions(before, after);
    const kinds = Object.fromEntries(cmp.changes.map((c) => [c.globalId, c.kinds]));
    expect(kinds[gid(1)]).toBeUndefined();
    expect(kinds[gid(2)]).toEqual(['resized', 'utilisation-down']);
    expect(kinds[gid(3)]).toEqual(['rebolted']);
    expect(kinds[gid(4)]).toEqual(['force-changed', 'utilisation-up', 'newly-critical']);
    expect(kinds[gid(5)]).toEqual(['regraded']);
    expect(kinds[gid(6)]).toEqual(['removed']);
    expect(kinds[gid(7)]).toEqual(['added']);
    expect(cmp.counts.added).toBe(1);
    expect(cmp.matchedByGlobalId).toBe(5);
  });

  it('matches by unique tag when GlobalIds were regenerated, and warns', () => {
    const before = [member(1), member(2)];
    const after = [member(11, { tag: 'B1' }), member(12, { tag: 'B2', utilisation: 0.95 })];
    const cmp = compareRevisions(before, after);
    expect(cmp.matchedByTag).toBe(2);
    expect(cmp.changes).toHaveLength(1);
    expect(cmp.changes[0]).toMatchObject({ globalId: gid(12), previousGlobalId: gid(2), kinds: ['utilisation-up', 'newly-critical'] });
    expect(cmp.warnings[0]).toMatch(/GlobalIds changed/);
  });

  it('does not match by a tag that is not unique', () => {
    const cmp = compareRevisions([member(1, { tag: 'X' }), member(2, { tag: 'X' })], [member(3, { tag: 'X' })]);
    expect(cmp.matchedByTag).toBe(0);
    expect(cmp.counts.removed).toBe(2);
    expect(cmp.counts.added).toBe(1);
  });

  it('ignores round-off in forces and utilisation', () => {
    const cmp = compareRevisions([member(1)], [member(1, { designForceN: 100_100, utilisation: 0.503 })]);
    expect(cmp.changes).toEqual([]);
  });
});
