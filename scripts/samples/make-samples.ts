/**
 * Writes the demo models of the invented "Kestrel Yard maintenance shed":
 *   samples/kestrel-yard-shed.ifc (IFC4), samples/kestrel-yard-shed-ifc2x3.ifc, samples/kestrel-yard-forces.csv
 * Run: node --import tsx scripts/samples/make-samples.ts
 * Also exports makeSyntheticModel(n) for benchmarks, built with the same writers.
 */
import { createHash } from 'node:crypto';
import { writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Handle } from 'web-ifc';
import { IfcBuilder, type SampleSchema } from './ifc-builder.ts';
import { type AuthoredMember, KESTREL_MEMBERS, LOAD_CASES } from './kestrel-yard.ts';
import { writeBolts, writeMember } from './member-writer.ts';

type H = Handle<any>;

const GUID_CHARS = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz_$';

/**
 * Stable GlobalId per member key, the same in both schemas and in the CSV. Taken from a
 * SHA-256 of the key: a 32-bit hash collided within a few hundred synthetic members.
 */
export function memberGuid(key: string): string {
  const digest = createHash('sha256').update(`kestrel-yard:${key}`).digest();
  let s = GUID_CHARS[digest[0] % 4];
  for (let i = 1; i < 22; i++) s += GUID_CHARS[digest[i] % 64];
  return s;
}

function setup(b: IfcBuilder, projectName: string): { storey: H; storeyPlacement: H } {
  const S = b.S;
  const person = b.add('IfcPerson', null, b.label('Sample'), b.label('Generator'), null, null, null, null, null);
  const org = b.add('IfcOrganization', null, b.label('Gaugeline'), null, null, null);
  const po = b.add('IfcPersonAndOrganization', person, org, null);
  const app = b.add('IfcApplication', org, b.label('0.1'), b.label('Gaugeline sample generator'), b.id('gaugeline-samples'));
  b.ownerHistory = b.add('IfcOwnerHistory', po, app, null, b.enumOf('', 'NOCHANGE'), null, null, null, new S.IfcTimeStamp(b.epoch));
  const world = b.placement3d([0, 0, 0]);
  const ctx = b.add('IfcGeometricRepresentationContext', null, b.label('Model'), new S.IfcDimensionCount(3), new S.IfcReal(1e-5), world, null);
  b.bodyContext = b.add('IfcGeometricRepresentationSubContext', b.label('Body'), b.label('Model'), ctx, null, b.enumOf('', 'MODEL_VIEW'), null);
  const units = b.add('IfcUnitAssignment', [
    b.add('IfcSIUnit', b.enumOf('', 'LENGTHUNIT'), b.enumOf('', 'MILLI'), b.enumOf('', 'METRE')),
    b.add('IfcSIUnit', b.enumOf('', 'AREAUNIT'), null, b.enumOf('', 'SQUARE_METRE')),
    b.add('IfcSIUnit', b.enumOf('', 'FORCEUNIT'), null, b.enumOf('', 'NEWTON')),
    b.add('IfcSIUnit', b.enumOf('', 'PRESSUREUNIT'), b.enumOf('', 'MEGA'), b.enumOf('', 'PASCAL')),
    b.add('IfcSIUnit', b.enumOf('', 'PLANEANGLEUNIT'), null, b.enumOf('', 'RADIAN')),
  ]);
  const project = b.add('IfcProject', b.guid(), b.ownerHistory, b.label(projectName), null, null, b.label('Kestrel Yard maintenance shed'), null, [ctx], units);
  const sitePl = b.localPlacement(null, [0, 0, 0]);
  const site = b.add('IfcSite', b.guid(), b.ownerHistory, b.label('Kestrel Yard'), null, null, sitePl, null, null, b.enumOf('', 'ELEMENT'), null, null, null, null, null);
  const bldPl = b.localPlacement(sitePl, [0, 0, 0]);
  const building = b.add('IfcBuilding', b.guid(), b.ownerHistory, b.label('Maintenance shed'), null, null, bldPl, null, null, b.enumOf('', 'ELEMENT'), null, null, null);
  const storeyPlacement = b.localPlacement(bldPl, [0, 0, 0]);
  const storey = b.add('IfcBuildingStorey', b.guid(), b.ownerHistory, b.label('Ground floor'), null, null, storeyPlacement, null, null, b.enumOf('', 'ELEMENT'), b.len(0));
  b.add('IfcRelAggregates', b.guid(), b.ownerHistory, null, null, project, [site]);
  b.add('IfcRelAggregates', b.guid(), b.ownerHistory, null, null, site, [building]);
  b.add('IfcRelAggregates', b.guid(), b.ownerHistory, null, null, building, [storey]);
  return { storey, storeyPlacement };
}

