import { describe, expect, it } from 'vitest';
import { bandOf } from '@shared/api';
import { CHANGE_PRECEDENCE, CHANGE_STYLE } from '@shared/compare/change-look';
import { compareRevisions, holeSignature, type ComparableMember } from '@shared/compare/compare-revisions';
import type { Comparison } from '../api/use-comparison';
import { changeColouring } from './change-colouring';
import { CHANGE_WORDS } from './change-words';

const gid = (n: number) => `1Kestrel${String(n).padStart(14, '0')}`;
function member(n: number, over: Partial<ComparableMember> = {}): ComparableMember {
  const utilisation = over.utilisation === undefined ? 0.5 : over.utilisation;
  return { globalId: gid(n), tag: `WB${n}`, name: `Wall brace ${n}`, profile: 'EA 75x75x6', grade: 'S355', holeSignature: holeSignature([{ x: 40, y: 30, d: 22 }]), designForceN: 100_000, ...over, utilisation, band: bandOf(utilisation) };
}

/** Two revisions with one member for each kind of change, and one that did not change. */
function comparison(): Comparison {
  const before = [1, 2, 3, 4, 5, 6, 7, 8, 9].map((n) => member(n));
  const after = [
    member(1),
    member(2, { designForceN: 180_000, utilisation: 0.9 }), // force, up, newly critical
    member(3, { designForceN: 130_000, utilisation: 0.65 }), // force, up
    member(4, { profile: 'EA 90x90x8', utilisation: 0.4 }), // resized, down
    member(5, { grade: 'S275' }),
    member(6, { holeSignature: holeSignature([{ x: 40, y: 30, d: 22 }, { x: 110, y: 30, d: 22 }]) }),
    member(7, { designForceN: 101_000 }), // force only
    member(8, { utilisation: 0.3 }), // down only
    member(10), // added
  ]; // 9 taken out
  return { before: { id: 11, number: 1 }, after: { id: 12, number: 2 }, ...compareRevisions(before, after) };
}

const force = (n: number) => `${(n / 1000).toFixed(1)} kN`;

describe('changeColouring', () => {
  it('colours each changed member by its most urgent change, in the key’s own colours', () => {
    const c = changeColouring(comparison(), { force, hrefBefore: (g) => `/before/${g}` });
    const entryOf = (n: number) => c.members.get(gid(n))?.entry;
    expect(entryOf(1)).toBeUndefined();
    expect(entryOf(2)).toBe('newly-critical');
    expect(entryOf(3)).toBe('utilisation-up');
    expect(entryOf(4)).toBe('resized');
    expect(entryOf(5)).toBe('regraded');
    expect(entryOf(6)).toBe('rebolted');
    expect(entryOf(7)).toBe('force-changed');
    expect(entryOf(8)).toBe('utilisation-down');
    expect(entryOf(10)).toBe('added');
    expect(c.members.has(gid(9))).toBe(false);
    // The key is the precedence list, with the colours painted.
    expect(c.entries.map((e) => e.id)).toEqual([...CHANGE_PRECEDENCE]);
    for (const e of c.entries) expect(e).toMatchObject({ colour: CHANGE_STYLE[e.id as keyof typeof CHANGE_STYLE].colour, label: CHANGE_WORDS[e.id as keyof typeof CHANGE_WORDS].heading });
    expect(c.note).toMatch(/first of them in this list/);
    expect(c.title).toBe('Change since revision 1');
  });

  it('says every change in words, the one that gives the colour first', () => {
    const c = changeColouring(comparison(), { force });
    expect(c.members.get(gid(2))!.words).toEqual(['now tight or over: spare → tight', 'utilisation higher: 0.50 → 0.90', 'design force changed: 100.0 kN → 180.0 kN']);
    expect(c.members.get(gid(4))!.words).toEqual(['section changed: EA 75x75x6 → EA 90x90x8', 'utilisation lower: 0.50 → 0.40']);
    expect(c.members.get(gid(5))!.words).toEqual(['grade changed: S355 → S275']);
    expect(c.members.get(gid(6))!.words).toEqual(['holes changed']);
    expect(c.members.get(gid(10))!.words).toEqual(['new member']);
    expect(c.rest.words).toBe('no change found since revision 1');
  });

  it('lists taken-out members beside the view instead of colouring them', () => {
    const c = changeColouring(comparison(), { force, hrefBefore: (g) => `/before/${g}` });
    expect(c.absent.members).toEqual([{ globalId: gid(9), label: 'WB9 · was EA 75x75x6', words: ['taken out'], href: `/before/${gid(9)}` }]);
    expect(c.absent.title).toBe('Taken out since revision 1');
  });

  it('keeps the matched-by-tag warning and says which GlobalId a member had', () => {
    const before = [member(1), member(2)];
    const after = [member(1), { ...member(3, { profile: 'EA 90x90x8' }), tag: 'WB2' }];
    const c = changeColouring({ before: { id: 1, number: 3 }, after: { id: 2, number: 4 }, ...compareRevisions(before, after) }, { force });
    expect(c.warnings).toHaveLength(1);
    expect(c.members.get(gid(3))!.words).toEqual(['section changed: EA 75x75x6 → EA 90x90x8', `matched by tag; GlobalId was ${gid(2)}`]);
    expect(c.absent.members).toEqual([]);
  });
});
