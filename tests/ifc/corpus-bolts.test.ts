import { expect, it } from 'vitest';
import { FILES, corpusSuite, corpusText, countEntities, readCorpus } from './corpus-helpers.ts';

corpusSuite('file 1 (bolt groups, IFC2X3)', FILES.f1, () => {
  const read = () => readCorpus(FILES.f1);

  it('MANIFEST: IFCMECHANICALFASTENER 121 — every bolt group is found', async () => {
    const m = await read();
    expect(m.boltGroups).toHaveLength(121);
    expect(m.counts.IfcMechanicalFastener).toBe(121);
  });

  it("MANIFEST: one IfcMappedItem per bolt and a 'Bolt count' property — counts agree and sum to the mapped items", async () => {
    const m = await read();
    const text = corpusText(FILES.f1);
    const propertySum = [...text.matchAll(/'Bolt count',\$,IFCINTEGER\((\d+)\)/g)].reduce((s, x) => s + Number(x[1]), 0);
    const total = m.boltGroups.reduce((s, b) => s + b.boltCount, 0);
    expect(total).toBe(countEntities(text, 'IFCMAPPEDITEM'));
    expect(total).toBe(propertySum);
    expect(m.boltGroups.every((b) => b.positions.length === b.boltCount && b.countSource === 'mapped-items')).toBe(true);
    expect(m.warnings.find((w) => w.code === 'bolt.count-mismatch')).toBeUndefined();
  });

  it('MANIFEST: NominalDiameter given in mm; vendor hole diameter read (M12 → 14)', async () => {
    const m = await read();
    const g = m.boltGroups.find((b) => b.globalId === '1LDUm30000534qCZarEJSo')!; // '#138 ... 12.,10.' and 'Bolt hole diameter' 14
    expect(g.nominalDiameter).toBe(12);
    expect(g.nominalLength).toBe(10);
    expect(g.holeDiameter).toBe(14);
    expect(new Set(m.boltGroups.map((b) => b.nominalDiameter))).toEqual(new Set([6, 8, 10, 12, 16, 20]));
  });

  it('MANIFEST: bolt offsets are MappingTarget.LocalOrigin (0, 600, 1200, 1800 … in the fastener axes)', async () => {
    const m = await read();
    const g = m.boltGroups.find((b) => b.expressId === 424)!; // #424: four M6, offsets 0/600/1200/1800
    const d = g.positions.map((p) => Math.round(Math.hypot(p[0] - g.positions[0][0], p[1] - g.positions[0][1], p[2] - g.positions[0][2])));
    expect(d).toEqual([0, 600, 1200, 1800]);
  });

  it('MANIFEST: no relationship ties bolts to parts — every group is associated geometrically and gets derived holes', async () => {
    const m = await read();
    expect(m.boltGroups.every((b) => b.associatedBy === 'geometry' && b.memberGlobalIds.length > 0)).toBe(true);
    const derived = m.members.flatMap((x) => x.holes).filter((h) => h.source === 'bolt-derived');
    expect(derived.length).toBeGreaterThan(700);
    expect(derived.every((h) => h.boltGroupGlobalId && h.boltDiameter)).toBe(true);
    // Holes are not modelled: nothing comes from openings or cuts.
    expect(m.members.flatMap((x) => x.holes).every((h) => h.source === 'bolt-derived')).toBe(true);
  });

  it("MANIFEST: materials IfcMaterial('STEEL/S235JR') and ('STEEL/S275JR')", async () => {
    const m = await read();
    expect(new Set(m.members.map((x) => x.material?.name))).toEqual(new Set(['STEEL/S235JR', 'STEEL/S275JR']));
  });

  it('MANIFEST: nuts, washers and anchors exported as IfcBeam (MOER_/RING_/ANKER_) are filtered out', async () => {
    const m = await read();
    const fittings = m.members.filter((x) => /^(MOER|RING|ANKER)_M\d+$/.test(x.objectType ?? ''));
    expect(fittings).toHaveLength(404 + 72 + 36);
    expect(fittings.every((x) => x.notSteelReason && !x.isTensionCandidate)).toBe(true);
    expect(m.members.filter((x) => x.notSteelReason)).toHaveLength(512);
    // Bolts are never tied to a nut or washer.
    const fittingIds = new Set(fittings.map((x) => x.globalId));
    expect(m.boltGroups.some((b) => b.memberGlobalIds.some((g) => fittingIds.has(g)))).toBe(false);
  });

  it('MANIFEST: profiles given by name only (HEB220, L200/200/24, R20, K70/70/4, B152.4/12.5)', async () => {
    const m = await read();
    const by = (ot: string) => m.members.find((x) => x.objectType === ot)!.profile;
    expect(by('HEB220')).toMatchObject({ source: 'catalogue-name', section: { shape: 'i', depth: 220, flangeWidth: 220 } });
    expect(by('L200/200/24')).toMatchObject({ source: 'catalogue-name', section: { shape: 'angle', legA: 200, legB: 200, thickness: 24 } });
    expect(by('R20')).toMatchObject({ source: 'catalogue-name', section: { shape: 'round-bar', diameter: 20 } });
    expect(by('K70/70/4').section).toEqual({ shape: 'rhs', depth: 70, width: 70, thickness: 4 });
    expect(by('B152.4/12.5').section).toEqual({ shape: 'chs', diameter: 152.4, thickness: 12.5 });
  });

  it('MANIFEST: round bars R10/R20 are tie rods — tension candidates; heavy HEB beams are not', async () => {
    const m = await read();
    const rods = m.members.filter((x) => x.objectType === 'R20' || x.objectType === 'R10');
    expect(rods).toHaveLength(170);
    expect(rods.every((x) => x.isTensionCandidate && x.tensionSignals.includes('shape:round-bar'))).toBe(true);
    expect(m.members.filter((x) => x.objectType === 'HEB220').every((x) => !x.isTensionCandidate)).toBe(true);
  });

  it('faceted members get an axis and length from their vertices (R10 #3479 is 500 mm long)', async () => {
    const m = await read();
    const r10 = m.members.find((x) => x.expressId === 3479)!;
    expect(r10.axisSource).toBe('brep-extent');
    expect(r10.length).toBeCloseTo(500, 1);
    // Placement #3427 at (5607.0, 10615.5, 2765.0), local x along world x.
    expect(r10.axis!.start[0]).toBeCloseTo(5607.0, 0);
    expect(r10.axis!.end[0]).toBeCloseTo(6107.0, 0);
  });
});
