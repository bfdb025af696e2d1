import { expect, it } from 'vitest';
import { FILES, corpusSuite, corpusText, countEntities, readCorpus } from './corpus-helpers.ts';

corpusSuite('file 4 (boolean cuts, IFC2X3)', FILES.f4, () => {
  const read = () => readCorpus(FILES.f4);

  it('MANIFEST: IFCLSHAPEPROFILEDEF 10 read as angles, e.g. L65/130/8 (65, 130, 8, r 12)', async () => {
    const m = await read();
    const angles = m.profileDefinitions.filter((p) => p.ifcClass === 'IfcLShapeProfileDef');
    expect(angles).toHaveLength(countEntities(corpusText(FILES.f4), 'IFCLSHAPEPROFILEDEF'));
    expect(angles.find((p) => p.name === 'L65/130/8')!.section).toEqual({ shape: 'angle', legA: 65, legB: 130, thickness: 8, rootRadius: 12 });
    const onMembers = m.members.filter((x) => x.profile.section?.shape === 'angle' && x.profile.source === 'swept-area');
    expect(onMembers.length).toBeGreaterThan(0);
  });

  it('MANIFEST: 270 IfcBooleanResult(.DIFFERENCE.) with extruded cutters — each classified; the r = 10 arcs are corners of rounded outlines, not round holes', async () => {
    const m = await read();
    // Every cutter is looked at; none is a circle or a slot (the 41 "circular" cutters are composite
    // curves of four r = 10 arcs and four straight segments, 30×30 and 50×80 mm outlines).
    expect(m.warnings.find((w) => w.code === 'hole.non-circular')!.count).toBe(270);
    expect(m.members.flatMap((x) => x.holes).filter((h) => h.source === 'boolean-cut')).toHaveLength(0);
  });
});

corpusSuite('file 3 (connection realised by welds, IFC2X3)', FILES.f3, () => {
  it("MANIFEST: 36 IfcRelConnectsWithRealizingElements with IfcFastener 'Weld' — welds are not bolt groups", async () => {
    const m = await readCorpus(FILES.f3);
    expect(m.counts.IfcRelConnectsWithRealizingElements).toBe(36);
    expect(m.counts.IfcFastener).toBe(36);
    expect(m.boltGroups).toHaveLength(0);
    expect(m.members.every((x) => !x.isTensionCandidate)).toBe(true);
  });
});
