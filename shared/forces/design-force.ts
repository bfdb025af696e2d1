import { tensionEnvelope } from './parse-forces-csv';

/** Sources of design forces, strongest first: an engineer's file beats what the model carries. */
export const FORCE_SOURCE_ORDER = ['forces-csv', 'property-set', 'analysis-model'] as const;

/**
 * The design force of a member (N, tension positive): the largest tension over the load
 * cases of the strongest source that has any force for it; null when that source has no tension.
 */
export function designForceFrom(forces: { loadCase: string; axialN: number; source: string }[]): { force: number | null; source: string | null } {
  for (const source of FORCE_SOURCE_ORDER) {
    const own = forces.filter((f) => f.source === source);
    if (own.length) return { force: tensionEnvelope(own)?.axialN ?? null, source };
  }
  return { force: null, source: null };
}
