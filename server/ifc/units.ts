/**
 * Reads IfcProject.UnitsInContext once and turns it into factors to mm, N, MPa and mm².
 * Every other extractor multiplies file values by these factors; nothing converts twice.
 */
import type { ModelContext } from './model-context.ts';
import type { UnitsInfo } from './types.ts';
import { enumValue, num, ref, refs, str } from './step-values.ts';

const PREFIX: Record<string, number> = {
  EXA: 1e18, PETA: 1e15, TERA: 1e12, GIGA: 1e9, MEGA: 1e6, KILO: 1e3, HECTO: 1e2, DECA: 1e1,
  DECI: 1e-1, CENTI: 1e-2, MILLI: 1e-3, MICRO: 1e-6, NANO: 1e-9, PICO: 1e-12, FEMTO: 1e-15, ATTO: 1e-18,
};

interface UnitFactor {
  /** Factor to the SI base unit of this kind (m, N, Pa, m²). */
  toSi: number;
  name: string;
}

function siUnitFactor(u: any): UnitFactor {
  const prefix = enumValue(u.Prefix);
  const name = enumValue(u.Name) ?? '';
  const p = prefix ? PREFIX[prefix] ?? 1 : 1;
  // Area and volume prefixes apply to the base length (mm² = (1e-3 m)²).
  const power = name.startsWith('SQUARE_') ? 2 : name.startsWith('CUBIC_') ? 3 : 1;
  return { toSi: Math.pow(p, power), name: prefix ? `${prefix} ${name}` : name };
}

function unitFactor(ctx: ModelContext, id: number | undefined, depth = 0): UnitFactor | null {
  const u = ctx.line(id);
  if (!u || depth > 4) return null;
  const cls = ctx.classUpper(id);
  if (cls === 'IFCSIUNIT') return siUnitFactor(u);
  if (cls === 'IFCCONVERSIONBASEDUNIT' || cls === 'IFCCONVERSIONBASEDUNITWITHOFFSET') {
    const mwu = ctx.line(ref(u.ConversionFactor));
    const value = num(mwu?.ValueComponent) ?? 1;
    const base = unitFactor(ctx, ref(mwu?.UnitComponent), depth + 1);
    return { toSi: value * (base?.toSi ?? 1), name: str(u.Name) ?? 'converted unit' };
  }
  return null;
}

export function readUnits(ctx: ModelContext, projectId: number | undefined): UnitsInfo {
  const found = new Map<string, UnitFactor>();
  const project = ctx.line(projectId);
  const assignment = ctx.line(ref(project?.UnitsInContext));
  for (const uid of refs(assignment?.Units)) {
    const u = ctx.line(uid);
    const type = enumValue(u?.UnitType);
    if (!type || found.has(type)) continue;
    const f = unitFactor(ctx, uid);
    if (f) found.set(type, f);
  }
  const length = found.get('LENGTHUNIT');
  if (!length) ctx.warnings.add('units.no-length-unit', 'No length unit is assigned; millimetres assumed.');
  const lengthToMm = length ? length.toSi * 1000 : 1;
  const force = found.get('FORCEUNIT');
  const pressure = found.get('PRESSUREUNIT');
  const area = found.get('AREAUNIT');
  return {
    lengthUnitName: length?.name ?? 'MILLI METRE (assumed)',
    lengthToMm,
    forceUnitName: force?.name ?? 'NEWTON (default)',
    forceToN: force?.toSi ?? 1,
    // IfcPressureMeasure is in pascal unless a pressure unit is assigned.
    pressureUnitName: pressure?.name ?? 'PASCAL (default)',
    pressureToMPa: (pressure?.toSi ?? 1) * 1e-6,
    areaToMm2: area ? area.toSi * 1e6 : lengthToMm * lengthToMm,
  };
}
