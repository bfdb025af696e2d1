/**
 * Analysis members (IfcStructuralCurveMember) and their end forces from IFC4/IFC4X3 results:
 * IfcStructuralCurveReaction linked by IfcRelConnectsStructuralActivity, carrying an
 * IfcStructuralLoadConfiguration of single forces (Head/Tail) or one single force.
 *
 * Sign convention (IFC defines none): the stated forces act ON the member at that location.
 * GLOBAL_COORDS vectors are projected on the member axis (start → end); LOCAL_COORDS use ForceX.
 * Internal axial force, tension positive: N = −F·axis at the start half, N = +F·axis at the end half.
 */
import * as W from 'web-ifc';
import { dot, normalize, sub, transformPoint } from './mat4.ts';
import type { ModelContext } from './model-context.ts';
import { objectPlacement, pointMm } from './placements.ts';
import type { RelationsIndex } from './relations-index.ts';
import { enumValue, num, ref, refs, str } from './step-values.ts';
import type { AnalysisEndForce, ExtractedAnalysisMember, Vec3 } from './types.ts';

const r3 = (v: number) => Math.round(v * 1000) / 1000 + 0;

function edgeEnds(ctx: ModelContext, shapeId: number | undefined): [Vec3, Vec3] | null {
  for (const repId of refs(ctx.line(shapeId)?.Representations)) {
    for (const it of refs(ctx.line(repId)?.Items)) {
      const e = ctx.line(it);
      if (!e || !('EdgeStart' in e)) continue;
      const a = pointMm(ctx, ref(ctx.line(ref(e.EdgeStart))?.VertexGeometry));
      const b = pointMm(ctx, ref(ctx.line(ref(e.EdgeEnd))?.VertexGeometry));
      return [a, b];
    }
  }
  return null;
}

function loadCaseOf(ctx: ModelContext, ix: RelationsIndex, activityId: number): string {
  for (const g of ix.groupsOf.get(activityId) ?? []) {
    const grp = ctx.line(g);
    if (!grp) continue;
    if (ctx.isA(g, 'IfcStructuralResultGroup')) {
      const lg = ctx.line(ref(grp.ResultForLoadGroup));
      return str(lg?.Name) ?? str(grp.Name) ?? 'default';
    }
    return str(grp.Name) ?? 'default';
  }
  return 'default';
}

function singleForces(ctx: ModelContext, loadId: number | undefined): { id: number; location: number | null }[] {
  if (ctx.isA(loadId, 'IfcStructuralLoadConfiguration')) {
    const l = ctx.line(loadId);
    const locs: unknown[] = Array.isArray(l.Locations) ? l.Locations : [];
    return refs(l.Values).map((id, i) => {
      const loc = locs[i];
      const first = Array.isArray(loc) ? num(loc[0]) : num(loc);
      return { id, location: first === undefined ? null : first * ctx.units.lengthToMm };
    });
  }
  return loadId === undefined ? [] : [{ id: loadId, location: null }];
}

export function extractAnalysisMembers(ctx: ModelContext, ix: RelationsIndex): ExtractedAnalysisMember[] {
  const out: ExtractedAnalysisMember[] = [];
  // Surface members are listed too, so links to walls and slabs (no end forces) stay visible.
  const ids = [...ctx.idsOfType(W.IFCSTRUCTURALCURVEMEMBER, true), ...ctx.idsOfType(W.IFCSTRUCTURALSURFACEMEMBER, true)];
  for (const id of ids) {
    const l = ctx.line(id);
    if (!l) continue;
    const placement = l.ObjectPlacement ? objectPlacement(ctx, ref(l.ObjectPlacement)) : null;
    const ends = edgeEnds(ctx, ref(l.Representation));
    const [start, end] = ends ? ends.map((p) => (placement ? transformPoint(placement, p) : p)) : [null, null];
    const axis = start && end ? normalize(sub(end, start)) : null;
    const length = start && end ? Math.hypot(...sub(end, start)) : null;
    const endForces: AnalysisEndForce[] = [];
    for (const act of ix.activities.get(id) ?? []) {
      if (!ctx.isA(act, 'IfcStructuralCurveReaction')) continue;
      const a = ctx.line(act);
      const coords = enumValue(a.GlobalOrLocal) === 'LOCAL_COORDS' ? 'LOCAL_COORDS' : 'GLOBAL_COORDS';
      const loadCase = loadCaseOf(ctx, ix, act);
      for (const sf of singleForces(ctx, ref(a.AppliedLoad))) {
        const f = ctx.line(sf.id);
        if (!f || !('ForceX' in f)) continue;
        const F: Vec3 = [(num(f.ForceX) ?? 0) * ctx.units.forceToN, (num(f.ForceY) ?? 0) * ctx.units.forceToN, (num(f.ForceZ) ?? 0) * ctx.units.forceToN];
        const axial = coords === 'LOCAL_COORDS' || !axis ? F[0] : dot(F, axis);
        const location = sf.location ?? 0;
        const atStart = length === null ? location === 0 : location <= length / 2;
        endForces.push({ loadCase, location: r3(location), axial: r3(axial), internalAxial: r3(atStart ? -axial : axial), force: F.map(r3) as Vec3, coordinates: coords });
      }
    }
    const linked = (ix.productLinks.get(id) ?? []).filter((p) => !ctx.classUpper(p).startsWith('IFCSTRUCTURAL'));
    out.push({
      globalId: str(l.GlobalId) ?? `#${id}`,
      name: str(l.Name),
      predefinedType: enumValue(l.PredefinedType),
      linkedPhysicalGlobalIds: linked.map((p) => str(ctx.line(p)?.GlobalId) ?? `#${p}`).sort(),
      start: start ? (start.map(r3) as Vec3) : null,
      end: end ? (end.map(r3) as Vec3) : null,
      endForces,
    });
  }
  return out.sort((a, b) => a.globalId.localeCompare(b.globalId));
}
