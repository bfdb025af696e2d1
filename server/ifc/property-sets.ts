/**
 * Property sets as plain maps. Values keep their IFC measure type so callers can convert
 * with the file's units (a length property is in the file length unit, a force in its force unit).
 */
import type { ModelContext } from './model-context.ts';
import type { RelationsIndex } from './relations-index.ts';
import { num, refs, str } from './step-values.ts';

export interface PropValue {
  value: number | string | boolean | null;
  /** e.g. 'IFCLENGTHMEASURE', 'IFCFORCEMEASURE', 'IFCLABEL' */
  measure: string | null;
}

export type PropertySets = Map<string, Map<string, PropValue>>;

function readValue(v: any): PropValue {
  if (v == null) return { value: null, measure: null };
  const measure = typeof v === 'object' && typeof v.name === 'string' ? v.name.toUpperCase() : null;
  const n = num(v);
  if (n !== undefined && measure !== 'IFCLABEL' && measure !== 'IFCTEXT' && measure !== 'IFCIDENTIFIER') {
    return { value: n, measure };
  }
  const raw = typeof v === 'object' ? v.value : v;
  if (typeof raw === 'boolean') return { value: raw, measure };
  const s = str(v);
  if (s === '.T.' || s === 'T') return { value: true, measure };
  if (s === '.F.' || s === 'F') return { value: false, measure };
  return { value: s, measure };
}

/** Reads one IfcPropertySet / IfcElementQuantity / IfcMaterialProperties / IfcProfileProperties. */
export function readPropertyContainer(ctx: ModelContext, id: number): { name: string; props: Map<string, PropValue> } | null {
  const p = ctx.line(id);
  if (!p) return null;
  const name = str(p.Name) ?? '';
  const props = new Map<string, PropValue>();
  for (const pid of refs(p.HasProperties ?? p.Properties ?? p.Quantities)) {
    const prop = ctx.line(pid);
    if (!prop) continue;
    const pname = str(prop.Name);
    if (!pname) continue;
    if (prop.NominalValue !== undefined) props.set(pname, readValue(prop.NominalValue));
    else if (prop.LengthValue !== undefined) props.set(pname, { value: num(prop.LengthValue) ?? null, measure: 'IFCLENGTHMEASURE' });
    else if (prop.AreaValue !== undefined) props.set(pname, { value: num(prop.AreaValue) ?? null, measure: 'IFCAREAMEASURE' });
    else if (prop.CountValue !== undefined) props.set(pname, { value: num(prop.CountValue) ?? null, measure: 'IFCCOUNTMEASURE' });
    else if (prop.WeightValue !== undefined) props.set(pname, { value: num(prop.WeightValue) ?? null, measure: 'IFCMASSMEASURE' });
    else if (prop.VolumeValue !== undefined) props.set(pname, { value: num(prop.VolumeValue) ?? null, measure: 'IFCVOLUMEMEASURE' });
  }
  return { name, props };
}

export interface PropertyContainer {
  name: string;
  props: Map<string, PropValue>;
}

/** The containers of these ids that could be read, in order. */
export function readPropertyContainers(ctx: ModelContext, ids: number[] | undefined): PropertyContainer[] {
  const out: PropertyContainer[] = [];
  for (const id of ids ?? []) {
    const c = readPropertyContainer(ctx, id);
    if (c) out.push(c);
  }
  return out;
}

/**
 * Occurrence sets first; type sets fill in names the occurrence does not have. `own` are the
 * element's own containers when the caller has read them already (they are not changed).
 */
export function propertySetsOf(ctx: ModelContext, ix: RelationsIndex, elementId: number, own?: PropertyContainer[]): PropertySets {
  const out: PropertySets = new Map();
  addContainers(out, own ?? readPropertyContainers(ctx, ix.psets.get(elementId)));
  const typeId = ix.typeOf.get(elementId);
  if (typeId !== undefined) addContainers(out, readPropertyContainers(ctx, ix.psets.get(typeId)));
  return out;
}

/** Adds sets to `out`; a property already there (the occurrence's own) is kept. */
function addContainers(out: PropertySets, containers: PropertyContainer[]): void {
  for (const c of containers) {
    const existing = out.get(c.name);
    if (!existing) out.set(c.name, new Map(c.props));
    else for (const [k, v] of c.props) if (!existing.has(k)) existing.set(k, v);
  }
}

/** Each set's properties under their names in lower case, in the order findProperty visits them (made once per sets). */
const byLowerName = new WeakMap<PropertySets, Map<string, PropValue[]>>();

function lowerNameIndex(psets: PropertySets): Map<string, PropValue[]> {
  let index = byLowerName.get(psets);
  if (!index) {
    index = new Map();
    for (const props of psets.values()) {
      for (const [k, v] of props) {
        const key = k.toLowerCase();
        const list = index.get(key);
        if (list) list.push(v);
        else index.set(key, [v]);
      }
    }
    byLowerName.set(psets, index);
  }
  return index;
}

/**
 * First property with one of these names in any set (case-insensitive), for vendor sets whose
 * names vary: the first name that any set has with a value, then the first set that has it.
 * `psets` must not change after the first call (they are read once per element).
 */
export function findProperty(psets: PropertySets, names: string[]): PropValue | undefined {
  const index = lowerNameIndex(psets);
  for (const n of names) {
    for (const v of index.get(n.toLowerCase()) ?? []) if (v.value !== null && v.value !== '') return v;
  }
  return undefined;
}

const LENGTH_MEASURES = new Set(['IFCLENGTHMEASURE', 'IFCPOSITIVELENGTHMEASURE', 'IFCNONNEGATIVELENGTHMEASURE']);

/** A length-like property in mm; plain numbers without a measure are taken as file lengths. */
export function lengthMm(ctx: ModelContext, v: PropValue | undefined): number | undefined {
  if (!v || typeof v.value !== 'number') return undefined;
  if (v.measure && !LENGTH_MEASURES.has(v.measure) && !v.measure.includes('REAL')) return undefined;
  return v.value * ctx.units.lengthToMm;
}

export function forceN(ctx: ModelContext, v: PropValue | undefined): number | undefined {
  if (!v || typeof v.value !== 'number') return undefined;
  return v.value * ctx.units.forceToN;
}

export function pressureMPa(ctx: ModelContext, v: PropValue | undefined): number | undefined {
  if (!v || typeof v.value !== 'number') return undefined;
  return v.value * ctx.units.pressureToMPa;
}
