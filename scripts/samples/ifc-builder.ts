/**
 * Small writer over web-ifc's write API (CreateModel, entity classes with attributes in
 * EXPRESS order, WriteLine, SaveModel) for our own demo models. Deterministic: GlobalIds
 * come from a seeded generator and the header timestamp is fixed after saving.
 */
import { Handle, IFC2X3, IFC4, IfcAPI, LogLevel } from 'web-ifc';

export type SampleSchema = 'IFC4' | 'IFC2X3';
export type V3 = [number, number, number];

const GUID_CHARS = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz_$';
const FIXED_TIMESTAMP = '2025-01-15T09:00:00';
const FIXED_EPOCH = 1736931600;

let apiPromise: Promise<IfcAPI> | null = null;
async function api(): Promise<IfcAPI> {
  apiPromise ??= (async () => {
    const a = new IfcAPI();
    await a.Init();
    a.SetLogLevel(LogLevel.LOG_LEVEL_OFF);
    return a;
  })();
  return apiPromise;
}

export class IfcBuilder {
  readonly S: any;
  private seed: number;
  ownerHistory: Handle<any> | null = null;
  bodyContext!: Handle<any>;

  private constructor(readonly api: IfcAPI, readonly model: number, readonly schema: SampleSchema, seed: number) {
    this.S = schema === 'IFC4' ? IFC4 : IFC2X3;
    this.seed = seed >>> 0 || 1;
  }

  static async create(schema: SampleSchema, seed: number): Promise<IfcBuilder> {
    const a = await api();
    const m = a.CreateModel({ schema, name: 'kestrel-yard.ifc', description: ['ViewDefinition [ReferenceView]'], authors: ['Gaugeline sample generator'], organizations: ['Gaugeline'], authorization: 'none' });
    return new IfcBuilder(a, m, schema, seed);
  }

  /** Seeded GlobalId (22 chars, first one 0–3 as the base-64 encoding requires). */
  guid(): any {
    let s = '';
    for (let i = 0; i < 22; i++) {
      this.seed = (Math.imul(this.seed, 1664525) + 1013904223) >>> 0;
      s += GUID_CHARS[(this.seed >>> 8) % (i === 0 ? 4 : 64)];
    }
    return new this.S.IfcGloballyUniqueId(s);
  }

  /** Writes an entity of class `cls` with attributes in EXPRESS order; returns its handle. */
  add(cls: string, ...args: unknown[]): Handle<any> {
    const Ctor = this.S[cls];
    if (!Ctor) throw new Error(`${cls} does not exist in ${this.schema}`);
    const e = new Ctor(...args);
    this.api.WriteLine(this.model, e);
    return new Handle(e.expressID);
  }

  label = (s: string | null) => (s === null ? null : new this.S.IfcLabel(s));
  id = (s: string | null) => (s === null ? null : new this.S.IfcIdentifier(s));
  len = (v: number) => new this.S.IfcLengthMeasure(v);
  pos = (v: number) => new this.S.IfcPositiveLengthMeasure(v);
  enumOf = (name: string, value: string) => ({ type: 3, value }) as unknown as { name: string };

  point(p: V3 | [number, number]): Handle<any> {
    return this.add('IfcCartesianPoint', p.map((v) => this.len(v)));
  }
  direction(d: V3 | [number, number]): Handle<any> {
    return this.add('IfcDirection', d.map((v) => new this.S.IfcReal(v)));
  }
  placement3d(origin: V3, z?: V3, x?: V3): Handle<any> {
    return this.add('IfcAxis2Placement3D', this.point(origin), z ? this.direction(z) : null, x ? this.direction(x) : null);
  }
  placement2d(origin: [number, number] = [0, 0]): Handle<any> {
    return this.add('IfcAxis2Placement2D', this.point(origin), null);
  }
  localPlacement(relTo: Handle<any> | null, origin: V3, z?: V3, x?: V3): Handle<any> {
    return this.add('IfcLocalPlacement', relTo, this.placement3d(origin, z, x));
  }
  /** IFC2X3 wants a profile position; IFC4 centres the profile when it is omitted. */
  profilePosition(): Handle<any> | null {
    return this.schema === 'IFC2X3' ? this.placement2d() : null;
  }
  bodyShape(items: Handle<any>[], type = 'SweptSolid'): Handle<any> {
    const rep = this.add('IfcShapeRepresentation', this.bodyContext, this.label('Body'), this.label(type), items);
    return this.add('IfcProductDefinitionShape', null, null, [rep]);
  }
  extrusion(profile: Handle<any>, position: Handle<any> | null, depth: number): Handle<any> {
    return this.add('IfcExtrudedAreaSolid', profile, position ?? this.placement3d([0, 0, 0]), this.direction([0, 0, 1]), this.pos(depth));
  }
  circle(radius: number): Handle<any> {
    return this.add('IfcCircleProfileDef', this.enumOf('IfcProfileTypeEnum', 'AREA'), null, this.profilePosition(), this.pos(radius));
  }

  propertySet(name: string, props: [string, unknown][], relatedTo: Handle<any>[]): void {
    const values = props.map(([n, v]) => this.add('IfcPropertySingleValue', this.id(n), null, v, null));
    const pset = this.add('IfcPropertySet', this.guid(), this.ownerHistory, this.label(name), null, values);
    this.add('IfcRelDefinesByProperties', this.guid(), this.ownerHistory, null, null, relatedTo, pset);
  }

  /** Bytes with a fixed FILE_NAME timestamp, so repeated runs give identical files. */
  save(): Uint8Array {
    const text = new TextDecoder().decode(this.api.SaveModel(this.model));
    this.api.CloseModel(this.model);
    const fixed = text
      .replace(/\/\*+[\s\S]*?\*+\/\n?/, '')
      .replace(/FILE_NAME\('[^']*','[^']*'/, `FILE_NAME('kestrel-yard.ifc','${FIXED_TIMESTAMP}'`);
    return new TextEncoder().encode(fixed);
  }

  get epoch(): number {
    return FIXED_EPOCH;
  }
}
