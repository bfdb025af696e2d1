import { useCallback, useMemo, useState } from 'react';
import type { MemberRow } from '@shared/api';
import type { SceneModel } from '../scene/scene-model';
import { overlayIndexOf, type MemberOverlay, type OverlayChoice } from '../scene/member-overlay';
import { overlayLayers, type OverlayLayers } from '../scene/overlay-layers';

/** The view's filters other than the key: '' = any; `minUtil` '' = any. */
export interface ViewFilters {
  minUtil: string;
  ifcClass: string;
  storey: string;
  assembly: string;
  profile: string;
}

export interface OverlayView {
  overlay: MemberOverlay;
  layers: OverlayLayers;
  /** Colour (#RRGGBB) of a scene entry, null when the overlay does not name it. */
  colourAt(i: number): string | null;
  /** The page's words about a scene entry (the "rest" words when not named). */
  wordsAt(i: number): string[];
  hidden: ReadonlySet<number>;
  toggle(k: number): void;
}

/** Same filter rules as the band view; a member without a ledger row passes only when no filter is set. */
function rowPasses(r: MemberRow | undefined, f: ViewFilters): boolean {
  const none = f.minUtil === '' && f.ifcClass === '' && f.storey === '' && f.assembly === '' && f.profile === '';
  if (!r) return none;
  const threshold = f.minUtil === '' ? null : Number(f.minUtil);
  return (
    (threshold === null || (r.utilisation != null && r.utilisation >= threshold)) &&
    (f.ifcClass === '' || r.ifcClass === f.ifcClass) &&
    (f.storey === '' || r.storey === f.storey) &&
    (f.assembly === '' || r.assembly === f.assembly) &&
    (f.profile === '' || r.profile === f.profile)
  );
}

/**
 * The view's layers and colours while a page-given overlay colours it; null while the view
 * colours by result band (or the overlay is still loading).
 */
export function useOverlayView(args: {
  choice: OverlayChoice | undefined;
  model: SceneModel;
  rowAt(i: number): MemberRow | undefined;
  filters: ViewFilters;
  showRest: boolean;
  showContext: boolean;
  isolate: boolean;
  selectedSet: ReadonlySet<number>;
}): OverlayView | null {
  const { choice, model, rowAt, filters, showRest, showContext, isolate, selectedSet } = args;
  const overlay = choice?.active ? choice.overlay : null;
  const [hidden, setHidden] = useState<ReadonlySet<number>>(() => new Set());
  const toggle = useCallback(
    (k: number) =>
      setHidden((prev) => {
        const next = new Set(prev);
        if (next.has(k)) next.delete(k);
        else next.add(k);
        return next;
      }),
    [],
  );
  const index = useMemo(() => (overlay ? overlayIndexOf(model.entries.map((e) => e.globalId), overlay) : null), [model, overlay]);
  const { minUtil, ifcClass, storey, assembly, profile } = filters;
  const layers = useMemo(() => {
    if (!overlay || !index) return null;
    const f = { minUtil, ifcClass, storey, assembly, profile };
    return overlayLayers({
      count: model.entries.length,
      isContext: (i) => !!model.entries[i].context,
      index,
      outlined: overlay.entries.map((e) => !!e.outlined),
      hidden,
      showRest,
      showContext,
      passes: (i) => rowPasses(rowAt(i), f),
      isolatedOut: (i) => isolate && selectedSet.size > 0 && !selectedSet.has(i),
    });
  }, [overlay, index, model, hidden, showRest, showContext, rowAt, minUtil, ifcClass, storey, assembly, profile, isolate, selectedSet]);

  // Stable while the overlay is, so the colours are repainted only when they change.
  const colourAt = useMemo(() => (overlay && index ? (i: number) => (index[i] < 0 ? null : overlay.entries[index[i]].colour) : null), [overlay, index]);
  return useMemo(() => {
    if (!overlay || !layers || !colourAt) return null;
    return {
      overlay,
      layers,
      hidden,
      toggle,
      colourAt,
      wordsAt: (i: number) => overlay.members.get(model.entries[i].globalId)?.words ?? [overlay.rest.words],
    };
  }, [overlay, layers, colourAt, hidden, toggle, model]);
}
