import type { PreparedStrip } from './prepare.ts';
import type { BestChain } from './longest-path.ts';

/**
 * Largest deduction of a section perpendicular to the member axis (the
 * "non-staggered" deduction of EN 1993-1-1 6.2.2.2(3) and AS 4100 9.1.10.2, from memory
 * for the AS wording). A cut at position X meets hole k when |X − x_k| < d_k/2; every
 * hole it meets is deducted in full (d·t), which is the conservative reading of
 * "the sum of hole areas in any cross-section". Holes sharing a gauge line count once
 * per cut (the larger), since overlapping holes on one line are one opening.
 *
 * Chains with s = 0 already cover holes at exactly the same x; this pass adds the case
 * of holes that overlap in projection with 0 < |Δx| < d (design-rules §9.3 item 2).
 * The best cut lies just past some hole's upstream edge, so trying every hole's
 * edge is exact: O(n²) time.
 * @returns deduction in mm² and the holes cut (sorted positions, increasing y).
 */
export function bestStraightSection(p: PreparedStrip, lineBest = new Float64Array(p.lineCount), lineStamp = new Int32Array(p.lineCount), lineAt = new Int32Array(p.lineCount)): BestChain {
  const { n, x, d, w, line } = p;
  let top = 0;
  let topX = 0;
  lineStamp.fill(-1, 0, p.lineCount);
  for (let i = 0; i < n; i++) {
    const cut = x[i] - d[i] / 2;
    let sum = 0;
    for (let j = 0; j < n; j++) {
      // Open interval (x − d/2, x + d/2) contains cut + ε.
      if (x[j] - d[j] / 2 <= cut && x[j] + d[j] / 2 > cut) {
        const l = line[j];
        // lineStamp marks which cut lineBest[l] belongs to, so nothing is cleared per cut.
        const prev = lineStamp[l] === i ? lineBest[l] : 0;
        if (w[j] > prev) {
          sum += w[j] - prev;
          lineBest[l] = w[j];
          lineStamp[l] = i;
        }
      }
    }
    if (sum > top) {
      top = sum;
      topX = cut;
    }
  }
  if (top === 0) return { deduction: 0, positions: [] };
  // Recover the holes of the best cut (largest hole per gauge line).
  lineAt.fill(-1, 0, p.lineCount);
  for (let j = 0; j < n; j++) {
    if (x[j] - d[j] / 2 <= topX && x[j] + d[j] / 2 > topX) {
      const l = line[j];
      if (lineAt[l] < 0 || w[j] > w[lineAt[l]]) lineAt[l] = j;
    }
  }
  const positions: number[] = [];
  for (let l = 0; l < p.lineCount; l++) if (lineAt[l] >= 0) positions.push(lineAt[l]);
  return { deduction: top, positions };
}
