/**
 * Hole sizes by standard. All diameters in mm.
 *  - AS 4100-1998 Cl. 14.3.5.2 (amended 2012; from memory): standard hole df + 2 mm up to
 *    M24, df + 3 mm above. This is also common practice in Australia.
 *  - AISC 360-16 Table J3.3M (metric, from the 360-05 table reproduced in Brockenbrough &
 *    Merritt, Structural Steel Designer's Handbook, Table 5.11) and Table J3.3 (imperial, from memory).
 *  - EN 1090-2 Table 11 nominal clearances (reproduced in a fabricator's holing procedure).
 */
import { MM_PER_INCH } from '../units.ts';

export type HoleStandard = 'as4100' | 'aisc360' | 'en1993';
export type HoleType = 'standard' | 'oversize' | 'short-slot' | 'long-slot';

/** Hole size: width across the force (used for net area) and length along the slot (mm). */
export interface HoleSize {
  /** Diameter, or slot width (the short dimension), mm. */
  width: number;
  /** Slot length (long dimension), mm; equals width for round holes. */
  length: number;
  /** Where the size came from, for the assumptions list. */
  source: string;
}

const J33M: Record<number, [number, number, [number, number], [number, number]]> = {
  16: [18, 20, [18, 22], [18, 40]],
  20: [22, 24, [22, 26], [22, 50]],
  22: [24, 28, [24, 30], [24, 55]],
  24: [27, 30, [27, 32], [27, 60]],
  27: [30, 35, [30, 37], [30, 67]],
  30: [33, 38, [33, 40], [33, 75]],
};

// Imperial Table J3.3 (360-16), inches: bolt → [standard, oversize, short slot w×l, long slot w×l]. From memory.
const J33: Record<string, [number, number, [number, number], [number, number]]> = {
  '0.5': [9 / 16, 5 / 8, [9 / 16, 11 / 16], [9 / 16, 1.25]],
  '0.625': [11 / 16, 13 / 16, [11 / 16, 7 / 8], [11 / 16, 1 + 9 / 16]],
  '0.75': [13 / 16, 15 / 16, [13 / 16, 1], [13 / 16, 1 + 7 / 8]],
  '0.875': [15 / 16, 1 + 1 / 16, [15 / 16, 1 + 1 / 8], [15 / 16, 2 + 3 / 16]],
  '1': [1 + 1 / 8, 1.25, [1 + 1 / 8, 1 + 5 / 16], [1 + 1 / 8, 2.5]],
};

/**
 * Nominal hole size for a bolt of diameter `bolt` (mm) under a standard.
 * `imperial` selects AISC Table J3.3 (bolt diameter in mm converted from inches).
 */
export function holeSize(standard: HoleStandard, bolt: number, type: HoleType = 'standard', imperial = false): HoleSize {
  if (!(bolt > 0)) throw new RangeError(`bolt diameter must be > 0 mm, got ${bolt}`);
  if (standard === 'as4100') return asHole(bolt, type);
  if (standard === 'aisc360') return imperial ? aiscImperialHole(bolt, type) : aiscMetricHole(bolt, type);
  return enHole(bolt, type);
}

function round(d: number, l: number, source: string): HoleSize {
  return { width: d, length: l, source };
}

function asHole(df: number, type: HoleType): HoleSize {
  const std = df + (df <= 24 ? 2 : 3);
  const src = 'AS 4100 Cl. 14.3.5 (from memory)';
  if (type === 'standard') return round(std, std, `${src}: df + ${df <= 24 ? 2 : 3} mm (common practice)`);
  if (type === 'oversize') {
    const d = Math.max(1.25 * df, df + 8);
    return round(d, d, `${src}: oversize ≤ max(1.25·df, df + 8) (from memory, low confidence)`);
  }
  if (type === 'short-slot') return round(std, Math.max(1.33 * df, df + 10), `${src}: short slot length max(1.33·df, df + 10) (from memory, low confidence)`);
  return round(std, 2.5 * df, `${src}: long slot length 2.5·df (from memory, low confidence)`);
}

function aiscMetricHole(d: number, type: HoleType): HoleSize {
  const row = J33M[d];
  const src = 'AISC 360 Table J3.3M';
  if (row) {
    if (type === 'standard') return round(row[0], row[0], src);
    if (type === 'oversize') return round(row[1], row[1], src);
    const [w, l] = type === 'short-slot' ? row[2] : row[3];
    return round(w, l, src);
  }
  if (d < 36) throw new RangeError(`AISC Table J3.3M has no row for M${d}`);
  if (type === 'standard') return round(d + 3, d + 3, `${src} (≥ M36: d + 3)`);
  if (type === 'oversize') return round(d + 8, d + 8, `${src} (≥ M36: d + 8)`);
  return round(d + 3, type === 'short-slot' ? d + 10 : 2.5 * d, `${src} (≥ M36)`);
}

function aiscImperialHole(dmm: number, type: HoleType): HoleSize {
  const din = dmm / MM_PER_INCH;
  const key = Object.keys(J33).find((k) => Math.abs(Number(k) - din) < 1e-3);
  const src = 'AISC 360-16 Table J3.3 (from memory)';
  let w: number;
  let l: number;
  if (key) {
    const row = J33[key];
    if (type === 'standard' || type === 'oversize') w = l = type === 'standard' ? row[0] : row[1];
    else [w, l] = type === 'short-slot' ? row[2] : row[3];
  } else if (din >= 1.125 - 1e-3) {
    w = type === 'oversize' ? din + 5 / 16 : din + 1 / 8;
    l = type === 'short-slot' ? din + 3 / 8 : type === 'long-slot' ? 2.5 * din : w;
  } else {
    throw new RangeError(`AISC Table J3.3 has no row for a ${din.toFixed(3)} in bolt`);
  }
  return round(w * MM_PER_INCH, l * MM_PER_INCH, src);
}

/** EN 1090-2 Table 11 clearance for a bolt (mm): [normal, oversize, short slot, long slot factor]. */
function enClearance(d: number): [number, number, number] {
  if (d <= 12) return [1, 3, 4];
  if (d <= 14) return [1, 4, 4];
  if (d <= 22) return [2, 4, 6];
  if (d <= 24) return [2, 6, 8];
  return [3, 8, 10]; // M27–M36, and above M36 per the table's footnote
}

function enHole(d: number, type: HoleType): HoleSize {
  const [normal, over, shortSlot] = enClearance(d);
  const src = 'EN 1090-2 Table 11';
  if (type === 'standard') return round(d + normal, d + normal, `${src}: d + ${normal} mm`);
  if (type === 'oversize') return round(d + over, d + over, `${src}: oversize d + ${over} mm`);
  // Slot width = the normal clearance (from memory); length = d + the table's overall clearance.
  if (type === 'short-slot') return round(d + normal, d + shortSlot, `${src}: short slot (width from memory)`);
  return round(d + normal, d + 1.5 * d, `${src}: long slot, clearance 1.5·d (width from memory)`);
}

/**
 * Width deducted per hole for net area, mm (design-rules §3.4).
 * AISC 360-16 B4.3b adds 1/16 in (2 mm) to the nominal hole: pass `allowance`
 * (1.5875 mm for imperial work, 2 mm metric). AS 4100 and EN 1993 deduct the hole as made.
 */
export function deductedWidth(standard: HoleStandard, hole: number, allowance = 2): number {
  return standard === 'aisc360' ? hole + allowance : hole;
}
