/**
 * Walks an element's representation items without asking web-ifc to tessellate anything
 * (one malformed entity can make the geometry kernel loop forever). It collects extruded
 * solids, boolean cutters and, for faceted bodies, the bounding box of their vertices —
 * all in the element's placement frame, mm.
 */
import type { ModelContext } from './model-context.ts';
import { IDENTITY, type Mat4, multiply, transformPoint } from './mat4.ts';
import { axisPlacement, direction, pointMm, transformOperator } from './placements.ts';
import { enumValue, num, ref, refs, str } from './step-values.ts';
import type { Vec3 } from './types.ts';

export interface SweptSolid {
  solidId: number;
  /** Placement frame ← solid Position. */
  toPlacement: Mat4;
  profileId: number | undefined;
  /** Extrusion direction in the solid's Position frame (unit). */
  dir: Vec3;
  depth: number;
}

export interface Body {
  extrusions: SweptSolid[];
  cutters: SweptSolid[];
  /** Vertices' box of faceted items, placement frame. */
  brepBox: { min: Vec3; max: Vec3 } | null;
  axisLine: [Vec3, Vec3] | null;
}

const MAX_BREP_POINTS = 20000;

const asName = (n: string) => new TextEncoder().encode(n);
/** Entity names as written in capitals, for reading their attributes straight from the text. */
const EXTRUDED_AREA_SOLID = asName('IFCEXTRUDEDAREASOLID');
const MAPPED_ITEM = asName('IFCMAPPEDITEM');
const REPRESENTATION_MAP = asName('IFCREPRESENTATIONMAP');
const SHAPE_REPRESENTATION = asName('IFCSHAPEREPRESENTATION');
const PRODUCT_DEFINITION_SHAPE = asName('IFCPRODUCTDEFINITIONSHAPE');

export function emptyBody(): Body {
  return { extrusions: [], cutters: [], brepBox: null, axisLine: null };
}

/**
 * An extruded solid's swept area, position and direction references and its depth (file
 * units): straight from the text for a plain IfcExtrudedAreaSolid (no line object: these and
 * the mapped items are a fifth of a steel model's lines), else from its line (the tapered kind
 * too); null when there is none.
 */
export function extrusion(ctx: ModelContext, id: number): { sweptArea?: number; position?: number; direction?: number; depth?: number } | null {
  const r = ctx.refsFromText(id, EXTRUDED_AREA_SOLID, 3);
  if (r) return { sweptArea: r[0], position: r[1], direction: r[2], depth: ctx.realAt(id, EXTRUDED_AREA_SOLID, 3, 'Depth') };
  const l = ctx.line(id);
  return l ? { sweptArea: ref(l.SweptArea), position: ref(l.Position), direction: ref(l.ExtrudedDirection), depth: num(l.Depth) } : null;
}

function sweptSolid(ctx: ModelContext, id: number, t: Mat4): SweptSolid | null {
  const e = extrusion(ctx, id);
  return e && {
    solidId: id,
    toPlacement: multiply(t, axisPlacement(ctx, e.position)),
    profileId: e.sweptArea,
    dir: direction(ctx, e.direction, [0, 0, 1]),
    depth: ctx.mm(e.depth) ?? 0,
  };
}

class Walker {
  body = emptyBody();
  private points = 0;
  constructor(private ctx: ModelContext) {}

  item(id: number | undefined, t: Mat4, asCutter: boolean, depth: number): void {
    const ctx = this.ctx;
    if (id === undefined || depth > 32) return;
    const cls = ctx.classUpper(id);
    if (cls === 'IFCEXTRUDEDAREASOLID' || cls === 'IFCEXTRUDEDAREASOLIDTAPERED') {
      const solid = sweptSolid(ctx, id, t);
      if (solid) (asCutter ? this.body.cutters : this.body.extrusions).push(solid);
      return;
    }
    if (cls === 'IFCMAPPEDITEM') {
      const mapped = mappedItem(ctx, id);
      if (!mapped.source) return;
      const m = multiply(t, multiply(transformOperator(ctx, mapped.target), axisPlacement(ctx, mapped.origin)));
      for (const it of representationItems(ctx, mapped.representation)) this.item(it, m, asCutter, depth + 1);
      return;
    }
    const l = ctx.line(id);
    if (!l) return;
    switch (cls) {
      case 'IFCBOOLEANRESULT':
      case 'IFCBOOLEANCLIPPINGRESULT': {
        const op = enumValue(l.Operator);
        this.item(ref(l.FirstOperand), t, asCutter, depth + 1);
        if (op === 'DIFFERENCE') this.item(ref(l.SecondOperand), t, !asCutter, depth + 1);
        else if (op === 'UNION') this.item(ref(l.SecondOperand), t, asCutter, depth + 1);
        return;
      }
      case 'IFCFACETEDBREP':
      case 'IFCFACETEDBREPWITHVOIDS':
        if (!asCutter) this.brep(ref(l.Outer), t);
        return;
      default:
        return;
    }
  }

