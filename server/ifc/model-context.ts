/**
 * Per-read state shared by the extractors: the open model, a small line cache, class-name
 * lookup, units and warnings. Lives only for one readIfcModel call.
 *
 * Lines come from the file's text where it can (step-text.ts), else from web-ifc's GetLine.
 * The cache is direct-mapped (slot = id mod size) and small: the extractors read most lines
 * once and ask again only right away (className, then the line), and with lines this cheap to
 * read, keeping many alive costs more in garbage collection than reading them again (a cache of
 * 50,000 lines doubled the CPU time of extraction: the kept lines are copied into the old
 * generation). Through GetLine (7 µs a line) a larger table is kept.
 */
import { FromRawLineData, type IfcAPI, InheritanceDef, SchemaNames } from 'web-ifc';
import { DEFER, type StepText } from './step-text.ts';
import { num, numList, ref, refs, str } from './step-values.ts';
import type { IfcSchema, UnitsInfo } from './types.ts';
import { WarningCollector } from './warnings.ts';

const POINT = new TextEncoder().encode('IFCCARTESIANPOINT');
const DIRECTION = new TextEncoder().encode('IFCDIRECTION');

/** Cache slots when lines come from the text, and when they come through GetLine. */
export const CACHE_SIZE_TEXT = 1024;
export const CACHE_SIZE_WEB_IFC = 65_536;

export class ModelContext {
  /** Replaced only by a read of bolt groups alone, whose earlier warnings the reader has already (bolt-groups-read.ts). */
  warnings = new WarningCollector();
  units!: UnitsInfo;
  private readonly slotIds: Float64Array;
  private readonly slotLines: any[];
  private typeNames = new Map<number, string>();
  private upperNames = new Map<string, string>();
  /** Cache misses, and how many of them went through web-ifc's GetLine (ReadStats). */
  linesRead = 0;
  linesFromWebIfc = 0;

  /** web-ifc's line constructors for this model's schema (what GetLine uses); null: GetLine only. */
  private readonly fromRaw: Record<number, (args: unknown[]) => any> | null;

  /** Schema index of web-ifc's tables (constructors, inheritance) when classes are listed from the text. */
  private readonly listsSchema: number | null = null;

  constructor(
    readonly api: IfcAPI,
    /**
     * The web-ifc model, or how to open it when first needed: a read whose classes are listed
     * from the text (`textLists`) may never need it.
     */
    private readonly model: number | (() => number),
    readonly schema: IfcSchema,
    /** Cache slots (tests make it tiny); by default CACHE_SIZE_TEXT or CACHE_SIZE_WEB_IFC. */
    cacheSize: number | undefined = undefined,
    /** The file's text, when lines may be read from it instead of through GetLine. */
    private readonly text: StepText | null = null,
    /** The file's schema as its header names it: list classes from the text's index instead of web-ifc's. */
    textLists?: { schemaIdentifier: string },
  ) {
    if (text && textLists) {
      const index = schemaIndexOf(textLists.schemaIdentifier);
      if (index > 0 && text.listsExact) this.listsSchema = index;
    }
    this.fromRaw = text ? (this.listsSchema !== null ? tableFor(this.listsSchema) : constructorsFor(api, this.modelID)) : null;
    const size = Math.max(1, Math.floor(cacheSize ?? (this.fromRaw ? CACHE_SIZE_TEXT : CACHE_SIZE_WEB_IFC)));
    this.slotIds = new Float64Array(size);
    this.slotLines = new Array(size).fill(null);
  }

  /** web-ifc's id of the open model (opened now when it was left until needed). */
  get modelID(): number {
    return typeof this.model === 'number' ? this.model : this.model();
  }

  /** Classes are listed from the file's text, not from web-ifc's model. */
  get listsFromText(): boolean {
    return this.listsSchema !== null;
  }

  /** web-ifc's schema index the text's lists and line constructors use (-1 when not listing from the text). */
  get listsSchemaIndex(): number {
    return this.listsSchema ?? -1;
  }

