import type { Chain, ChainTerm, NetAreaInput, NetAreaResult, StripHole } from './types.ts';
import { DEFAULT_Y_TOLERANCE, prepareStrip, type PreparedStrip } from './prepare.ts';
import { longestChain, type BestChain } from './longest-path.ts';
import { bestStraightSection } from './straight-sections.ts';
import { rankedChains } from './ranked-chains.ts';

/**
 * Net area with staggered holes: minimum over every zig-zag chain (Cochrane's
 * s²/4g rule, AISC 360-16 B4.3b, EN 1993-1-1 6.2.2.2(4), AS 4100 9.1.10.3 — the AS
 * clause from memory) and every perpendicular section, in area terms so each hole
 * can carry its own thickness.
 *   An = Ag − max(0, max_chain Σ d·t − Σ s²·t/(4g), max_section Σ d·t)
 * Units mm / mm². Holes on different `part`s (branches of an I or tee) are solved
 * separately and their deductions summed.
 */
export function solveNetArea(input: NetAreaInput): NetAreaResult {
  const yTol = input.yTolerance ?? DEFAULT_Y_TOLERANCE;
  const k = input.alternatives ?? 5;
  const warnings: string[] = [];
  const parts = new Map<number, number[]>();
  input.holes.forEach((h, i) => {
    const key = h.part ?? 0;
    if (!parts.has(key)) parts.set(key, []);
    parts.get(key)!.push(i);
  });
  const perPart = [...parts.values()].map((ids) => solvePart(ids.map((i) => input.holes[i]), ids, input.thickness, yTol, k, warnings));
  const deduction = perPart.reduce((a, r) => a + r.best.deduction, 0);
  const netArea = input.grossArea - deduction;
  const governing = perPart.length === 0 ? null : mergeChains(perPart.map((r) => r.best), input.grossArea);
  const alternatives: Chain[] = [];
  for (let pi = 0; pi < perPart.length; pi++) {
    for (const alt of perPart[pi].alternatives) {
      alternatives.push(mergeChains(perPart.map((r, j) => (j === pi ? alt : r.best)), input.grossArea));
    }
  }
  alternatives.sort((a, b) => b.deduction - a.deduction);
  if (governing?.terms.some((term) => term.kind === 'stagger' && term.t < Math.max(tOf(input, term.from), tOf(input, term.to)))) {
    warnings.push('A gauge space in the governing chain crosses a thickness change; its s²/4g credit uses the smaller thickness (conservative convention, not code text).');
  }
  return { grossArea: input.grossArea, netArea, deduction, governing, alternatives: alternatives.slice(0, k), warnings };
}

function tOf(input: NetAreaInput, i: number): number {
  return input.holes[i].t ?? input.thickness;
}

interface PartResult {
  best: Chain;
  alternatives: Chain[];
}

function solvePart(holes: StripHole[], ids: number[], thickness: number, yTol: number, k: number, warnings: string[]): PartResult {
  const p = prepareStrip(holes, thickness, yTol);
  noteDuplicates(p, ids, warnings);
  const chain = longestChain(p);
  const straight = bestStraightSection(p);
  const straightWins = straight.deduction > chain.deduction + 1e-9;
  if (straightWins) {
    warnings.push('A perpendicular section through holes that overlap in projection (|Δx| < d) governs; every hole it cuts is deducted in full.');
  }
  const best = straightWins ? toChain(p, ids, straight, 'straight-section', 0) : toChain(p, ids, chain, 'zig-zag', 0);
  const alternatives: Chain[] = [];
  if (k > 0) {
    const seen = new Set([key(best)]);
    const candidates = rankedChains(p, k + 1).map((c) => toChain(p, ids, c, 'zig-zag', 0));
    if (!straightWins && straight.deduction > 0) candidates.push(toChain(p, ids, straight, 'straight-section', 0));
    candidates.sort((a, b) => b.deduction - a.deduction);
    for (const c of candidates) {
      if (seen.has(key(c))) continue;
      seen.add(key(c));
      alternatives.push(c);
    }
  }
  return { best, alternatives: alternatives.slice(0, k) };
}

function key(c: Chain): string {
  return `${c.kind}:${c.holes.join(',')}`;
}

function noteDuplicates(p: PreparedStrip, ids: number[], warnings: string[]): void {
  for (let k = 1; k < p.n; k++) {
    for (let j = p.lineStart[k]; j < k; j++) {
      if (Math.abs(p.x[k] - p.x[j]) < Math.max(p.d[k], p.d[j])) {
        warnings.push(`Holes ${ids[p.order[j]]} and ${ids[p.order[k]]} overlap on one gauge line; a section counts only one of them (check for a hole modelled twice).`);
        return;
      }
    }
  }
}

