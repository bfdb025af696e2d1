/**
 * Golden snapshot of a sample's extraction: stable ordering and rounded numbers, so a change
 * in the reader shows up as a readable diff. Written only by update-golden.ts; the test reads.
 */
import type { ExtractedModel } from '../../server/ifc/types.ts';

export const GOLDEN_SAMPLES = ['kestrel-yard-shed.ifc', 'kestrel-yard-shed-ifc2x3.ifc'] as const;

export const goldenPath = (repoRoot: string, sample: string) => `${repoRoot}/tests/ifc/golden/${sample.replace(/\.ifc$/, '')}.json`;

function round(value: unknown): unknown {
  if (typeof value === 'number') return Math.round(value * 100) / 100 + 0; // +0 turns -0 into 0
  if (Array.isArray(value)) return value.map(round);
  if (value && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const k of Object.keys(value).sort()) out[k] = round((value as Record<string, unknown>)[k]);
    return out;
  }
  return value;
}

export function goldenOf(model: ExtractedModel): unknown {
  return round({
    ...model,
    members: [...model.members].sort((a, b) => a.globalId.localeCompare(b.globalId)),
    boltGroups: [...model.boltGroups].sort((a, b) => a.globalId.localeCompare(b.globalId)),
  });
}

export const goldenText = (model: ExtractedModel) => JSON.stringify(goldenOf(model), null, 2) + '\n';
