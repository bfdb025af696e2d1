/**
 * Per-read state shared by the extractors: the open model, a line cache (GetLine is the hot
 * path), class-name lookup, units and warnings. Lives only for one readIfcModel call.
 *
 * The cache is bounded: two generations of at most CACHE_GENERATION lines each; a hit in the
 * older one moves the line to the younger, and when the younger is full the older is
 * dropped. Shared lines (placements up the spatial tree, contexts, profiles, materials) stay;
 * per-member lines are read once and let go, so memory no longer grows with the file.
 */
import { FromRawLineData, type IfcAPI, SchemaNames } from 'web-ifc';
import { DEFER, type StepText } from './step-text.ts';
import { numList } from './step-values.ts';
import type { IfcSchema, UnitsInfo } from './types.ts';
import { WarningCollector } from './warnings.ts';

const POINT = new TextEncoder().encode('IFCCARTESIANPOINT');
const DIRECTION = new TextEncoder().encode('IFCDIRECTION');

/** Lines per cache generation (a line object is about 1 KB of heap). */
export const CACHE_GENERATION = 50_000;

export class ModelContext {
  readonly warnings = new WarningCollector();
  units!: UnitsInfo;
  private young = new Map<number, any>();
  private old = new Map<number, any>();
  private typeNames = new Map<number, string>();
  /** Cache misses, and how many of them went through web-ifc's GetLine (ReadStats). */
  linesRead = 0;
  linesFromWebIfc = 0;

  /** web-ifc's line constructors for this model's schema (what GetLine uses); null: GetLine only. */
  private readonly fromRaw: Record<number, (args: unknown[]) => any> | null;

  constructor(
    readonly api: IfcAPI,
    readonly modelID: number,
    readonly schema: IfcSchema,
    private readonly cacheGeneration = CACHE_GENERATION,
    /** The file's text, when lines may be read from it instead of through GetLine. */
    private readonly text: StepText | null = null,
  ) {
    this.fromRaw = text ? constructorsFor(api, modelID) : null;
  }

  /** The raw (not flattened) line; null when the id does not exist or fails to parse. */
  line(id: number | undefined): any {
    if (id === undefined || id <= 0) return null;
    const hit = this.young.get(id);
    if (hit !== undefined) return hit;
    let l: any = this.old.get(id);
    if (l === undefined) {
      this.linesRead++;
      l = this.fromText(id);
      if (l === DEFER) {
        this.linesFromWebIfc++;
        try {
          l = this.api.GetLine(this.modelID, id) ?? null;
        } catch {
          l = null;
        }
      }
    }
    this.remember(id, l);
    return l;
  }

  /**
   * The line built from the file's text by web-ifc's own constructor, so it is the object
   * GetLine would return (the type code is web-ifc's code of the name as written).
   */
  private fromText(id: number): any {
    if (!this.text || !this.fromRaw) return DEFER;
    const raw = this.text.raw(id);
    if (raw === DEFER || raw === null) return DEFER;
    const make = this.fromRaw[raw.type];
    // GetLine throws here (no constructor for the type, or arguments it cannot take): null.
    if (typeof make !== 'function') return null;
    try {
      const l = make(raw.arguments);
      l.expressID = id;
      return l;
    } catch {
      return null;
    }
  }

  /**
   * The numbers of an IfcCartesianPoint's Coordinates or an IfcDirection's DirectionRatios, as
   * numList(line(id)?.<attribute>) gives them; straight from the text without a line object
   * where it can (a third of all lines are points and directions), else from the line.
   */
  numbers(id: number | undefined, kind: 'point' | 'direction'): number[] {
    if (id === undefined || id <= 0) return [];
    if (this.text) {
      const r = this.text.reals(id, kind === 'point' ? POINT : DIRECTION);
      if (Array.isArray(r)) {
        this.linesRead++;
        return r;
      }
    }
    const l = this.line(id);
    return numList(kind === 'point' ? l?.Coordinates : l?.DirectionRatios);
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

/** FromRawLineData of the model's schema, found the way GetLine finds it; null when unsure. */
function constructorsFor(api: IfcAPI, modelID: number): Record<number, (args: unknown[]) => any> | null {
  const table = FromRawLineData as Record<number, Record<number, (args: unknown[]) => any> | undefined>;
  const known = (api as unknown as { modelSchemaList?: number[] }).modelSchemaList?.[modelID];
  if (typeof known === 'number' && table[known]) return table[known] ?? null;
  const name = api.GetModelSchema(modelID);
  const index = (SchemaNames as string[][]).findIndex((names) => names?.includes(name));
  return index > 0 ? (table[index] ?? null) : null;
}
