import { describe, expect, it } from 'vitest';
import { connectionEccentricity, developedWidth, grossArea, locateOnStrip, segmentAt } from './index.ts';
import type { Section } from '../section-types.ts';
import { IN, IN2 } from '../../../tests/support/us-units.ts';

describe('gross area', () => {
  it('flat, round bar, CHS, sharp RHS', () => {
    expect(grossArea({ shape: 'flat', width: 100, thickness: 10 })).toBe(1000);
    expect(grossArea({ shape: 'round-bar', diameter: 20 })).toBeCloseTo(Math.PI * 100, 9);
    expect(grossArea({ shape: 'chs', diameter: 100, thickness: 5 })).toBeCloseTo((Math.PI / 4) * (100 ** 2 - 90 ** 2), 9);
    expect(grossArea({ shape: 'rhs', depth: 100, width: 50, thickness: 5 })).toBeCloseTo(100 * 50 - 90 * 40, 9);
  });

  it('angle with root and toe radii: t(a + b − t) + (1 − π/4)(r1² − 2r2²)', () => {
    const s: Section = { shape: 'angle', legA: 100, legB: 75, thickness: 8, rootRadius: 10, toeRadius: 5 };
    expect(grossArea(s)).toBeCloseTo(8 * 167 + (1 - Math.PI / 4) * (100 - 50), 9);
  });

  it('I-section with fillets: 2·b·tf + (h − 2tf)·tw + 4·(1 − π/4)·r²', () => {
    const s: Section = { shape: 'i', depth: 300, flangeWidth: 150, webThickness: 7.1, flangeThickness: 10.7, rootRadius: 15 };
    expect(grossArea(s)).toBeCloseTo(2 * 150 * 10.7 + (300 - 21.4) * 7.1 + 4 * (1 - Math.PI / 4) * 225, 9);
  });

  it('channel and tee', () => {
    expect(grossArea({ shape: 'channel', depth: 200, flangeWidth: 75, webThickness: 6, flangeThickness: 10 })).toBeCloseTo(2 * 750 + 180 * 6, 9);
    expect(grossArea({ shape: 'tee', depth: 100, flangeWidth: 100, webThickness: 8, flangeThickness: 10 })).toBeCloseTo(1000 + 90 * 8, 9);
  });
});

