import { expect, it } from 'vitest';
import { FILES, corpusSuite, corpusText, readCorpus } from './corpus-helpers.ts';

const LBF = 4.44822162; // '#22= IFCMEASUREWITHUNIT(IFCMASSMEASURE(4.44822162),#21)' pound-force → N
const INCH = 25.4; // '#29= IFCMEASUREWITHUNIT(IFCLENGTHMEASURE(0.0254),#28)' inch → m

corpusSuite('file 9 (member-end forces, inch units, IFC4X3)', FILES.f9, () => {
  const read = () => readCorpus(FILES.f9);

  it("MANIFEST: imperial units — 'inch' and 'pound-force' converted once to mm and N", async () => {
    const m = await read();
    expect(m.units.lengthUnitName).toBe('inch');
    expect(m.units.lengthToMm).toBeCloseTo(INCH, 10);
    expect(m.units.forceToN).toBeCloseTo(LBF, 10);
    expect(m.units.pressureToMPa).toBeCloseTo(0.0068947572932, 12); // psi
  });

  it('MANIFEST: 3 curve members with Head/Tail member-end reactions (checked by hand from the file text)', async () => {
    const m = await read();
    expect(m.analysisMembers).toHaveLength(3);
    const col = m.analysisMembers.find((a) => a.name === 'Curve Member #1')!;
    // Edge from '#232 (0,0,0)' to '#243 (0,0,120.)' inches → 3048 mm long, vertical.
    expect(col.start).toEqual([0, 0, 0]);
    expect(col.end![2]).toBeCloseTo(120 * INCH, 6);
    // '#2770 Head (2278.52897011915, 0., -1422.66326629449)' and '#2771 Tail (…, 1422.66326629449)', GLOBAL_COORDS,
    // locations (0.) and (120.). Projected on the axis (0,0,1): Head −1422.663 lbf, Tail +1422.663 lbf.
    expect(col.endForces).toHaveLength(2);
    const [head, tail] = col.endForces;
    expect(head.coordinates).toBe('GLOBAL_COORDS');
    expect(head.location).toBe(0);
    expect(tail.location).toBeCloseTo(120 * INCH, 3);
    expect(head.force[0]).toBeCloseTo(2278.52897011915 * LBF, 2);
    expect(head.axial).toBeCloseTo(-1422.66326629449 * LBF, 2);
    expect(tail.axial).toBeCloseTo(1422.66326629449 * LBF, 2);
    // Forces act on the member: pulling away at both ends → tension, +6328.3 N.
    expect(head.internalAxial).toBeCloseTo(1422.66326629449 * LBF, 2);
    expect(tail.internalAxial).toBeCloseTo(1422.66326629449 * LBF, 2);
    expect(head.loadCase).toBe('Structural Load Case #1');
    // The beam (#2786 Head ForceX +1422.69 lbf along +x) is pushed at its start → compression.
    const beam = m.analysisMembers.find((a) => a.name === 'Curve Member #3')!;
    expect(beam.endForces[0].internalAxial).toBeCloseTo(-1422.69473557039 * LBF, 2);
    expect(m.forceConvention).toMatch(/tension positive/);
  });

  it("MANIFEST: IFCMATERIAL('ASTM A36') with Pset_MaterialMechanical; profile W10X30 (no physical members)", async () => {
    const m = await read();
    expect(m.members).toHaveLength(0);
    const w = m.profileDefinitions.find((p) => p.name === 'W10X30')!;
    // '#419= IFCISHAPEPROFILEDEF(.AREA.,'W10X30',$,5.81,10.5,0.3,0.51,0.125,$,$)' in inches
    expect(w.section).toEqual({ shape: 'i', depth: 266.7, flangeWidth: 147.574, webThickness: 7.62, flangeThickness: 12.954, rootRadius: 3.175 });
  });
});

corpusSuite('file 7 (member-end forces, IFC4)', FILES.f7, () => {
  it('MANIFEST: IFCSTRUCTURALCURVEREACTION 3 — one Head/Tail pair per curve member, same values as file 9', async () => {
    const m = await readCorpus(FILES.f7);
    expect(m.schema).toBe('IFC4');
    expect(m.counts.IfcStructuralCurveReaction).toBe(3);
    expect(m.analysisMembers).toHaveLength(3);
    expect(m.analysisMembers.every((a) => a.endForces.length === 2)).toBe(true);
    const col = m.analysisMembers.find((a) => a.name === 'Curve Member #1')!;
    expect(col.endForces[0].axial).toBeCloseTo(-1422.66326629449 * m.units.forceToN, 1);
  });
});

corpusSuite('file 8 (analysis ↔ physical links, IFC4)', FILES.f8, () => {
  it('MANIFEST: IFCRELASSIGNSTOPRODUCT 26 in the reverse direction (physical in RelatedObjects) are all read', async () => {
    const m = await readCorpus(FILES.f8);
    const text = corpusText(FILES.f8);
    const guidOf = (id: string) => new RegExp(`#${id}=\\s*IFC\\w+\\('([^']+)'`).exec(text)![1];
    const rels = [...text.matchAll(/IFCRELASSIGNSTOPRODUCT\('[^']*',[^,]*,[^,]*,[^,]*,\(#(\d+)\),\$,#(\d+)\)/g)];
    expect(rels).toHaveLength(26);
    expect(m.analysisMembers).toHaveLength(26); // 6 curve + 20 surface members
    for (const [, physical, structural] of rels) {
      const a = m.analysisMembers.find((x) => x.globalId === guidOf(structural));
      expect(a, `structural #${structural}`).toBeDefined();
      expect(a!.linkedPhysicalGlobalIds).toContain(guidOf(physical));
    }
  });
});
