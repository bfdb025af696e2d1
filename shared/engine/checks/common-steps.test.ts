// withForce and its inverse: a stored capacity plus the member's force gives the engine's result.
import { describe, expect, it } from 'vitest';
import { checkMemberRaw } from './check-member.ts';
import { withForce, withoutForce } from './common-steps.ts';
import type { MemberCheckInputRaw } from '../schemas.ts';

// Inputs only: a flat with two staggered holes and a bolt group (invented, common practice shapes).
const STANDARDS = [{ standard: 'as4100' }, { standard: 'aisc360', method: 'lrfd' }, { standard: 'aisc360', method: 'asd' }, { standard: 'en1993' }] as const;
const input = ({ standard, method }: { standard: string; method?: string }, force: number | null): MemberCheckInputRaw => ({
  standard: standard as MemberCheckInputRaw['standard'], ...(method ? { method: method as MemberCheckInputRaw['method'] } : {}), section: { shape: 'flat', width: 100, thickness: 10 }, steel: { grade: standard.startsWith('aisc') ? 'A36' : standard === 'en1993' ? 'S355' : '300' },
  holes: [{ x: 40, y: 30, d: 18 }, { x: 80, y: 70, d: 18 }], bolts: { diameter: 16, grade: standard.startsWith('aisc') ? 'A325' : '8.8', count: 2 }, force,
});

describe('withForce / withoutForce', () => {
  for (const standard of STANDARDS) {
    it(`${standard.standard} ${'method' in standard ? standard.method : ''}: the capacity with a force is the engine's result with it, and back`, () => {
      const capacity = checkMemberRaw(input(standard, null));
      expect(capacity.utilisation).toBeNull();
      for (const force of [null, 60_000, 0, -25_000]) {
        const checked = checkMemberRaw(input(standard, force));
        expect(withForce(capacity, force)).toEqual(checked);
        expect(withoutForce(checked)).toEqual(capacity);
        // Applying the same force again changes nothing (rows stored whole before capacities were kept apart).
        expect(withForce(checked, force)).toEqual(checked);
      }
    });
  }

  it('adds the compression warning once and takes only it away', () => {
    const capacity = checkMemberRaw(input({ standard: 'as4100' }, null));
    const pushed = withForce(capacity, -1);
    expect(pushed.warnings.length).toBe(capacity.warnings.length + 1);
    expect(withoutForce(pushed).warnings).toEqual(capacity.warnings);
    expect(withoutForce(capacity)).not.toBe(capacity);
  });
});