  private brep(shellId: number | undefined, t: Mat4): void {
    const ctx = this.ctx;
    const shell = ctx.line(shellId);
    for (const faceId of refs(shell?.CfsFaces)) {
      for (const boundId of refs(ctx.line(faceId)?.Bounds)) {
        const loop = ctx.line(ref(ctx.line(boundId)?.Bound));
        for (const pid of refs(loop?.Polygon)) {
          if (this.points++ > MAX_BREP_POINTS) return;
          this.extend(transformPoint(t, pointMm(ctx, pid)));
        }
      }
    }
  }

  private extend(p: Vec3): void {
    const b = this.body;
    if (!b.brepBox) b.brepBox = { min: [...p] as Vec3, max: [...p] as Vec3 };
    else for (let i = 0; i < 3; i++) {
      b.brepBox.min[i] = Math.min(b.brepBox.min[i], p[i]);
      b.brepBox.max[i] = Math.max(b.brepBox.max[i], p[i]);
    }
  }
}

/** Reads the 'Body' (or first) shape representation and the 'Axis' curve of a product. */
export function readBody(ctx: ModelContext, productShapeId: number | undefined): Body {
  const walker = new Walker(ctx);
  const reps = representations(ctx, productShapeId);
  const body = reps.find((r) => r.ident === 'body') ?? reps.find((r) => !['axis', 'box', 'footprint', 'reference', 'annotation'].includes(r.ident));
  if (body) for (const it of body.items) walker.item(it, IDENTITY, false, 0);
  const axis = reps.find((r) => r.ident === 'axis');
  if (axis) walker.body.axisLine = readAxisCurve(ctx, axis.items[0]);
  return walker.body;
}

/**
 * An IfcMappedItem's target operator and its map's origin and representation: from the text
 * where they are plain references, else from the lines. `source`: false when the item or its
 * map has no line.
 */
export function mappedItem(ctx: ModelContext, id: number): { target?: number; origin?: number; representation?: number; source: boolean } {
  const item = ctx.refsFromText(id, MAPPED_ITEM, 2);
  const map = item?.[0] === undefined ? null : ctx.refsFromText(item[0], REPRESENTATION_MAP, 2);
  if (item && map) return { target: item[1], origin: map[0], representation: map[1], source: true };
  const l = ctx.line(id);
  const src = ctx.line(ref(l?.MappingSource));
  return { target: ref(l?.MappingTarget), origin: ref(src?.MappingOrigin), representation: ref(src?.MappedRepresentation), source: !!src };
}

/** The shape representations of an IfcProductDefinitionShape that can be read, in order. */
export function representations(ctx: ModelContext, productShapeId: number | undefined): { id: number; ident: string; items: number[] }[] {
  const ids = productShapeId === undefined ? [] : ctx.refsAt(productShapeId, PRODUCT_DEFINITION_SHAPE, 2, 'Representations');
  return ids.map((id) => representation(ctx, id)).filter((r) => r !== null);
}

/** The items of a shape representation (from the text when it is a plain IfcShapeRepresentation). */
export function representationItems(ctx: ModelContext, id: number | undefined): number[] {
  return id === undefined ? [] : ctx.refsAt(id, SHAPE_REPRESENTATION, 3, 'Items');
}

/** A representation's identifier (lower case) and items; from the text for a plain IfcShapeRepresentation, else its line (null when there is none). */
function representation(ctx: ModelContext, id: number): { id: number; ident: string; items: number[] } | null {
  if (ctx.classUpper(id) === 'IFCSHAPEREPRESENTATION') {
    const items = ctx.refsAt(id, SHAPE_REPRESENTATION, 3, 'Items');
    return { id, ident: (ctx.stringAt(id, SHAPE_REPRESENTATION, 1, 'RepresentationIdentifier') ?? '').toLowerCase(), items };
  }
  const l = ctx.line(id);
  return l ? { id, ident: (str(l.RepresentationIdentifier) ?? '').toLowerCase(), items: refs(l.Items) } : null;
}

function readAxisCurve(ctx: ModelContext, id: number | undefined): [Vec3, Vec3] | null {
  const cls = ctx.classUpper(id);
  const l = ctx.line(id);
  if (cls === 'IFCPOLYLINE') {
    const pts = refs(l?.Points);
    if (pts.length >= 2) return [pointMm(ctx, pts[0]), pointMm(ctx, pts[pts.length - 1])];
  }
  if (cls === 'IFCTRIMMEDCURVE') {
    const basis = ctx.line(ref(l?.BasisCurve));
    if (basis && ctx.isA(ref(l?.BasisCurve), 'IfcLine')) {
      const p0 = pointMm(ctx, ref(basis.Pnt));
      const vec = ctx.line(ref(basis.Dir));
      const d = direction(ctx, ref(vec?.Orientation), [0, 0, 1]);
      const mag = ctx.mm(num(vec?.Magnitude)) ?? 1;
      const trim = (x: any) => (Array.isArray(x) ? x.map((v: any) => num(v)).find((v: any) => v !== undefined) : undefined) ?? 0;
      const t1 = trim(l.Trim1);
      const t2 = trim(l.Trim2);
      const at = (t: number): Vec3 => [p0[0] + d[0] * mag * t, p0[1] + d[1] * mag * t, p0[2] + d[2] * mag * t];
      return [at(t1), at(t2)];
    }
  }
  return null;
}
