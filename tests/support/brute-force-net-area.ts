/**
 * Reference net-area solver by exhaustive enumeration, for tests and the benchmark
 * only (the engine never enumerates). Deliberately written independently of
 * shared/engine/net-area: every subset of holes is tried as a zig-zag chain (in
 * increasing y, consecutive holes on different gauge lines) and as a perpendicular
 * section (holes overlapping in projection, one per gauge line). O(2ⁿ·n).
 * Units mm / mm².
 */
export interface BruteHole {
  x: number;
  y: number;
  d: number;
  t?: number;
}

export interface BruteResult {
  /** Largest deduction, mm² (0 with no holes). */
  deduction: number;
  /** Input indices of the best subset, increasing y. */
  holes: number[];
  kind: 'zig-zag' | 'straight-section' | 'none';
  /** Subsets examined. */
  subsets: number;
}

/** Gauge line of each input hole: sort by y, new line where the gap exceeds tol. */
export function bruteGaugeLines(holes: readonly BruteHole[], tol: number): number[] {
  const sorted = holes.map((h, i) => ({ y: h.y, i })).sort((a, b) => a.y - b.y);
  const lines = new Array<number>(holes.length);
  let line = 0;
  sorted.forEach((h, k) => {
    if (k > 0 && h.y - sorted[k - 1].y > tol) line++;
    lines[h.i] = line;
  });
  return lines;
}

export function bruteForceNetArea(holes: readonly BruteHole[], thickness: number, yTolerance = 0.5): BruteResult {
  const n = holes.length;
  if (n > 24) throw new RangeError('brute force is limited to 24 holes');
  const lines = bruteGaugeLines(holes, yTolerance);
  const ord = holes.map((_, i) => i).sort((a, b) => holes[a].y - holes[b].y || holes[a].x - holes[b].x);
  const th = (i: number) => holes[i].t ?? thickness;
  let best: BruteResult = { deduction: 0, holes: [], kind: 'none', subsets: 0 };
  const total = 2 ** n;
  for (let mask = 1; mask < total; mask++) {
    const members: number[] = [];
    for (let k = 0; k < n; k++) if (mask & (1 << k)) members.push(ord[k]);
    // Zig-zag chain through all members in y order.
    let ok = true;
    let sum = 0;
    for (let m = 0; m < members.length && ok; m++) {
      const h = holes[members[m]];
      sum += h.d * th(members[m]);
      if (m > 0) {
        const p = holes[members[m - 1]];
        if (lines[members[m]] === lines[members[m - 1]]) ok = false;
        else sum -= ((h.x - p.x) ** 2 * Math.min(th(members[m]), th(members[m - 1]))) / (4 * (h.y - p.y));
      }
    }
    if (ok && sum > best.deduction) best = { deduction: sum, holes: members, kind: 'zig-zag', subsets: 0 };
    // Perpendicular section through all members.
    const used = new Set(members.map((i) => lines[i]));
    if (used.size === members.length) {
      const lo = Math.max(...members.map((i) => holes[i].x - holes[i].d / 2));
      const hi = Math.min(...members.map((i) => holes[i].x + holes[i].d / 2));
      if (lo < hi) {
        const area = members.reduce((a, i) => a + holes[i].d * th(i), 0);
        if (area > best.deduction + 1e-9) best = { deduction: area, holes: members, kind: 'straight-section', subsets: 0 };
      }
    }
  }
  return { ...best, subsets: total - 1 };
}
