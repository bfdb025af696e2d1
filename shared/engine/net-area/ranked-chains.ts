import type { PreparedStrip } from './prepare.ts';
import type { BestChain } from './longest-path.ts';

interface RankLists {
  vals: Float64Array;
  pNode: Int32Array;
  pRank: Int32Array;
}

/**
 * Puts a partial chain worth `v` into the sorted list of k at `base` that holds `c` entries;
 * returns the new count. A plain function (not a closure per node): it runs for every pair.
 */
function insertRanked({ vals, pNode, pRank }: RankLists, base: number, k: number, c: number, v: number, node: number, rank: number): number {
  if (c === k && v <= vals[base + k - 1]) return c;
  let at = c < k ? c : k - 1;
  while (at > 0 && vals[base + at - 1] < v) {
    vals[base + at] = vals[base + at - 1];
    pNode[base + at] = pNode[base + at - 1];
    pRank[base + at] = pRank[base + at - 1];
    at--;
  }
  vals[base + at] = v;
  pNode[base + at] = node;
  pRank[base + at] = rank;
  return c < k ? c + 1 : c;
}

/**
 * The k best distinct chains, for display next to the governing one.
 *
 * Same DAG as longestChain, but every node keeps its k best partial chains
 * instead of one (k-best longest path). Partial chains ending at a node differ in
 * their predecessor or in the predecessor's rank, so all kept chains are distinct.
 * O(n²·k) time, O(n·k) memory; still no enumeration.
 * @param k how many chains to return (≥ 1)
 * @returns chains best first, deductions in mm², positions sorted by y.
 */
export function rankedChains(p: PreparedStrip, k: number): BestChain[] {
  const { n, x, y, t, w, lineStart } = p;
  const vals = new Float64Array(n * k);
  const pNode = new Int32Array(n * k);
  const pRank = new Int32Array(n * k);
  const count = new Int32Array(n);
  const lists: RankLists = { vals, pNode, pRank };
  for (let j = 0; j < n; j++) {
    const base = j * k;
    let c = insertRanked(lists, base, k, 0, w[j], -1, -1);
    for (let i = 0; i < lineStart[j]; i++) {
      const s = x[j] - x[i];
      const ti = t[i] < t[j] ? t[i] : t[j];
      const credit = (s * s * ti) / (4 * (y[j] - y[i]));
      for (let r = 0; r < count[i]; r++) {
        const v = vals[i * k + r] - credit + w[j];
        if (c === k && v <= vals[base + k - 1]) break; // lists are sorted: the rest are worse
        c = insertRanked(lists, base, k, c, v, i, r);
      }
    }
    count[j] = c;
  }
  const all: Array<[number, number, number]> = [];
  for (let j = 0; j < n; j++) for (let r = 0; r < count[j]; r++) all.push([vals[j * k + r], j, r]);
  all.sort((a, b) => b[0] - a[0]);
  return all.slice(0, k).map(([v, j, r]) => {
    const positions: number[] = [];
    let node = j;
    let rank = r;
    while (node >= 0) {
      positions.push(node);
      const at = node * k + rank;
      node = pNode[at];
      rank = pRank[at];
    }
    positions.reverse();
    return { deduction: v, positions };
  });
}
