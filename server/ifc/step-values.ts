/**
 * Unwrapping web-ifc's line objects. Values come back as plain numbers, `{value}` objects,
 * `{_representationValue}` number objects, enum objects `{type:3, value}` or handles `{type:5, value}`.
 */

export function num(x: unknown): number | undefined {
  if (x == null) return undefined;
  if (typeof x === 'number') return Number.isFinite(x) ? x : undefined;
  if (typeof x === 'object') {
    const o = x as Record<string, unknown>;
    if (typeof o._representationValue === 'number') return o._representationValue;
    if ('value' in o) return num(o.value);
  }
  if (typeof x === 'string' && x.trim() !== '') {
    const n = Number(x);
    return Number.isFinite(n) ? n : undefined;
  }
  return undefined;
}

export function str(x: unknown): string | null {
  if (x == null) return null;
  if (typeof x === 'string') return x;
  if (typeof x === 'number' || typeof x === 'boolean') return String(x);
  if (typeof x === 'object' && 'value' in (x as object)) return str((x as { value: unknown }).value);
  return null;
}

/** Express id of a handle, or undefined. */
export function ref(x: unknown): number | undefined {
  if (x && typeof x === 'object' && (x as { type?: number }).type === 5) {
    const v = (x as { value?: unknown }).value;
    return typeof v === 'number' ? v : undefined;
  }
  if (x && typeof x === 'object' && typeof (x as { expressID?: unknown }).expressID === 'number') {
    return (x as { expressID: number }).expressID;
  }
  return undefined;
}

export function refs(x: unknown): number[] {
  if (!Array.isArray(x)) {
    const r = ref(x);
    return r === undefined ? [] : [r];
  }
  const out: number[] = [];
  for (const item of x) {
    const r = ref(item);
    if (r !== undefined) out.push(r);
  }
  return out;
}

export function enumValue(x: unknown): string | null {
  const s = str(x);
  return s ? s.replace(/^\./, '').replace(/\.$/, '').toUpperCase() : null;
}

export function numList(x: unknown): number[] {
  if (!Array.isArray(x)) return [];
  return x.map((v) => num(v) ?? 0);
}
