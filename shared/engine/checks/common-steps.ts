import type { CheckResult } from './types.ts';
import type { PreparedMember } from './prepare-member.ts';
import { fmt, type Recorder } from './trace.ts';

/**
 * Trace the gross and net areas (mm²) and return An, clamped to Ag for display
 * (design-rules §2.7: a chain credit never raises An above Ag).
 */
export function areaSteps(m: PreparedMember, rec: Recorder, clause: string): number {
  rec.step('Ag', 'gross area', 'Ag', fmt(m.Ag), m.Ag, 'mm²', 'section');
  const chain = m.net.governing;
  if (!chain) {
    rec.step('An', 'net area (no holes)', 'An = Ag', fmt(m.Ag), m.Ag, 'mm²', clause);
    return m.Ag;
  }
  const holes = chain.terms.filter((x) => x.kind === 'hole');
  const credits = chain.terms.filter((x) => x.kind === 'stagger' && x.area > 0);
  const sub = [fmt(m.Ag), ...holes.map((h) => `− ${fmt(h.d)}×${fmt(h.t)}`), ...credits.map((c) => (c.kind === 'stagger' ? `+ ${fmt(c.s)}²×${fmt(c.t)}/(4×${fmt(c.g)})` : ''))].join(' ');
  const what = chain.kind === 'straight-section' ? 'perpendicular section through overlapping holes' : `chain through holes ${chain.holes.join(', ')} (input order, increasing y)`;
  const An = Math.min(m.net.netArea, m.Ag);
  rec.step('An', `net area, governing ${what}`, 'An = Ag − Σ d·t + Σ s²·t/(4g)', sub, An, 'mm²', clause);
  return An;
}

/** Assemble the common result: capacity = smallest mode (N), utilisation = force / capacity. */
export function finish(standard: string, m: PreparedMember, rec: Recorder, An: number): CheckResult {
  const governing = rec.modes.reduce((a, b) => (b.capacity < a.capacity ? b : a));
  return withForce({
    standard,
    designCapacity: governing.capacity,
    utilisation: null,
    governing: governing.name,
    modes: rec.modes,
    trace: rec.trace,
    assumptions: rec.assumptions,
    warnings: rec.warnings,
    grossArea: m.Ag,
    netArea: An,
    net: m.net,
  }, m.input.force);
}

const NOT_TENSILE = 'Design force is not tensile (≤ 0): utilisation not computed; compression is outside this tool.';

/**
 * A result checked without a force, given one (N, tension positive): utilisation =
 * force / designCapacity for a positive force, null otherwise, with a warning for a force
 * ≤ 0. Nothing else in a check depends on the force, so a capacity result can serve every
 * member with the same input but its force. Returns a new object; `capacity` is not changed.
 */
export function withForce(capacity: CheckResult, force: number | null | undefined): CheckResult {
  const utilisation = force !== undefined && force !== null && force > 0 ? force / capacity.designCapacity : null;
  const warn = force !== undefined && force !== null && force <= 0 && !capacity.warnings.includes(NOT_TENSILE);
  return { ...capacity, utilisation, warnings: warn ? [...capacity.warnings, NOT_TENSILE] : capacity.warnings };
}

/**
 * The inverse of withForce: the result as it was checked without a force (utilisation null,
 * no warning about the force). A capacity result never carries that warning, so
 * withoutForce(withForce(c, f)) equals c for every force f. Returns a new object.
 */
export function withoutForce(result: CheckResult): CheckResult {
  const warnings = result.warnings.includes(NOT_TENSILE) ? result.warnings.filter((w) => w !== NOT_TENSILE) : result.warnings;
  return { ...result, utilisation: null, warnings };
}

/**
 * Per-bolt geometry along the force, mm: for every connected hole, the clear distance
 * towards the member end used for tear-out (end bolts: e1 − d/2; inner bolts: pitch − d).
 * Null entries where e1 is unknown.
 */
export function clearDistances(m: PreparedMember, e1: number | undefined, holeFor: (d: number, deducted: number) => number): Array<{ lc: number | null; end: boolean; d: number }> {
  const out: Array<{ lc: number | null; end: boolean; d: number }> = [];
  for (const g of m.lines) {
    g.holes.forEach((h, k) => {
      const dh = holeFor(h.d, h.deducted);
      if (k === 0) out.push({ lc: e1 === undefined ? null : e1 - dh / 2, end: true, d: h.d });
      else out.push({ lc: h.x - g.holes[k - 1].x - dh, end: false, d: h.d });
    });
  }
  return out;
}
