import { expect, it } from 'vitest';
import { FILES, corpusSuite, corpusText, countEntities, readCorpus } from './corpus-helpers.ts';

corpusSuite('file 2 (round holes as openings, IFC2X3)', FILES.f2, () => {
  const read = () => readCorpus(FILES.f2);

  it('MANIFEST: IFCOPENINGELEMENT 25 / IFCRELVOIDSELEMENT 25 — all 25 holes tied to their hosts', async () => {
    const m = await read();
    const holes = m.members.flatMap((x) => x.holes.map((h) => ({ ...h, host: x })));
    expect(countEntities(corpusText(FILES.f2), 'IFCRELVOIDSELEMENT')).toBe(25);
    expect(holes).toHaveLength(25);
    expect(holes.every((h) => h.source === 'opening' && h.featureGlobalId)).toBe(true);
    expect(new Set(holes.map((h) => h.featureGlobalId)).size).toBe(25);
  });

  it('MANIFEST: r = 13, 6.5, 5.25 and 3 mm circles → Ø26 / Ø13 / Ø10.5 / Ø6 holes', async () => {
    const m = await read();
    const diameters = m.members.flatMap((x) => x.holes.map((h) => h.diameter));
    expect(new Set(diameters)).toEqual(new Set([26, 13, 10.5, 6]));
    // The file text has ten 'IFCCIRCLE(#…,13.)' opening outlines.
    expect(diameters.filter((d) => d === 26)).toHaveLength((corpusText(FILES.f2).match(/IFCCIRCLE\(#\d+,13\.\)/g) ?? []).length);
    expect(diameters.filter((d) => d === 26)).toHaveLength(10);
  });

  it("MANIFEST: Ø26 holes go through the 10 mm strips ('Strip 100x10'), centred across the width", async () => {
    const m = await read();
    const strips = m.members.filter((x) => x.name === 'Strip 100x10');
    expect(strips).toHaveLength(6);
    for (const s of strips) {
      expect(s.profile.section).toEqual({ shape: 'flat', width: 100, thickness: 10 });
      for (const h of s.holes) {
        expect(h).toMatchObject({ diameter: 26, thickness: 10, axis: 'v' });
        expect(Math.abs(h.u)).toBeLessThan(0.5);
        expect(h.x).toBeGreaterThan(0);
        expect(h.x).toBeLessThan(s.length!);
      }
    }
  });

  it("MANIFEST: angles 'HOEK 50 X 50 X 5' — section from the name, holes located on each leg from the heel", async () => {
    const m = await read();
    const angles = m.members.filter((x) => x.name === 'HOEK 50 X 50 X 5');
    expect(angles).toHaveLength(2);
    for (const a of angles) {
      expect(a.profile.section).toEqual({ shape: 'angle', legA: 50, legB: 50, thickness: 5 });
      // One Ø13 hole through each leg: its gauge lies along the leg, mid-thickness across it.
      const byAxis = Object.fromEntries(a.holes.map((h) => [h.axis, h]));
      expect(byAxis.u).toMatchObject({ u: 2.5, v: 25, diameter: 13, thickness: 5 });
      expect(byAxis.v).toMatchObject({ u: 30, v: 2.5, diameter: 10.5, thickness: 5 });
    }
  });
});
