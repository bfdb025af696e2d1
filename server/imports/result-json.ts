import type { CheckResult } from '@shared/engine';

/** The order JSON.stringify writes a CheckResult in (the engine's `finish`, kept by withForce). */
const RESULT_KEYS = ['standard', 'designCapacity', 'utilisation', 'governing', 'modes', 'trace', 'assumptions', 'warnings', 'grossArea', 'netArea', 'net'];

interface Pieces {
  source: CheckResult;
  head: string;
  middle: string;
  tail: string;
}

/** Texts of results met before, by their modes list (shared by every result made from one capacity result). */
const known = new WeakMap<object, Pieces>();

/**
 * JSON.stringify(result), byte for byte. Results that share their capacities with an earlier
 * one (CapacityChecks: the same objects, only utilisation and warnings differ) reuse the text of
 * everything else: the trace and assumptions are most of a result's 4–5 KB, and writing them
 * again for every member was a fifth of an import's check.
 */
export function resultJson(result: CheckResult): string {
  const pieces = known.get(result.modes);
  if (!pieces || !sameCapacity(pieces.source, result) || !isPlainResult(result)) {
    if (!pieces && isPlainResult(result)) known.set(result.modes, piecesOf(result));
    return JSON.stringify(result);
  }
  return `${pieces.head},"utilisation":${JSON.stringify(result.utilisation)},${pieces.middle},"warnings":${JSON.stringify(result.warnings)},${pieces.tail}`;
}

function piecesOf(r: CheckResult): Pieces {
  return {
    source: r,
    head: JSON.stringify({ standard: r.standard, designCapacity: r.designCapacity }).slice(0, -1),
    middle: JSON.stringify({ governing: r.governing, modes: r.modes, trace: r.trace, assumptions: r.assumptions }).slice(1, -1),
    tail: JSON.stringify({ grossArea: r.grossArea, netArea: r.netArea, net: r.net }).slice(1),
  };
}

/** Everything but utilisation and warnings is the very same value or object. */
function sameCapacity(a: CheckResult, b: CheckResult): boolean {
  return a.standard === b.standard && Object.is(a.designCapacity, b.designCapacity) && a.governing === b.governing && a.modes === b.modes
    && a.trace === b.trace && a.assumptions === b.assumptions && Object.is(a.grossArea, b.grossArea) && Object.is(a.netArea, b.netArea) && a.net === b.net;
}

/** Exactly the engine's keys in its order, with a utilisation and warnings JSON can write. */
function isPlainResult(r: CheckResult): boolean {
  const keys = Object.keys(r);
  return keys.length === RESULT_KEYS.length && keys.every((k, i) => k === RESULT_KEYS[i]) && Array.isArray(r.warnings)
    && (r.utilisation === null || typeof r.utilisation === 'number') && typeof r.designCapacity === 'number';
}
