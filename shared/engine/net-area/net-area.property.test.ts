import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { chainDeduction, minNetArea, solveNetArea } from './index.ts';
import type { StripHole } from './types.ts';
import { bruteForceNetArea } from '../../../tests/support/brute-force-net-area.ts';

// Holes on a coarse grid so that shared gauge lines, equal x (straight sections),
// near-equal y within the 0.5 mm tolerance and overlapping projections all occur often.
const holeArb = fc.record({
  x: fc.integer({ min: 0, max: 8 }).chain((i) => fc.constantFrom(i * 15, i * 15 + 7)),
  y: fc.integer({ min: 0, max: 10 }).chain((j) => fc.constantFrom(j * 20, j * 20 + 0.3, j * 20 + 11)),
  d: fc.constantFrom(14, 18, 22, 26),
  t: fc.option(fc.constantFrom(6, 10, 16), { nil: undefined }),
});
const patternArb = fc.array(holeArb, { minLength: 0, maxLength: 8 });
const clean = (hs: Array<{ x: number; y: number; d: number; t?: number }>): StripHole[] => hs.map((h) => (h.t === undefined ? { x: h.x, y: h.y, d: h.d } : h));
const T = 10;
const AG = 300 * T;

describe('net area: longest path equals exhaustive enumeration', () => {
  it('matches brute force on 10,000 random patterns (n ≤ 8)', () => {
    fc.assert(
      fc.property(patternArb, (raw) => {
        const holes = clean(raw);
        const dp = solveNetArea({ grossArea: AG, thickness: T, holes, alternatives: 0 });
        const bf = bruteForceNetArea(holes, T);
        expect(dp.deduction).toBeCloseTo(bf.deduction, 9);
        expect(minNetArea(AG, T, holes)).toBeCloseTo(AG - bf.deduction, 9);
        // The reported chain really deducts what the solver says.
        if (dp.governing && dp.governing.kind === 'zig-zag') expect(chainDeduction(holes, T, dp.governing.holes)).toBeCloseTo(dp.deduction, 9);
      }),
      { numRuns: 10_000 },
    );
  });

  it('runner-up chains are distinct, ordered, and never beat the governing chain', () => {
    fc.assert(
      fc.property(patternArb, (raw) => {
        const holes = clean(raw);
        const r = solveNetArea({ grossArea: AG, thickness: T, holes, alternatives: 5 });
        const keys = r.alternatives.map((c) => `${c.kind}:${c.holes.join(',')}`);
        expect(new Set(keys).size).toBe(keys.length);
        for (let i = 1; i < r.alternatives.length; i++) expect(r.alternatives[i].deduction).toBeLessThanOrEqual(r.alternatives[i - 1].deduction + 1e-9);
        for (const c of r.alternatives) {
          expect(c.deduction).toBeLessThanOrEqual(r.deduction + 1e-9);
          if (c.kind === 'zig-zag') expect(chainDeduction(holes, T, c.holes)).toBeCloseTo(c.deduction, 9);
        }
      }),
      { numRuns: 1_000 },
    );
  });
});

describe('net area: metamorphic properties', () => {
  const W = 220;
  it('mirroring y about the strip centre leaves An unchanged', () => {
    fc.assert(
      fc.property(patternArb, (raw) => {
        const holes = clean(raw);
        const mirrored = holes.map((h) => ({ ...h, y: W - h.y }));
        expect(minNetArea(AG, T, mirrored)).toBeCloseTo(minNetArea(AG, T, holes), 9);
      }),
      { numRuns: 2_000 },
    );
  });

  it('shifting every hole along x leaves An unchanged', () => {
    fc.assert(
      fc.property(patternArb, fc.integer({ min: -500, max: 500 }), (raw, dx) => {
        const holes = clean(raw);
        expect(minNetArea(AG, T, holes.map((h) => ({ ...h, x: h.x + dx })))).toBeCloseTo(minNetArea(AG, T, holes), 9);
      }),
      { numRuns: 2_000 },
    );
  });

  it('adding a hole never raises An', () => {
    fc.assert(
      fc.property(patternArb, holeArb, (raw, extra) => {
        const holes = clean(raw);
        expect(minNetArea(AG, T, [...holes, ...clean([extra])])).toBeLessThanOrEqual(minNetArea(AG, T, holes) + 1e-9);
      }),
      { numRuns: 2_000 },
    );
  });

  it('reordering the input does not change An', () => {
    fc.assert(
      fc.property(patternArb, (raw) => {
        const holes = clean(raw);
        expect(minNetArea(AG, T, [...holes].reverse())).toBeCloseTo(minNetArea(AG, T, holes), 9);
      }),
      { numRuns: 1_000 },
    );
  });
});
