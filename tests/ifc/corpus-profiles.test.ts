import { expect, it } from 'vitest';
import { FILES, corpusSuite, readCorpus } from './corpus-helpers.ts';

corpusSuite('file 5 (L-profile parameters, IFC2X3)', FILES.f5, () => {
  it('MANIFEST: four L profiles 50×25×5 differing only in FilletRadius/EdgeRadius/LegSlope', async () => {
    const m = await readCorpus(FILES.f5);
    const ls = m.profileDefinitions.filter((p) => p.ifcClass === 'IfcLShapeProfileDef');
    expect(ls).toHaveLength(4);
    for (const p of ls) expect(p.section).toMatchObject({ shape: 'angle', legA: 50, legB: 25, thickness: 5 });
    // '#55 …,50.,25.,5.,$,$' / '#74 …,2.,2.' / '#93 …,$,$,2.' (leg slope only) / '#112 …,1.,2.'
    expect(ls.map((p) => [p.section.shape === 'angle' && p.section.rootRadius, p.section.shape === 'angle' && p.section.toeRadius])).toEqual([
      [undefined, undefined], [2, 2], [undefined, undefined], [1, 2],
    ]);
    // The pieces are IfcBuildingElementProxy, not members.
    expect(m.members).toHaveLength(0);
  });
});

corpusSuite('file 6 (IfcMaterialProfileSetUsage, IFC4)', FILES.f6, () => {
  it("MANIFEST: 18 IfcBeamStandardCase, profile set IPE220 and material IfcMaterial('S275J2')", async () => {
    const m = await readCorpus(FILES.f6);
    expect(m.members).toHaveLength(18);
    expect(m.members.every((x) => x.ifcClass === 'IfcBeamStandardCase' && x.material?.name === 'S275J2' && x.material.source === 'material-profile-set')).toBe(true);
    const ipe = m.members.filter((x) => x.profile.name === 'IPE220');
    expect(ipe).toHaveLength(9);
    expect(ipe[0].profile).toMatchObject({ source: 'material-profile-set', section: { shape: 'i', depth: 220, flangeWidth: 110, webThickness: 5.9, flangeThickness: 9.2, rootRadius: 12 } });
    // '#220= IFCTSHAPEPROFILEDEF(.AREA.,'1/2IPE300',$,150.0,150.0,7.1,10.7,15.0…)'
    expect(m.members.find((x) => x.profile.name === '1/2IPE300')!.profile.section).toEqual({ shape: 'tee', depth: 150, flangeWidth: 150, webThickness: 7.1, flangeThickness: 10.7, rootRadius: 15 });
    expect(new Set(m.members.map((x) => x.length))).toEqual(new Set([2000, 3000]));
    expect(m.members.every((x) => x.axisSource === 'extrusion')).toBe(true);
  });
});

corpusSuite('file 10 (cardinal points, IFC4X3)', FILES.f10, () => {
  it('MANIFEST: 4 IfcBeam, IPE200; the axis runs through the section centre whatever the cardinal point', async () => {
    const m = await readCorpus(FILES.f10);
    expect(m.schema).toBe('IFC4X3');
    expect(m.members).toHaveLength(4);
    expect(m.members.every((x) => x.profile.name === 'IPE200' && x.profile.section?.shape === 'i' && x.material?.name === 'S355JR')).toBe(true);
    const by = (n: string) => m.members.find((x) => x.name === n)!;
    // TopMid (cardinal point 8): placement z=(0,1,0), x=(−1,0,0); solid at (0,−100,0) → centroid 100 mm below the reference line.
    expect(by('TopMid').axis).toEqual({ start: [0, 0, -100], end: [0, 1000, -100] });
    expect(by('BotMid').axis!.start).toEqual([0, 0, 100]);
    // BotLeft (cardinal point 1): placement at x=500, solid at (−50, 100) in local axes.
    expect(by('BotLeft').axis!.start).toEqual([550, 0, 100]);
    // Type predefined type JOIST is used when the occurrence has none.
    expect(by('TopMid').predefinedType).toBe('JOIST');
  });
});
