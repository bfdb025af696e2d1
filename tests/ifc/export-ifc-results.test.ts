// IFC with results: re-opened with web-ifc (independently of our reader). Every exported
// member carries Gaugeline_TensionCheck; every other entity and GlobalId is unchanged.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import * as W from 'web-ifc';
import { writeIfcWithResults, RESULTS_PSET } from '../../server/exports/ifc-export';
import { sampleBundle, SAMPLE_IFC2X3, SAMPLE_IFC4 } from '../support/export-fixture';

const api = new W.IfcAPI();
beforeAll(async () => {
  await api.Init();
  api.SetLogLevel(W.LogLevel.LOG_LEVEL_OFF);
});
afterAll(() => api.Dispose());

const ADDED = new Set(['IFCPROPERTYSET', 'IFCRELDEFINESBYPROPERTIES', 'IFCPROPERTYSINGLEVALUE']);

function inventory(m: number) {
  const counts = new Map<string, number>();
  const guids = new Set<string>();
  for (const id of api.GetAllLines(m)) {
    const type = api.GetNameFromTypeCode(api.GetLineType(m, id)).toUpperCase();
    counts.set(type, (counts.get(type) ?? 0) + 1);
    if (ADDED.has(type)) continue;
    const g = (api.GetLine(m, id) as { GlobalId?: { value: string } }).GlobalId?.value;
    if (g) guids.add(g);
  }
  return { counts, guids };
}

/** Property sets named `name` on the element, as { property: value }. */
function psetsOn(m: number, globalId: string, name: string): Record<string, unknown>[] {
  const id = Number(api.GetExpressIdFromGuid(m, globalId));
  const found: Record<string, unknown>[] = [];
  for (const relId of api.GetLineIDsWithType(m, W.IFCRELDEFINESBYPROPERTIES)) {
    const rel = api.GetLine(m, relId) as { RelatedObjects: { value: number }[]; RelatingPropertyDefinition: { value: number } };
    if (!rel.RelatedObjects.some((o) => o.value === id)) continue;
    const pset = api.GetLine(m, rel.RelatingPropertyDefinition.value, true) as { Name?: { value: string }; HasProperties?: { Name: { value: string }; NominalValue: { value: unknown } }[] };
    if (pset.Name?.value !== name) continue;
    found.push(Object.fromEntries((pset.HasProperties ?? []).map((p) => [p.Name.value, p.NominalValue.value])));
  }
  return found;
}

describe.each([
  ['IFC4', SAMPLE_IFC4],
  ['IFC2X3', SAMPLE_IFC2X3],
])('IFC export with results (%s)', (schema, file) => {
  it('adds the property set to each checked member and changes nothing else', async () => {
    const bundle = await sampleBundle(file);
    const original = new Uint8Array(readFileSync(file));
    const out = await writeIfcWithResults(original, bundle);
    const a = api.OpenModel(original);
    const b = api.OpenModel(new Uint8Array(out));
    try {
      expect(api.GetModelSchema(b)).toBe(schema);
      const before = inventory(a);
      const after = inventory(b);
      for (const [type, n] of before.counts) if (!ADDED.has(type)) expect(after.counts.get(type), type).toBe(n);
      for (const type of after.counts.keys()) expect(before.counts.has(type) || ADDED.has(type), type).toBe(true);
      expect(after.counts.get('IFCRELDEFINESBYPROPERTIES')).toBe((before.counts.get('IFCRELDEFINESBYPROPERTIES') ?? 0) + bundle.members.length);
      expect(after.guids).toEqual(before.guids);

      expect(RESULTS_PSET.startsWith('Pset_')).toBe(false);
      for (const m of bundle.members) {
        const psets = psetsOn(b, m.row.globalId, RESULTS_PSET);
        expect(psets, m.row.globalId).toHaveLength(1);
        const p = psets[0];
        if (m.row.utilisation != null) expect(p.Utilisation as number).toBeCloseTo(m.row.utilisation, 9);
        expect(p.GoverningMode).toBe(m.row.governing);
        // The samples state forces in newtons, so the values are N.
        expect(p.DesignCapacity as number).toBeCloseTo(m.row.designCapacityN!, 3);
        if (m.row.designForceN != null) expect(p.DesignForce as number).toBeCloseTo(m.row.designForceN, 3);
        expect(p.Standard).toBe('AS 4100');
        expect(p.EngineVersion).toBe(bundle.engineVersion);
        expect(p.CheckDate).toBe('2025-03-04');
        expect(String(p.AssumedValues)).toContain('fy = ');
        expect(String(p.Cautions)).toMatch(/licensed engineer/);
      }
    } finally {
      api.CloseModel(a);
      api.CloseModel(b);
    }
  });
});

describe('IFC export force unit', () => {
  it('writes forces in the model’s own force unit (kN when the model assigns kilonewtons)', async () => {
    const bundle = await sampleBundle(SAMPLE_IFC4);
    const text = readFileSync(SAMPLE_IFC4, 'latin1');
    expect(text).toContain('IFCSIUNIT(*,.FORCEUNIT.,$,.NEWTON.)');
    const kN = new Uint8Array(Buffer.from(text.replace('IFCSIUNIT(*,.FORCEUNIT.,$,.NEWTON.)', 'IFCSIUNIT(*,.FORCEUNIT.,.KILO.,.NEWTON.)'), 'latin1'));
    const b = api.OpenModel(new Uint8Array(await writeIfcWithResults(kN, bundle)));
    try {
      const m = bundle.members[0];
      const [p] = psetsOn(b, m.row.globalId, RESULTS_PSET);
      expect(p.DesignCapacity as number).toBeCloseTo(m.row.designCapacityN! / 1000, 6);
    } finally {
      api.CloseModel(b);
    }
  });
});
