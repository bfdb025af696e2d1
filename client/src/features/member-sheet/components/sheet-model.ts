import type { MemberSheet } from '@shared/api/member-sheet';
import type { MemberEndDetail } from '@shared/api/member-detail';
import type { Chain, NetAreaResult } from '@shared/engine/net-area/types';

/** Helpers that read the member sheet the way the drawing and the steps need it. */

export type SheetResult = NonNullable<MemberSheet['result']>;

/** The engine's net-area result, if the sheet carries one of the expected shape. */
export function netResult(result: SheetResult | null): NetAreaResult | null {
  const net = result?.net as NetAreaResult | null | undefined;
  if (!net || typeof net !== 'object' || typeof net.netArea !== 'number' || !Array.isArray(net.alternatives)) return null;
  return net;
}

/**
 * The end the check was governed by: the lowest design capacity, the first one on a tie
 * (as the import picks it). The net-area chains index this end's holes.
 */
export function governingEndIndex(ends: readonly MemberEndDetail[]): number {
  let best = -1;
  ends.forEach((e, i) => {
    if (e.designCapacity == null) return;
    if (best < 0 || e.designCapacity < (ends[best].designCapacity ?? Infinity)) best = i;
  });
  return best;
}

/** Whether the chains (indices into the engine's input holes) can be drawn on this end. */
export function chainsFitEnd(end: MemberEndDetail, checkInput: unknown): boolean {
  const holes = (checkInput as { holes?: { x: number; y: number }[] } | null)?.holes;
  if (!Array.isArray(holes) || holes.length !== end.holes.length) return false;
  return holes.every((h, i) => Math.abs(h.x - end.holes[i].x) < 0.01 && Math.abs(h.y - end.holes[i].y) < 0.01);
}

/** Hole diameter used where the model gives none: the engine's stated assumption, else bolt + 2 mm. */
export function assumedHoleDiameter(result: SheetResult | null, boltDiameter: number | null): number | null {
  const a = result?.assumptions.find((x) => x.name === 'hole diameter');
  const n = a ? parseFloat(String(a.value)) : NaN;
  if (Number.isFinite(n) && n > 0) return n;
  return boltDiameter ? boltDiameter + 2 : null;
}

export interface ChainView {
  key: string;
  label: string;
  chain: Chain;
  governing: boolean;
}

/** The governing chain and the runners-up, labelled for the list beside the drawing. */
export function chainViews(net: NetAreaResult | null): ChainView[] {
  if (!net?.governing) return [];
  const out: ChainView[] = [{ key: 'g', label: 'Governing chain', chain: net.governing, governing: true }];
  net.alternatives.forEach((chain, i) => out.push({ key: `a${i}`, label: `Next chain ${i + 1}`, chain, governing: false }));
  return out;
}

/** "holes 2 → 1 (zig-zag)" in 1-based hole numbers as drawn. */
export function chainHoles(chain: Chain): string {
  return chain.holes.map((h) => h + 1).join(' → ');
}