  /** The raw (not flattened) line; null when the id does not exist or fails to parse. */
  line(id: number | undefined): any {
    if (id === undefined || id <= 0) return null;
    const slot = id % this.slotIds.length;
    if (this.slotIds[slot] === id) return this.slotLines[slot];
    this.linesRead++;
    let l = this.fromText(id);
    if (l === DEFER) {
      this.linesFromWebIfc++;
      try {
        l = this.api.GetLine(this.modelID, id) ?? null;
      } catch {
        l = null;
      }
    }
    this.slotIds[slot] = id;
    this.slotLines[slot] = l;
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

  /**
   * refs() of attribute `attribute` (argument `index`) of a line of class `name`, straight from
   * the text where it can, else from the line object. `single`: web-ifc builds one reference
   * for this attribute even where the file writes a list (a list is then left to the line object).
   */
  refsAt(id: number, name: Uint8Array, index: number, attribute: string, single = false): number[] {
    if (this.text && id > 0) {
      const r = this.text.handles(id, name, index, single);
      if (r !== DEFER) {
        this.linesRead++;
        return r;
      }
    }
    return refs(this.line(id)?.[attribute]);
  }

  /**
   * ref() of each of the first `count` attributes of a line of class `name`, when all of them
   * are plain references or '$' in the text; null when the line must be read as an object
   * (no text, another class, anything else in those arguments).
   */
  refsFromText(id: number, name: Uint8Array, count: number): (number | undefined)[] | null {
    return this.refsFromTextAt(id, name, 0, count);
  }

  /** str() of a plain string attribute (argument `index` of a line of class `name`), from the text where it can. */
  stringAt(id: number | undefined, name: Uint8Array, index: number, attribute: string): string | null {
    if (this.text && id !== undefined && id > 0) {
      const v = this.text.stringAt(id, name, index);
      if (v !== DEFER) {
        this.linesRead++;
        return v;
      }
    }
    return str(this.line(id)?.[attribute]);
  }

  /** num() of a plain number attribute, from the text where it can. */
  realAt(id: number | undefined, name: Uint8Array, index: number, attribute: string): number | undefined {
    if (this.text && id !== undefined && id > 0) {
      const v = this.text.realAt(id, name, index);
      if (v !== DEFER) {
        this.linesRead++;
        return v ?? undefined;
      }
    }
    return num(this.line(id)?.[attribute]);
  }

  /** refsFromText for `count` attributes from argument `first` on. */
  refsFromTextAt(id: number, name: Uint8Array, first: number, count: number): (number | undefined)[] | null {
    if (!this.text || id <= 0) return null;
    const out = this.text.handlesFrom(id, name, first, count);
    if (out === DEFER) return null;
    this.linesRead++;
    return out;
  }

  /** ref() of a single-reference attribute, as refsAt reads it. */
  refAt(id: number, name: Uint8Array, index: number, attribute: string): number | undefined {
    if (this.text && id > 0) {
      const r = this.text.handle(id, name, index);
      if (r !== DEFER) {
        this.linesRead++;
        return r ?? undefined;
      }
    }
    return ref(this.line(id)?.[attribute]);
  }

  /**
   * Entity class name in IFC spelling, e.g. 'IfcBeam'; '' when unknown. From the text's name
   * of the line when the line is not in the cache (no object is built for it): most callers
   * then read a few attributes straight from the text.
   */
  className(id: number | undefined): string {
    if (id === undefined) return '';
    let code: number;
    const slot = id > 0 ? id % this.slotIds.length : -1;
    const fromText = this.text && this.fromRaw && slot >= 0 && this.slotIds[slot] !== id ? this.text.typeCodeOf(id) : DEFER;
    // A type web-ifc has no constructor for makes no line object, so it has no class here either.
    if (fromText !== DEFER && fromText !== null && typeof this.fromRaw![fromText] === 'function') code = fromText;
    else {
      const l = this.line(id);
      if (!l) return '';
      code = l.type as number;
    }
    let n = this.typeNames.get(code);
    if (n === undefined) {
      n = this.api.GetNameFromTypeCode(code) ?? '';
      this.typeNames.set(code, n);
    }
    return n;
  }

  /** className() in capitals, as the readers compare classes (made once per class, not per call). */
  classUpper(id: number | undefined): string {
    const n = this.className(id);
    let u = this.upperNames.get(n);
    if (u === undefined) {
      u = n.toUpperCase();
      this.upperNames.set(n, u);
    }
    return u;
  }

  isA(id: number | undefined, ...names: string[]): boolean {
    const c = this.classUpper(id);
    return names.some((n) => n.toUpperCase() === c);
  }

  /** How many lines of the class there are, without listing them (each listed id is a wasm call). */
  countOfType(typeCode: number, includeInherited = false): number {
    if (this.listsSchema !== null) return this.typesOf(typeCode, includeInherited).reduce((n, t) => n + this.text!.idsOfType(t).length, 0);
    try {
      return this.api.GetLineIDsWithType(this.modelID, typeCode, includeInherited).size();
    } catch {
      return 0;
    }
  }

  idsOfType(typeCode: number, includeInherited = false): number[] {
    if (this.listsSchema !== null) return this.typesOf(typeCode, includeInherited).flatMap((t) => this.text!.idsOfType(t));
    try {
      return [...this.api.GetLineIDsWithType(this.modelID, typeCode, includeInherited)];
    } catch {
      return [];
    }
  }

  /** The class and, when asked, its subclasses, in the order web-ifc's GetLineIDsWithType takes them. */
  private typesOf(typeCode: number, includeInherited: boolean): number[] {
    const sub = includeInherited ? (InheritanceDef as Record<number, Record<number, number[] | undefined>>)[this.listsSchema!]?.[typeCode] : undefined;
    return sub ? [typeCode, ...sub] : [typeCode];
  }

  /** File length → mm. */
  mm(v: number | undefined): number | undefined {
    return v === undefined ? undefined : v * this.units.lengthToMm;
  }
}

type Constructors = Record<number, (args: unknown[]) => any>;
const tableFor = (index: number): Constructors | null => (FromRawLineData as Record<number, Constructors | undefined>)[index] ?? null;

/** web-ifc's index of a schema name as a header writes it (its SchemaNames); -1 when unknown. */
function schemaIndexOf(name: string): number {
  const upper = name.toUpperCase();
  return (SchemaNames as string[][]).findIndex((names) => names?.includes(upper));
}

/** FromRawLineData of the model's schema, found the way GetLine finds it; null when unsure. */
function constructorsFor(api: IfcAPI, modelID: number): Constructors | null {
  const known = (api as unknown as { modelSchemaList?: number[] }).modelSchemaList?.[modelID];
  if (typeof known === 'number' && tableFor(known)) return tableFor(known);
  const index = schemaIndexOf(api.GetModelSchema(modelID));
  return index > 0 ? tableFor(index) : null;
}
