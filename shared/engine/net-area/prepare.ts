import type { StripHole } from './types.ts';

/** Default same-gauge-line tolerance, mm: absorbs BIM round-off in hole positions. */
export const DEFAULT_Y_TOLERANCE = 0.5;

/**
 * Holes sorted by (y, x) in flat typed arrays, with gauge lines resolved.
 * Lengths in mm, w = d·t in mm². Built once per pattern so the O(n²) loops
 * touch nothing but numbers.
 */
export interface PreparedStrip {
  n: number;
  /** order[k] = input index of the k-th hole in (y, x) order. */
  order: Int32Array;
  x: Float64Array;
  y: Float64Array;
  d: Float64Array;
  t: Float64Array;
  /** Hole area d·t, mm². */
  w: Float64Array;
  /** Gauge-line number of each sorted hole (0, 1, 2 … in increasing y). */
  line: Int32Array;
  /** lineStart[k] = sorted position of the first hole on hole k's gauge line. */
  lineStart: Int32Array;
  lineCount: number;
}

/**
 * Sort holes by y (then x) and group them into gauge lines: a new line starts
 * where the gap to the previous hole's y exceeds `yTolerance` (single linkage,
 * so a run of holes each within tolerance of the next is one line). Holes on one
 * line never become consecutive chain members, which also keeps g > tolerance
 * and so the s²/4g credit finite (design-rules §9.3 items 1 and 5).
 * @param holes holes on the developed strip (mm)
 * @param thickness default thickness for holes without t (mm)
 * @param yTolerance same-line tolerance (mm, ≥ 0)
 */
export function prepareStrip(holes: readonly StripHole[], thickness: number, yTolerance = DEFAULT_Y_TOLERANCE, reuse?: PreparedStrip): PreparedStrip {
  const n = holes.length;
  const fits = reuse !== undefined && reuse.order.length >= n;
  const order = fits ? reuse.order : new Int32Array(n);
  const x = fits ? reuse.x : new Float64Array(n);
  const y = fits ? reuse.y : new Float64Array(n);
  const d = fits ? reuse.d : new Float64Array(n);
  const t = fits ? reuse.t : new Float64Array(n);
  const w = fits ? reuse.w : new Float64Array(n);
  const line = fits ? reuse.line : new Int32Array(n);
  const lineStart = fits ? reuse.lineStart : new Int32Array(n);
  const idx = sortByYX(holes, order);
  let lineNo = -1;
  let start = 0;
  for (let k = 0; k < n; k++) {
    const h = holes[idx[k]];
    x[k] = h.x;
    y[k] = h.y;
    d[k] = h.d;
    t[k] = h.t ?? thickness;
    w[k] = h.d * t[k];
    if (k === 0 || h.y - y[k - 1] > yTolerance) {
      lineNo++;
      start = k;
    }
    line[k] = lineNo;
    lineStart[k] = start;
  }
  return { n, order, x, y, d, t, w, line, lineStart, lineCount: lineNo + 1 };
}

/**
 * Hole indices ordered by (y, x, index), written into `out`. Insertion sort for small
 * patterns (the common case, and allocation-free), the built-in sort beyond 32 holes.
 */
function sortByYX(holes: readonly StripHole[], out: Int32Array): Int32Array {
  const n = holes.length;
  if (n > 32) {
    const idx = Array.from({ length: n }, (_, i) => i).sort((a, b) => holes[a].y - holes[b].y || holes[a].x - holes[b].x || a - b);
    for (let i = 0; i < n; i++) out[i] = idx[i];
    return out;
  }
  for (let i = 0; i < n; i++) {
    let k = i;
    while (k > 0 && holeBefore(holes, i, out[k - 1])) {
      out[k] = out[k - 1];
      k--;
    }
    out[k] = i;
  }
  return out;
}

/** True when hole a comes before hole b in (y, x, index) order. */
function holeBefore(holes: readonly StripHole[], a: number, b: number): boolean {
  const ha = holes[a];
  const hb = holes[b];
  return ha.y < hb.y || (ha.y === hb.y && (ha.x < hb.x || (ha.x === hb.x && a < b)));
}
