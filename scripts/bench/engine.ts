/**
 * Net-area solver speed: chains solved per second by the longest-path DP and by brute
 * force at 6, 10, 14 and 20 holes, their ratio, twelve-hole throughput, and one 1,000-hole
 * pattern. Run: node --import tsx scripts/bench/engine.ts
 */
import { minNetArea, solveNetArea } from '../../shared/engine/net-area/index.ts';
import type { StripHole } from '../../shared/engine/net-area/types.ts';
import { bruteForceNetArea } from '../../tests/support/brute-force-net-area.ts';

// Deterministic pseudo-random patterns (mulberry32) so runs are comparable.
function rng(seed: number) {
  return () => {
    seed |= 0;
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function pattern(n: number, rand: () => number): StripHole[] {
  const lines = Math.max(2, Math.ceil(n / 3));
  return Array.from({ length: n }, () => ({ x: Math.floor(rand() * 12) * 35, y: 30 + Math.floor(rand() * lines) * 60, d: 22 }));
}

function rate(fn: () => void, minMs: number, maxIter = Infinity): { perSec: number; iters: number; ms: number } {
  const t0 = performance.now();
  let iters = 0;
  while (iters < maxIter && performance.now() - t0 < minMs) {
    fn();
    iters++;
  }
  const ms = performance.now() - t0;
  return { perSec: (iters / ms) * 1000, iters, ms };
}

const fmt = (v: number) => (v >= 100 ? Math.round(v).toLocaleString('en') : v.toPrecision(3));
const rand = rng(42);
// Warm the JIT so the first row is not penalised.
const warm = Array.from({ length: 64 }, () => pattern(10, rand));
rate(() => minNetArea(10000, 10, warm[Math.floor(Math.random() * 64)], 0.5), 300);
console.log('Patterns solved per second (each pattern = one minimum over all chains).');
console.log('holes | DP patterns/s | brute force patterns/s | ratio');
for (const n of [6, 10, 14, 20]) {
  const pats = Array.from({ length: 64 }, () => pattern(n, rand));
  let k = 0;
  const dp = rate(() => minNetArea(10000, 10, pats[k++ & 63], 0.5), 500);
  k = 0;
  // Brute force is O(2ⁿ·n): cap its time budget; at 20 holes a handful of patterns is all it manages.
  const bf = rate(() => bruteForceNetArea(pats[k++ & 63], 10, 0.5), n >= 20 ? 8000 : 1500, n >= 20 ? 3 : Infinity);
  console.log(`${String(n).padStart(5)} | ${fmt(dp.perSec).padStart(13)} | ${fmt(bf.perSec).padStart(22)} | ${fmt(dp.perSec / bf.perSec)}${n >= 20 ? `  (brute force: ${bf.iters} patterns in ${Math.round(bf.ms)} ms)` : ''}`);
}

const twelve = Array.from({ length: 1024 }, () => pattern(12, rand));
let j = 0;
const r12 = rate(() => minNetArea(10000, 10, twelve[j++ & 1023], 0.5), 2000);
console.log(`\n12-hole patterns per second (one core, min net area): ${fmt(r12.perSec)}  (target ≥ 100,000)`);
j = 0;
const r12full = rate(() => solveNetArea({ grossArea: 10000, thickness: 10, holes: twelve[j++ & 1023], alternatives: 5 }), 1000);
console.log(`12-hole patterns per second with the governing chain and 5 runner-up chains: ${fmt(r12full.perSec)}`);

const big = Array.from({ length: 1000 }, () => ({ x: Math.floor(rand() * 400) * 35, y: 20 + rand() * 8000, d: 22 }));
minNetArea(1e6, 10, big); // warm-up
const times: number[] = [];
for (let i = 0; i < 5; i++) {
  const t0 = performance.now();
  minNetArea(1e6, 10, big);
  times.push(performance.now() - t0);
}
const t0 = performance.now();
solveNetArea({ grossArea: 1e6, thickness: 10, holes: big, alternatives: 5 });
const full = performance.now() - t0;
console.log(`1,000-hole pattern: ${Math.min(...times).toFixed(1)} ms best of 5 (min net area; target < 50 ms), ${full.toFixed(1)} ms with chain reporting and 5 runner-ups`);
