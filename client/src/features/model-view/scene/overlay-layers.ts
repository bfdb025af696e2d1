/** Which scene entries go to which layer when the page's overlay colours the view. */
export interface OverlayLayers {
  /** Named by the overlay and shown: solid, in their entry's colour. */
  main: number[];
  /** Steel the overlay does not name, and named members filtered out: faint. */
  ghost: number[];
  context: number[];
  /** Named by an outlined entry: dark outline and thick axis. */
  over: number[];
  /** Members per overlay entry, in the model (before filters). */
  counts: number[];
  rest: number;
  contextCount: number;
}

export interface OverlayLayerInput {
  /** Per scene entry: is it building context. */
  isContext(i: number): boolean;
  count: number;
  /** Per scene entry: index of its overlay entry, -1 when not named. */
  index: Int16Array;
  outlined: readonly boolean[];
  hidden: ReadonlySet<number>;
  showRest: boolean;
  showContext: boolean;
  /** The view's other filters (class, storey, …). */
  passes(i: number): boolean;
  /** Left out by "isolate selection". */
  isolatedOut(i: number): boolean;
}

export function overlayLayers(input: OverlayLayerInput): OverlayLayers {
  const out: OverlayLayers = { main: [], ghost: [], context: [], over: [], counts: input.outlined.map(() => 0), rest: 0, contextCount: 0 };
  for (let i = 0; i < input.count; i++) {
    if (input.isContext(i)) {
      out.contextCount++;
      if (input.showContext) out.context.push(i);
      continue;
    }
    const k = input.index[i];
    const isolatedOut = input.isolatedOut(i);
    if (k < 0) {
      out.rest++;
      if (input.showRest && !isolatedOut) out.ghost.push(i);
      continue;
    }
    out.counts[k]++;
    if (!input.hidden.has(k) && input.passes(i) && !isolatedOut) {
      out.main.push(i);
      if (input.outlined[k]) out.over.push(i);
    } else if (input.showRest && !isolatedOut) out.ghost.push(i);
  }
  return out;
}
