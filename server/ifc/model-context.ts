/**
 * Per-read state shared by the extractors: the open model, a line cache (GetLine is the hot
 * path), class-name lookup, units and warnings. Lives only for one readIfcModel call.
 */
import type { IfcAPI } from 'web-ifc';
import type { IfcSchema, UnitsInfo } from './types.ts';
import { WarningCollector } from './warnings.ts';

export class ModelContext {
  readonly warnings = new WarningCollector();
  units!: UnitsInfo;
  private cache = new Map<number, any>();
  private typeNames = new Map<number, string>();

  constructor(
    readonly api: IfcAPI,
    readonly modelID: number,
    readonly schema: IfcSchema,
  ) {}

  /** The raw (not flattened) line; null when the id does not exist or fails to parse. */
  line(id: number | undefined): any {
    if (id === undefined || id <= 0) return null;
    if (this.cache.has(id)) return this.cache.get(id);
    let l: any = null;
    try {
      l = this.api.GetLine(this.modelID, id);
    } catch {
      l = null;
    }
    this.cache.set(id, l);
    return l;
  }

  /** Entity class name in IFC spelling, e.g. 'IfcBeam'; '' when unknown. */
  className(id: number | undefined): string {
    if (id === undefined) return '';
    const l = this.line(id);
    if (!l) return '';
    const code = l.type as number;
    let n = this.typeNames.get(code);
    if (n === undefined) {
      n = this.api.GetNameFromTypeCode(code) ?? '';
      this.typeNames.set(code, n);
    }
    return n;
  }

  isA(id: number | undefined, ...names: string[]): boolean {
    const c = this.className(id).toUpperCase();
    return names.some((n) => n.toUpperCase() === c);
  }

  idsOfType(typeCode: number, includeInherited = false): number[] {
    try {
      return [...this.api.GetLineIDsWithType(this.modelID, typeCode, includeInherited)];
    } catch {
      return [];
    }
  }

  /** File length → mm. */
  mm(v: number | undefined): number | undefined {
    return v === undefined ? undefined : v * this.units.lengthToMm;
  }
}