/** Turn a solver chain (sorted positions) into a display chain with terms (mm, mm²). */
function toChain(p: PreparedStrip, ids: number[], c: BestChain, kind: Chain['kind'], grossArea: number): Chain {
  const terms: ChainTerm[] = [];
  let deduction = 0;
  c.positions.forEach((pos, m) => {
    const hole = ids[p.order[pos]];
    terms.push({ kind: 'hole', hole, d: p.d[pos], t: p.t[pos], area: p.w[pos] });
    deduction += p.w[pos];
    if (m > 0 && kind === 'zig-zag') {
      const prev = c.positions[m - 1];
      const s = Math.abs(p.x[pos] - p.x[prev]);
      const g = p.y[pos] - p.y[prev];
      const t = Math.min(p.t[pos], p.t[prev]);
      const area = (s * s * t) / (4 * g);
      terms.push({ kind: 'stagger', from: ids[p.order[prev]], to: hole, s, g, t, area });
      deduction -= area;
    }
  });
  return { holes: c.positions.map((pos) => ids[p.order[pos]]), kind, deduction, netArea: grossArea - deduction, terms };
}

function mergeChains(chains: Chain[], grossArea: number): Chain {
  if (chains.length === 1) return { ...chains[0], netArea: grossArea - chains[0].deduction };
  const deduction = chains.reduce((a, c) => a + c.deduction, 0);
  return {
    holes: chains.flatMap((c) => c.holes),
    kind: chains.every((c) => c.kind === 'straight-section') ? 'straight-section' : 'zig-zag',
    deduction,
    netArea: grossArea - deduction,
    terms: chains.flatMap((c) => c.terms),
  };
}

/**
 * Fast path: minimum net area only (mm²), for a single unbranched strip.
 * Same rule as solveNetArea without chain reporting; used by the benchmark.
 */
export function minNetArea(grossArea: number, thickness: number, holes: readonly StripHole[], yTolerance = DEFAULT_Y_TOLERANCE): number {
  if (holes.length > scratchSize) grow(holes.length);
  const p = prepareStrip(holes, thickness, yTolerance, scratch);
  const a = longestChain(p, scratchA, scratchI).deduction;
  const b = bestStraightSection(p, scratchB, scratchJ, scratchK).deduction;
  return grossArea - (a > b ? a : b);
}

// Reused buffers for the fast path: the engine is single-threaded per module instance and
// minNetArea does not re-enter, so sharing them is safe and saves ~a dozen allocations a call.
let scratchSize = 0;
let scratch: PreparedStrip;
let scratchA: Float64Array<ArrayBuffer>;
let scratchB: Float64Array<ArrayBuffer>;
let scratchI: Int32Array<ArrayBuffer>;
let scratchJ: Int32Array<ArrayBuffer>;
let scratchK: Int32Array<ArrayBuffer>;
function grow(n: number): void {
  scratchSize = Math.max(n, 2 * scratchSize, 16);
  const m = scratchSize;
  scratch = { n: 0, order: new Int32Array(m), x: new Float64Array(m), y: new Float64Array(m), d: new Float64Array(m), t: new Float64Array(m), w: new Float64Array(m), line: new Int32Array(m), lineStart: new Int32Array(m), lineCount: 0 };
  scratchA = new Float64Array(m);
  scratchB = new Float64Array(m);
  scratchI = new Int32Array(m);
  scratchJ = new Int32Array(m);
  scratchK = new Int32Array(m);
}
grow(16);

/**
 * Deduction of one hand-picked chain (mm²): Σ d·t − Σ s²·t/(4g) over consecutive
 * holes, thickness of a gauge space = the smaller t. `chain` lists input indices in
 * order of increasing y; throws if two consecutive holes are not in increasing y.
 */
export function chainDeduction(holes: readonly StripHole[], thickness: number, chain: readonly number[]): number {
  let sum = 0;
  chain.forEach((i, m) => {
    const h = holes[i];
    const t = h.t ?? thickness;
    sum += h.d * t;
    if (m > 0) {
      const prev = holes[chain[m - 1]];
      const g = h.y - prev.y;
      if (!(g > 0)) throw new RangeError(`chain[${m}]: hole ${i} is not beyond hole ${chain[m - 1]} in y`);
      const s = h.x - prev.x;
      sum -= (s * s * Math.min(t, prev.t ?? thickness)) / (4 * g);
    }
  });
  return sum;
}
