// Display geometry for the 3D view: every member of the sample has a mesh keyed by its
// GlobalId, far-away models are recentred with the offset kept, and the file reads back
// as written. Corpus files: every extracted member has geometry where web-ifc makes some.
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { buildDisplayGeometry } from '../../server/ifc/display-geometry.ts';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import { parseDisplayGeometry, writeDisplayGeometry, type DisplayGeometry } from '../../shared/geometry/display-geometry-format.ts';
import { CORPUS_DIR, FILES, corpusPath } from './corpus-helpers.ts';
import { makeSyntheticModel } from '../../scripts/samples/make-samples.ts';

const root = resolve(fileURLToPath(new URL('.', import.meta.url)), '../..');
const SAMPLE = new Uint8Array(readFileSync(resolve(root, 'samples/kestrel-yard-shed.ifc')));

/** Entries point inside the arrays and every index stays within its entry. */
function expectConsistent(g: DisplayGeometry): void {
  const { header, positions, indices } = g;
  expect(positions.length).toBe(header.vertexCount * 3);
  expect(indices.length).toBe(header.indexCount);
  const problems: string[] = [];
  for (const e of header.entries) {
    if (e.vertexStart + e.vertexCount > header.vertexCount || e.indexStart + e.indexCount > header.indexCount || e.indexCount % 3) problems.push(`${e.globalId}: range`);
    for (let i = e.indexStart; i < e.indexStart + e.indexCount; i++) if (indices[i] >= e.vertexCount) problems.push(`${e.globalId}: index ${indices[i]}`);
  }
  if (!positions.every(Number.isFinite)) problems.push('a position is not finite');
  expect(problems.slice(0, 5)).toEqual([]);
}

