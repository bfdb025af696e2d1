/**
 * Per-read state shared by the extractors: the open model, a line cache (GetLine is the hot
 * path), class-name lookup, units and warnings. Lives only for one readIfcModel call.
 *
 * The cache is bounded: two generations of at most CACHE_GENERATION lines each; a hit in the
 * older one moves the line to the younger, and when the younger is full the older is
 * dropped. Shared lines (placements up the spatial tree, contexts, profiles, materials) stay;
 * per-member lines are read once and let go, so memory no longer grows with the file.
 */
import type { IfcAPI } from 'web-ifc';
import type { IfcSchema, UnitsInfo } from './types.ts';
import { WarningCollector } from './warnings.ts';

/** Lines per cache generation (a line object is about 1 KB of heap). */
export const CACHE_GENERATION = 50_000;

export class ModelContext {
  readonly warnings = new WarningCollector();
  units!: UnitsInfo;
  private young = new Map<number, any>();
  private old = new Map<number, any>();
  private typeNames = new Map<number, string>();

  constructor(
    readonly api: IfcAPI,
    readonly modelID: number,
    readonly schema: IfcSchema,
    private readonly cacheGeneration = CACHE_GENERATION,
  ) {}

  /** The raw (not flattened) line; null when the id does not exist or fails to parse. */
  line(id: number | undefined): any {
    if (id === undefined || id <= 0) return null;
    const hit = this.young.get(id);
    if (hit !== undefined) return hit;
    let l: any = this.old.get(id);
    if (l === undefined) {
      try {
        l = this.api.GetLine(this.modelID, id) ?? null;
      } catch {
        l = null;
      }
    }
    this.remember(id, l);
    return l;
  }

  private remember(id: number, line: any): void {
    if (this.young.size >= this.cacheGeneration) {
      this.old = this.young;
      this.young = new Map();
    }
    this.young.set(id, line);
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
