import { checkMemberRaw, withForce, type CheckResult, type MemberCheckInputRaw } from '@shared/engine';

/** What checking a member end takes: CapacityChecks, or the engine itself (`{ check: checkMemberRaw }`). */
export interface EndChecks {
  check(input: MemberCheckInputRaw): CheckResult;
}

/** Distinct inputs kept at most (a few KB each); beyond it the cache starts again. */
const MAX_KEPT = 4096;

/**
 * Member-end checks of one import, each distinct input checked once. A model repeats its
 * connections (braces of one size with one bolt pattern, both ends of most members alike) and
 * the engine is pure: everything in a result but the utilisation and the warning for a force
 * that is not tensile follows from the input without the force, and `withForce` adds those.
 * Results equal checkMemberRaw's for the same input, errors included (a test holds them
 * equal on every corpus file and sample).
 */
export class CapacityChecks implements EndChecks {
  private readonly byInput = new Map<string, CheckResult | Error>();
  /** Ends checked by the engine / answered from an earlier end with the same input. */
  readonly counts = { checked: 0, reused: 0 };

  check(input: MemberCheckInputRaw): CheckResult {
    const { force, ...rest } = input;
    // A force the schema would refuse must fail as it does without the cache.
    if (force !== null && force !== undefined && !Number.isFinite(force)) return checkMemberRaw(input);
    // JSON writes NaN and ±Infinity as null: only a key with a null in it needs telling them apart
    // (a replacer makes every stringify several times slower).
    const plain = JSON.stringify(rest);
    const key = plain.includes('null') ? JSON.stringify(rest, keepNonFinite) : plain;
    let capacity = this.byInput.get(key);
    if (capacity === undefined) {
      this.counts.checked++;
      try {
        capacity = checkMemberRaw({ ...rest, force: null });
      } catch (err) {
        capacity = err instanceof Error ? err : new Error(String(err));
      }
      if (this.byInput.size >= MAX_KEPT) this.byInput.clear();
      this.byInput.set(key, capacity);
    } else {
      this.counts.reused++;
    }
    if (capacity instanceof Error) throw capacity;
    return withForce(capacity, force);
  }
}

/** JSON writes NaN and ±Infinity as null; keys must tell them apart from null and each other. */
function keepNonFinite(_key: string, value: unknown): unknown {
  return typeof value === 'number' && !Number.isFinite(value) ? { '\u0000': String(value) } : value;
}
