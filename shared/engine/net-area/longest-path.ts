import type { PreparedStrip } from './prepare.ts';

/** Best chain found by the longest-path pass: deduction in mm², holes as sorted positions. */
export interface BestChain {
  deduction: number;
  /** Sorted positions (see PreparedStrip.order) of the chain's holes, increasing y. */
  positions: number[];
}

/**
 * Largest chain deduction by longest path over the holes sorted by y (design-rules §9.2).
 *
 * Each hole is a node; an edge i → j exists for every pair on different gauge lines
 * (not only neighbouring lines, so chains may skip a line). Weights:
 *   best[j] = d_j·t_j + max(0, max_i (best[i] − s_ij²·t_ij / (4·g_ij)))
 * The max with 0 lets a chain start at any hole, so a poor link is never forced.
 * The graph is a DAG (y strictly increases along an edge), so this is exact:
 * O(n²) time, O(n) memory, no enumeration of chains.
 * t_ij is the smaller thickness of the two holes: the standards are silent on a
 * gauge space crossing a thickness change and the smaller t is conservative.
 * @returns deduction ≥ 0 in mm² (0 when there are no holes) and the chain.
 */
export function longestChain(p: PreparedStrip, best = new Float64Array(p.n), pred = new Int32Array(p.n)): BestChain {
  const { n, x, y, t, w, lineStart } = p;
  let top = 0;
  let topAt = -1;
  for (let j = 0; j < n; j++) {
    let link = 0;
    let from = -1;
    const xj = x[j];
    const yj = y[j];
    const tj = t[j];
    const end = lineStart[j];
    for (let i = 0; i < end; i++) {
      const s = xj - x[i];
      const ti = t[i] < tj ? t[i] : tj;
      const v = best[i] - (s * s * ti) / (4 * (yj - y[i]));
      if (v > link) {
        link = v;
        from = i;
      }
    }
    best[j] = w[j] + link;
    pred[j] = from;
    if (best[j] > top) {
      top = best[j];
      topAt = j;
    }
  }
  const positions: number[] = [];
  for (let k = topAt; k >= 0; k = pred[k]) positions.push(k);
  positions.reverse();
  return { deduction: top, positions };
}