/** Builds a model from authored members (the shed, or a synthetic list). */
export async function buildModel(schema: SampleSchema, members: AuthoredMember[], projectName = 'Kestrel Yard'): Promise<Uint8Array> {
  const b = await IfcBuilder.create(schema, 20250115);
  const { storey, storeyPlacement } = setup(b, projectName);
  const materials = new Map<string, H>();
  const written = new Map<string, { handle: H; placement: H }>();
  for (const m of members) written.set(m.key, writeMember(b, m, new b.S.IfcGloballyUniqueId(memberGuid(m.key)), storeyPlacement, materials));

  const contained: H[] = [];
  const assemblyParts: H[] = [];
  for (const m of members) (m.assembly ? assemblyParts : contained).push(written.get(m.key)!.handle);
  for (const m of members) {
    for (const g of m.bolts) {
      const fasteners = writeBolts(b, m, g, written.get(m.key)!.placement);
      contained.push(...fasteners);
      if (g.connects && written.has(g.connects)) {
        b.add('IfcRelConnectsWithRealizingElements', b.guid(), b.ownerHistory, null, null, null, written.get(m.key)!.handle, written.get(g.connects)!.handle, fasteners, b.label('bolted'));
      }
    }
  }
  if (assemblyParts.length) {
    const asm = b.add('IfcElementAssembly', b.guid(), b.ownerHistory, b.label('Roof truss T1'), null, null, b.localPlacement(storeyPlacement, [0, 0, 0]), null, b.id('T1'), b.enumOf('', 'FACTORY'), b.enumOf('', 'TRUSS'));
    b.add('IfcRelAggregates', b.guid(), b.ownerHistory, null, null, asm, assemblyParts);
    contained.push(asm);
  }
  b.add('IfcRelContainedInSpatialStructure', b.guid(), b.ownerHistory, null, null, contained, storey);
  return b.save();
}

/** Forces CSV keyed by GlobalId; several load cases, kN, tension positive. */
export function forcesCsv(members: AuthoredMember[]): string {
  const rows = ['GlobalId,LoadCase,N [kN]'];
  members.forEach((m, i) => {
    if (m.ifcClass === 'IfcPlate') return;
    LOAD_CASES.forEach((lc, j) => {
      const stated = m.forces.find((f) => f.loadCase === lc);
      // Cases not stated in the model get a deterministic made-up value so the CSV is complete.
      const n = stated ? stated.N / 1000 : Math.round(((i * 37 + j * 53) % 160) - 40) / 1;
      rows.push(`${memberGuid(m.key)},${lc},${n.toFixed(1)}`);
    });
  });
  return rows.join('\n') + '\n';
}

/** n braces in rows, each a flat with four holes and a bolt group per end; for benchmarks. */
export function syntheticMembers(n: number): AuthoredMember[] {
  const out: AuthoredMember[] = [];
  const proto = KESTREL_MEMBERS.find((m) => m.key === 'WB1')!;
  for (let i = 0; i < n; i++) {
    const x = (i % 50) * 500;
    const y = Math.floor(i / 50) * 7000;
    out.push({
      ...proto, key: `S${i}`, name: `Synthetic brace ${i}`, start: [x, y, 0], end: [x, y + 6000, 4000],
      bolts: proto.bolts.map((g) => ({ ...g, key: `S${i}-${g.key}`, style: 'group' as const })),
      forces: [{ loadCase: 'ULS1', N: 1000 * (i % 97) }],
    });
  }
  return out;
}

export async function makeSyntheticModel(n: number): Promise<Uint8Array> {
  return buildModel('IFC4', syntheticMembers(n), `Synthetic ${n}`);
}

async function main(): Promise<void> {
  const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
  const ifc4 = await buildModel('IFC4', KESTREL_MEMBERS);
  writeFileSync(resolve(root, 'samples/kestrel-yard-shed.ifc'), ifc4);
  const ifc2x3 = await buildModel('IFC2X3', KESTREL_MEMBERS);
  writeFileSync(resolve(root, 'samples/kestrel-yard-shed-ifc2x3.ifc'), ifc2x3);
  writeFileSync(resolve(root, 'samples/kestrel-yard-forces.csv'), forcesCsv(KESTREL_MEMBERS));
  console.log(`wrote samples: IFC4 ${ifc4.length} B, IFC2X3 ${ifc2x3.length} B`);
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  await main();
}
