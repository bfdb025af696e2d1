import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import type { ExtractedModel } from '../../server/ifc/types.ts';
import { KESTREL_MEMBERS } from '../../scripts/samples/kestrel-yard.ts';
import { buildModel, forcesCsv, makeSyntheticModel, memberGuid } from '../../scripts/samples/make-samples.ts';
import { memberLength } from '../../scripts/samples/member-writer.ts';

const root = resolve(fileURLToPath(new URL('.', import.meta.url)), '../..');

for (const schema of ['IFC4', 'IFC2X3'] as const) {
  describe(`Kestrel Yard sample round trip (${schema})`, () => {
    let model: ExtractedModel;
    const read = async () => (model ??= await readIfcModel(await buildModel(schema, KESTREL_MEMBERS)));

    it('every authored member is read back by GlobalId with its length, profile name and material', async () => {
      const m = await read();
      expect(m.schema).toBe(schema);
      expect(m.members).toHaveLength(KESTREL_MEMBERS.length);
      for (const a of KESTREL_MEMBERS) {
        const x = m.members.find((y) => y.globalId === memberGuid(a.key));
        expect(x, a.key).toBeDefined();
        expect(x!.tag).toBe(a.key);
        expect(x!.length).toBeCloseTo(memberLength(a), 6);
        expect(x!.profile.name).toBe(a.profile.name);
        expect(x!.material?.name).toBe(a.material);
        expect(x!.profile.source).toBe(schema === 'IFC4' ? 'material-profile-set' : 'swept-area');
      }
    });

    it('hole patterns (x, u, v, diameter, thickness, axis) equal the authored ones', async () => {
      const m = await read();
      for (const a of KESTREL_MEMBERS) {
        const x = m.members.find((y) => y.globalId === memberGuid(a.key))!;
        const modelled = x.holes.filter((h) => h.source !== 'bolt-derived').map(({ x: s, u, v, diameter, thickness, axis }) => ({ x: s, u, v, diameter, thickness, axis }));
        const authored = [...a.holes].sort((p, q) => p.x - q.x || p.u - q.u || p.v - q.v);
        expect(modelled, a.key).toEqual(authored);
        const expectedSource = a.holeStyle === 'boolean' ? 'boolean-cut' : 'opening';
        expect(x.holes.filter((h) => h.source !== 'bolt-derived').every((h) => h.source === expectedSource)).toBe(true);
      }
    });

    it('bolt groups: counts, diameters, hole diameters and members; holes through the gussets derived from the bolts', async () => {
      const m = await read();
      const groups = KESTREL_MEMBERS.flatMap((a) => a.bolts.map((g) => ({ a, g })));
      const fastenerCount = groups.reduce((s, { g }) => s + (g.style === 'group' ? 1 : g.holes.length), 0);
      expect(m.boltGroups).toHaveLength(fastenerCount);
      for (const { a, g } of groups) {
        const found = m.boltGroups.filter((b) => b.name === `Bolt group ${g.key}`);
        expect(found.reduce((s, b) => s + b.boltCount, 0)).toBe(g.holes.length);
        for (const b of found) {
          expect(b).toMatchObject({ nominalDiameter: g.diameter, nominalLength: g.length, holeDiameter: g.holeDiameter, grade: g.grade });
          expect(b.memberGlobalIds).toContain(memberGuid(a.key));
          if (g.connects) expect(b.associatedBy).toBe('realizing-elements');
        }
        // Modelled holes the bolts pass through are tagged with the bolt size.
        const member = m.members.find((y) => y.globalId === memberGuid(a.key))!;
        expect(member.holes.filter((h) => h.boltDiameter === g.diameter && h.source === 'opening').length).toBeGreaterThanOrEqual(g.holes.length);
      }
      for (const key of ['T1-GW', 'T1-GE']) {
        const gusset = m.members.find((y) => y.globalId === memberGuid(key))!;
        expect(gusset.holes).toHaveLength(4);
        expect(gusset.holes.every((h) => h.source === 'bolt-derived' && h.diameter === 18 && h.thickness === 10 && h.v === 0)).toBe(true);
        expect(gusset.isTensionCandidate).toBe(false);
      }
    });

    it('design forces from Gaugeline_MemberForces (tension positive, some compression, some missing)', async () => {
      const m = await read();
      for (const a of KESTREL_MEMBERS) {
        const x = m.members.find((y) => y.globalId === memberGuid(a.key))!;
        expect(x.forces.map((f) => ({ loadCase: f.loadCase, N: f.axialForce })).sort((p, q) => p.loadCase.localeCompare(q.loadCase)), a.key).toEqual(
          a.forces.map((f) => ({ loadCase: f.loadCase, N: f.N })).sort((p, q) => p.loadCase.localeCompare(q.loadCase)),
        );
      }
    });

    it('tension candidates: braces, chords, rods and hangers yes; column and gussets no', async () => {
      const m = await read();
      const cand = (key: string) => m.members.find((y) => y.globalId === memberGuid(key))!.isTensionCandidate;
      for (const key of ['WB1', 'EB1', 'T1-BC', 'RT1', 'H1', 'T1-DW']) expect(cand(key), key).toBe(true);
      for (const key of ['C1', 'T1-GW']) expect(cand(key), key).toBe(false);
    });
  });
}

