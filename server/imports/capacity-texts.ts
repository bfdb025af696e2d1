import { withoutForce, type CheckResult } from '@shared/engine';

/** A capacity result's text for the store, under its number within the import. */
export interface StorableCapacity {
  key: number;
  bodyJson: string;
}

/**
 * Numbers the capacity results of one import, each once. A stored result is its capacity
 * (the result without the member's force, withoutForce) and the member's design force; the
 * reader applies the force again with the engine's withForce. Members checked from one
 * capacity (CapacityChecks: withForce spreads it, so modes, trace and assumptions are the very
 * same objects) share its number, and its text is written once per import instead of 4–5 KB
 * per member. A result met without such a twin gets a number of its own.
 */
export class CapacityTexts {
  private readonly byModes = new WeakMap<object, { source: CheckResult; key: number }>();
  private next = 0;

  /** The number of `result`'s capacity; the first time, its text is pushed onto `fresh`. */
  keyOf(result: CheckResult, fresh: StorableCapacity[]): number {
    const known = this.byModes.get(result.modes);
    if (known && sameCapacity(known.source, result)) return known.key;
    const key = this.next++;
    fresh.push({ key, bodyJson: JSON.stringify(withoutForce(result)) });
    if (!known) this.byModes.set(result.modes, { source: result, key });
    return key;
  }
}

/** Everything a force does not touch is the very same value or object, and the warnings match but for the force's. */
function sameCapacity(a: CheckResult, b: CheckResult): boolean {
  return a.standard === b.standard && Object.is(a.designCapacity, b.designCapacity) && a.governing === b.governing && a.modes === b.modes
    && a.trace === b.trace && a.assumptions === b.assumptions && Object.is(a.grossArea, b.grossArea) && Object.is(a.netArea, b.netArea) && a.net === b.net
    // The warnings are most often the same list (a tensile force adds none); only else are they compared without the force's.
    && (a.warnings === b.warnings || sameWarnings(withoutForce(a).warnings, withoutForce(b).warnings))
    && Object.keys(a).length === Object.keys(b).length;
}

function sameWarnings(a: string[], b: string[]): boolean {
  return a.length === b.length && a.every((w, i) => w === b[i]);
}
