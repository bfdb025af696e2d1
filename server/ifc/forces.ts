/**
 * Design axial forces stated as properties on the physical member. Convention (ours, stated
 * in the returned data): axial force in N, tension positive, one value per load case.
 */
import type { ModelContext } from './model-context.ts';
import { forceN, type PropertyContainer, readPropertyContainers } from './property-sets.ts';
import type { RelationsIndex } from './relations-index.ts';
import type { ForcePsetSpec, MemberForce } from './types.ts';

export const DEFAULT_FORCE_PSETS: ForcePsetSpec[] = [{ pset: 'Gaugeline_MemberForces', force: 'AxialForce', loadCase: 'LoadCase' }];

export const FORCE_CONVENTION =
  'Axial force in N, tension positive. Property-set forces are taken as written (the set is ' +
  'defined as tension positive). Analysis results are member-end forces acting on the member: ' +
  'the end force is projected on the member axis (start to end); N = −F_head·axis at the start ' +
  'and N = +F_tail·axis at the end; the member value is the larger of the two (governing tension).';

/**
 * Each set with a matching name is one load case, so a member may carry several. `own` are
 * the element's own property containers when the caller has read them already.
 */
export function readMemberForces(ctx: ModelContext, ix: RelationsIndex, elementId: number, specs: ForcePsetSpec[], own?: PropertyContainer[]): MemberForce[] {
  const out: MemberForce[] = [];
  const sets = own ?? readPropertyContainers(ctx, ix.psets.get(elementId));
  for (const spec of specs) {
    for (const { props } of sets.filter((c) => c.name === spec.pset)) {
    const f = props.get(spec.force);
    const n = forceN(ctx, f);
    if (n === undefined) {
      ctx.warnings.add('force.not-a-number', 'A force property is present but has no numeric value.', spec.pset);
      continue;
    }
    const lc = spec.loadCase ? props.get(spec.loadCase)?.value : undefined;
    out.push({ loadCase: lc === undefined || lc === null ? 'default' : String(lc), axialForce: Math.round(n * 1000) / 1000, source: 'property-set', from: spec.pset });
    }
  }
  return out;
}
