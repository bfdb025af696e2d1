/**
 * Types for the net-area solver. Units: mm and mm². The strip is the developed
 * (unfolded) centre-line of the cross-section: x runs along the member axis (the
 * force direction), y runs across the developed width from one edge.
 */

/** One hole on the developed strip. All lengths in mm. */
export interface StripHole {
  /** Position along the member axis, mm (any origin; only differences matter). */
  x: number;
  /** Position across the developed width, mm, measured from the strip's y = 0 edge. */
  y: number;
  /** Width deducted for this hole, mm (allowances already added by the caller). */
  d: number;
  /** Thickness of the pierced element, mm; defaults to the strip thickness. */
  t?: number;
  /**
   * Branch of a branched section (I/H, tee) the hole lies on. Chains never link
   * holes on different parts; each part is solved on its own and the deductions
   * are summed (conservative: it ignores stagger credit across a junction).
   */
  part?: number;
}

/** Solver options. */
export interface NetAreaOptions {
  /** Holes whose y differ by no more than this (mm) share a gauge line. Default 0.5 mm. */
  yTolerance?: number;
  /** How many runner-up chains to return for display. Default 5; 0 skips the ranking pass. */
  alternatives?: number;
}

/** Input: gross area plus the holes on the developed strip. */
export interface NetAreaInput extends NetAreaOptions {
  /** Gross area Ag, mm² (from the section, fillets included where the caller has them). */
  grossArea: number;
  /** Default thickness for holes without their own t, mm. */
  thickness: number;
  holes: readonly StripHole[];
}

/** One term of a chain's deduction, in mm². Deductions positive, credits negative. */
export type ChainTerm =
  | { kind: 'hole'; hole: number; d: number; t: number; area: number }
  | {
      kind: 'stagger';
      from: number;
      to: number;
      /** Stagger (pitch along x), mm. */
      s: number;
      /** Gauge (across the developed width), mm. */
      g: number;
      /** Thickness used for the credit, mm (the smaller one at a thickness change). */
      t: number;
      /** Credit s²·t/(4g), mm², entered with a negative sign in the sum. */
      area: number;
    };

/** A fracture chain and what it deducts. */
export interface Chain {
  /** 0-based input indices of the chain's holes, in order of increasing y. */
  holes: number[];
  /** 'zig-zag' covers straight chains with s = 0 too; 'straight-section' is a perpendicular cut through holes that overlap in projection (|Δx| < d). */
  kind: 'zig-zag' | 'straight-section';
  /** Σ hole areas − Σ stagger credits, mm². */
  deduction: number;
  /** Ag − deduction, mm² (not clamped; a hand-picked poor chain can exceed Ag). */
  netArea: number;
  terms: ChainTerm[];
}

/** Solver output. */
export interface NetAreaResult {
  grossArea: number;
  /** Minimum net area over all chains and straight sections, mm²; equals Ag when there are no holes. */
  netArea: number;
  /** Largest deduction, mm² (≥ 0). */
  deduction: number;
  /** The governing chain (one per part for branched sections, merged), or null when no holes. */
  governing: Chain | null;
  /** Runner-up distinct chains, best first (display only). */
  alternatives: Chain[];
  warnings: string[];
}
