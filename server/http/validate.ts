import type { z } from 'zod';
import { errors } from './errors';

/** Parses a request part with a zod schema; failures become one 400 with per-field messages. */
export function parseBody<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> {
  const result = schema.safeParse(value ?? {});
  if (result.success) return result.data;
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.join('.') || '_';
    fields[key] ??= issue.message;
  }
  const summary = Object.entries(fields).map(([k, m]) => (k === '_' ? m : `${k}: ${m}`)).join('; ');
  throw errors.validation(summary || 'The request is not valid.', fields);
}

/** Route ids are positive integers; anything else is simply "not found". */
export function parseId(raw: unknown, what: string): number {
  const n = typeof raw === 'string' && /^\d{1,10}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isSafeInteger(n) || n <= 0) throw errors.notFound(what);
  return n;
}