describe('developed strip and hole location', () => {
  const L: Section = { shape: 'angle', legA: 150, legB: 90, thickness: 10 };
  it('angle: width legA + legB − t; back marks map to y = legA − ga and legA + gb − t', () => {
    expect(developedWidth(L)).toBe(230);
    expect(locateOnStrip(L, { u: 60, v: 5 })).toMatchObject({ y: 90, t: 10, element: 'leg A' });
    expect(locateOnStrip(L, { u: 5, v: 50 })).toMatchObject({ y: 190, t: 10, element: 'leg B' });
    // Gauge across the heel = ga + gb − t (AISC 360-16 B4.3b; EN 1993-1-1 6.2.2.2(5)).
    expect(190 - 90).toBe(60 + 50 - 10);
  });

  it('C4 (Quimby Example 4, L6×4×3/8): back marks 2.5 in and 2.0 in give a 4.125 in heel gauge', () => {
    const q: Section = { shape: 'angle', legA: 6 * IN, legB: 4 * IN, thickness: 0.375 * IN };
    const g = locateOnStrip(q, { u: 0.2 * IN, v: 2.0 * IN })!.y - locateOnStrip(q, { u: 2.5 * IN, v: 0.2 * IN })!.y;
    expect(g / IN).toBeCloseTo(4.125, 9);
    expect(developedWidth(q) / IN).toBeCloseTo(9.625, 9);
  });

  it('points off material give null', () => {
    expect(locateOnStrip(L, { u: 50, v: 50 })).toBeNull(); // in the re-entrant corner
    expect(locateOnStrip(L, { u: 160, v: 5 })).toBeNull();
    expect(locateOnStrip({ shape: 'flat', width: 100, thickness: 10 }, { u: 60, v: 0 })).toBeNull();
    expect(locateOnStrip({ shape: 'rhs', depth: 100, width: 100, thickness: 5 }, { u: 0, v: 0 })).toBeNull();
    expect(locateOnStrip({ shape: 'chs', diameter: 100, thickness: 5 }, { u: 10, v: 0 })).toBeNull();
  });

  it('channel: flange–web–flange along centre-lines', () => {
    const c: Section = { shape: 'channel', depth: 200, flangeWidth: 75, webThickness: 6, flangeThickness: 10 };
    expect(developedWidth(c)).toBeCloseTo(2 * 75 - 6 + 200 - 10, 9);
    expect(locateOnStrip(c, { u: 40, v: -95 })).toMatchObject({ y: 35, element: 'lower flange' });
    expect(locateOnStrip(c, { u: 3, v: 0 })).toMatchObject({ y: 72 + 95, element: 'web' });
    expect(locateOnStrip(c, { u: 40, v: 95 })).toMatchObject({ y: 72 + 190 + 37, element: 'upper flange' });
  });

  it('I: flanges and web are separate parts', () => {
    const i: Section = { shape: 'i', depth: 200, flangeWidth: 100, webThickness: 6, flangeThickness: 10 };
    const top = locateOnStrip(i, { u: 30, v: 95 })!;
    const web = locateOnStrip(i, { u: 0, v: 0 })!;
    expect(top).toMatchObject({ element: 'upper flange', part: 2, y: 100 + 190 + 80, t: 10 });
    expect(web).toMatchObject({ element: 'web', part: 1, y: 195, t: 6 });
    expect(segmentAt(i, 50)?.element).toBe('lower flange');
    expect(locateOnStrip(i, { u: 30, v: 0 })).toBeNull();
  });

  it('RHS and CHS walls map around the perimeter', () => {
    const r: Section = { shape: 'rhs', depth: 100, width: 60, thickness: 4 };
    expect(locateOnStrip(r, { u: 0, v: -48 })).toMatchObject({ y: 28, element: 'lower wall' });
    expect(locateOnStrip(r, { u: 28, v: 0 })).toMatchObject({ y: 56 + 48, element: 'right wall' });
    const c: Section = { shape: 'chs', diameter: 100, thickness: 4 };
    expect(locateOnStrip(c, { u: 0, v: 48 })!.y).toBeCloseTo(48 * (Math.PI / 2), 9);
  });
});

describe('connection eccentricity x̄', () => {
  it('L4×4×1/2 connected by one leg: x̄ = 1.183 in for the idealised angle (design-rules C5, recomputed)', () => {
    const s: Section = { shape: 'angle', legA: 4 * IN, legB: 4 * IN, thickness: 0.5 * IN };
    expect(connectionEccentricity(s, 'leg A')! / IN).toBeCloseTo(1.1831, 3);
    expect(grossArea(s) / IN2).toBeCloseTo(3.75, 9);
  });
  it('HSS per AISC Table D3.1 Cases 5 and 6', () => {
    expect(connectionEccentricity({ shape: 'chs', diameter: 100, thickness: 5 }, 'web')).toBeCloseTo(100 / Math.PI, 9);
    expect(connectionEccentricity({ shape: 'rhs', depth: 200, width: 100, thickness: 5 }, 'web')).toBeCloseTo((100 ** 2 + 2 * 100 * 200) / (4 * 300), 9);
  });
  it('an I connected by its flanges uses the half-section tee', () => {
    const s: Section = { shape: 'i', depth: 200, flangeWidth: 100, webThickness: 10, flangeThickness: 10 };
    const expected = (1000 * 5 + 90 * 10 * (10 + 45)) / (1000 + 900);
    expect(connectionEccentricity(s, 'flanges')).toBeCloseTo(expected, 9);
  });
});