describe('committed sample files', () => {
  it('are what the generator writes today (deterministic, under 1 MB)', async () => {
    const ifc4 = await buildModel('IFC4', KESTREL_MEMBERS);
    const committed = readFileSync(resolve(root, 'samples/kestrel-yard-shed.ifc'));
    expect(Buffer.from(ifc4).equals(committed)).toBe(true);
    expect(committed.length).toBeLessThan(1_000_000);
    expect(readFileSync(resolve(root, 'samples/kestrel-yard-forces.csv'), 'utf8')).toBe(forcesCsv(KESTREL_MEMBERS));
  });

  it('forces CSV has the agreed header and several load cases per member', () => {
    const lines = forcesCsv(KESTREL_MEMBERS).trim().split('\n');
    expect(lines[0]).toBe('GlobalId,LoadCase,N [kN]');
    const cases = new Set(lines.slice(1).map((l) => l.split(',')[1]));
    expect(cases.size).toBeGreaterThanOrEqual(4);
  });

  it('makeSyntheticModel(n) writes n members that read back, reporting progress per phase', async () => {
    const calls: [string, number][] = [];
    const m = await readIfcModel(await makeSyntheticModel(600), { progress: (phase, f) => calls.push([phase, f]) });
    expect(m.members).toHaveLength(600);
    expect(calls[0]).toEqual(['reading', 0]);
    expect(calls.at(-1)).toEqual(['extracting', 1]);
    expect(calls.filter(([p]) => p === 'extracting').length).toBeGreaterThan(2);
    expect(calls.every(([, f]) => f >= 0 && f <= 1)).toBe(true);
  });

  it('a configured force property set is read instead of the default one', async () => {
    const m = await readIfcModel(await makeSyntheticModel(3), { forcePsetNames: [{ pset: 'Gaugeline_MemberForces', force: 'AxialForce' }] });
    expect(m.members.every((x) => x.forces.every((f) => f.loadCase === 'default'))).toBe(true);
    const none = await readIfcModel(await makeSyntheticModel(3), { forcePsetNames: [{ pset: 'Other_Forces', force: 'N' }] });
    expect(none.members.every((x) => x.forces.length === 0)).toBe(true);
  });

  it('makeSyntheticModel(n) members carry their holes', async () => {
    const m = await readIfcModel(await makeSyntheticModel(60));
    expect(m.members).toHaveLength(60);
    expect(m.members.every((x) => x.holes.length === 4)).toBe(true);
  });
});