describe('display geometry of the Kestrel Yard sample', () => {
  it('gives every member a mesh keyed by its GlobalId, in metres', async () => {
    const model = await readIfcModel(SAMPLE);
    const built = await buildDisplayGeometry(SAMPLE);
    const g = parseDisplayGeometry(built.bytes);
    expectConsistent(g);
    const byId = new Map(g.header.entries.map((e) => [e.globalId, e]));
    expect(model.members.length).toBeGreaterThan(5);
    for (const m of model.members) {
      const e = byId.get(m.globalId);
      expect(e, m.globalId).toBeDefined();
      expect(e!.context).toBe(false);
      expect(e!.indexCount).toBeGreaterThan(0);
      expect(e!.ifcClass.toLowerCase()).toBe(m.ifcClass.toLowerCase());
    }
    // Fasteners come along, as their own class.
    expect(g.header.entries.some((e) => e.ifcClass === 'IfcMechanicalFastener')).toBe(true);
    // Metres: the shed is metres across, not thousands.
    const size = g.header.bbox.max.map((v, k) => v - g.header.bbox.min[k]);
    expect(Math.max(...size)).toBeGreaterThan(2);
    expect(Math.max(...size)).toBeLessThan(200);
    expect(built.stats.failed).toBe(0);
    console.log(`sample: ${g.header.entries.length} elements, ${built.bytes.length} B (${Math.round(built.bytes.length / g.header.entries.length)} B per element), built in ${built.stats.buildMs} ms`);
  });

  it('recentres a model far from the origin and keeps the offset to map back', async () => {
    const near = parseDisplayGeometry((await buildDisplayGeometry(SAMPLE)).bytes);
    // Move the site 512 km east and 6,123 km north (the file is in mm; web-ifc's Y up means IFC y becomes −z).
    const text = Buffer.from(SAMPLE).toString('latin1');
    const sitePoint = /#17=IFCCARTESIANPOINT\(\(0\.,0\.,0\.\)\);/;
    expect(text).toMatch(sitePoint);
    const far = parseDisplayGeometry((await buildDisplayGeometry(new Uint8Array(Buffer.from(text.replace(sitePoint, '#17=IFCCARTESIANPOINT((512345000.,6123456000.,0.));'), 'latin1')))).bytes);
    for (const g of [near, far]) {
      const centre = g.header.bbox.min.map((v, k) => (v + g.header.bbox.max[k]) / 2);
      for (const c of centre) expect(Math.abs(c)).toBeLessThan(1e-3);
    }
    expect(far.header.offset[0] - near.header.offset[0]).toBeCloseTo(512345, 2);
    expect(far.header.offset[1] - near.header.offset[1]).toBeCloseTo(0, 2);
    expect(far.header.offset[2] - near.header.offset[2]).toBeCloseTo(-6123456, 2);
    // The stored positions keep millimetre precision although the world is thousands of km away.
    expect(far.positions.length).toBe(near.positions.length);
    let worst = 0;
    for (let i = 0; i < near.positions.length; i++) worst = Math.max(worst, Math.abs(far.positions[i] - near.positions[i]));
    expect(worst).toBeLessThan(1e-3);
  });

  it('draws big models uncut: beyond the openings limit the holes are left out, the members stay', async () => {
    const cut = await buildDisplayGeometry(SAMPLE);
    const uncut = await buildDisplayGeometry(SAMPLE, { openingsLimit: 0 });
    expect(cut.stats.openingsCut).toBe(true);
    expect(uncut.stats.openingsCut).toBe(false);
    const g = parseDisplayGeometry(uncut.bytes);
    expect(g.header.openingsCut).toBe(false);
    expect(g.header.entries.map((e) => e.globalId).sort()).toEqual(parseDisplayGeometry(cut.bytes).header.entries.map((e) => e.globalId).sort());
    expect(uncut.stats.triangles).toBeLessThan(cut.stats.triangles);
  });

  it('leaves every hole out beyond the limit, from the first member streamed on', async () => {
    // Generated flat braces, four holes each: uncut, every brace is the same plain box. With
    // fewer members web-ifc had parsed every line before the deletions, and the fault did not show.
    const uncut = parseDisplayGeometry((await buildDisplayGeometry(await makeSyntheticModel(1000), { openingsLimit: 0 })).bytes);
    const members = uncut.header.entries.filter((e) => e.ifcClass === 'IfcMember');
    expect(members).toHaveLength(1000);
    expect(new Set(members.map((e) => `${e.vertexCount}/${e.indexCount}`))).toEqual(new Set(['8/36']));
  }, 60_000);

  it('stops adding elements when its time budget is spent, and still writes a valid file', async () => {
    const partial = await buildDisplayGeometry(SAMPLE, { timeBudgetMs: 0, chunkSize: 5 });
    expect(partial.stats.skipped).toBe(partial.stats.elements);
    expectConsistent(parseDisplayGeometry(partial.bytes));
  });

  it('reads back what it writes (parse ∘ write is the identity)', async () => {
    const g = parseDisplayGeometry((await buildDisplayGeometry(SAMPLE)).bytes);
    const again = parseDisplayGeometry(writeDisplayGeometry(g));
    expect(again.header).toEqual(g.header);
    expect([...again.positions]).toEqual([...g.positions]);
    expect([...again.indices]).toEqual([...g.indices]);
    // A file of our own with 32-bit indices and an unaligned copy survives too.
    const wide: DisplayGeometry = {
      header: { ...g.header, indexType: 'uint32', entries: [{ globalId: '0123456789abcdefABCDEF', ifcClass: 'IfcSlab', context: true, vertexStart: 0, vertexCount: 3, indexStart: 0, indexCount: 3 }] },
      positions: new Float32Array([0, 0, 0, 1, 0, 0, 0, 1, 0]),
      indices: new Uint32Array([0, 1, 2]),
    };
    const bytes = writeDisplayGeometry(wide);
    const shifted = new Uint8Array(bytes.length + 1);
    shifted.set(bytes, 1);
    const back = parseDisplayGeometry(shifted.subarray(1));
    expect(back.header.entries).toEqual(wide.header.entries);
    expect([...back.indices]).toEqual([0, 1, 2]);
    expect(back.indices).toBeInstanceOf(Uint32Array);
    expect(() => parseDisplayGeometry(new Uint8Array(8))).toThrow(/display geometry/);
  });
});

const CORPUS_FILES = Object.values(FILES);
if (!existsSync(CORPUS_DIR)) {
  console.warn(`IFC corpus not found at ${CORPUS_DIR}; display geometry corpus tests are not registered.`);
} else {
  describe('display geometry of the corpus files', () => {
    for (const name of CORPUS_FILES) {
      if (!existsSync(corpusPath(name))) {
        console.warn(`IFC corpus file ${name} not found in ${CORPUS_DIR}; its display geometry test is not registered.`);
        continue;
      }
      it(`${name}: consistent file, one entry per element, members with geometry`, async () => {
        const bytes = new Uint8Array(readFileSync(corpusPath(name)));
        const built = await buildDisplayGeometry(bytes);
        const g = parseDisplayGeometry(built.bytes);
        expectConsistent(g);
        const ids = g.header.entries.map((e) => e.globalId);
        expect(new Set(ids).size).toBe(ids.length);
        expect(built.stats.failed).toBe(0);
        const model = await readIfcModel(bytes);
        const withGeometry = new Set(ids);
        const missing = model.members.filter((m) => !withGeometry.has(m.globalId));
        console.log(`${name}: ${g.header.entries.length} elements, ${built.bytes.length} B, ${built.stats.buildMs} ms; ${missing.length} of ${model.members.length} members without geometry`);
        expect(missing.map((m) => m.globalId)).toEqual([]);
        const c = g.header.bbox.min.map((v, k) => (v + g.header.bbox.max[k]) / 2);
        for (const v of c) expect(Math.abs(v)).toBeLessThan(1e-3);
      });
    }
  });
}
