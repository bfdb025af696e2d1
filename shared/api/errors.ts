/** Every API error body has this shape; `error` is a stable id clients and tests may rely on. */
export interface ApiErrorBody {
  error: string;
  message: string;
  /** Field-level problems from validation, keyed by dotted path. */
  fields?: Record<string, string>;
  /** Structured detail, e.g. the per-row report of a rejected forces file. */
  details?: unknown;
}

/** Stable error ids used across the API. */
export const ERROR_IDS = {
  validation: 'request.invalid',
  unauthenticated: 'auth.required',
  badCredentials: 'auth.bad-credentials',
  forbidden: 'auth.forbidden',
  csrf: 'auth.csrf',
  rateLimited: 'auth.rate-limited',
  inactive: 'auth.inactive',
  notFound: 'resource.not-found',
  conflict: 'resource.conflict',
  dbDown: 'service.db-down',
  internal: 'server.internal',
} as const;
