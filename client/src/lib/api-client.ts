import type { z } from 'zod';
import { ERROR_IDS, sessionResponseSchema, type ApiErrorBody } from '@shared/api';

/**
 * The one way the client talks to the server.
 *
 * - Same-origin cookies carry the session.
 * - Every state-changing request carries X-CSRF-Token. The token comes from the
 *   session endpoints (GET/POST/DELETE /api/session); their fetchers call
 *   rememberCsrfToken(). If the server rejects a token as stale (403 auth.csrf),
 *   we fetch a fresh one and retry that request once.
 * - Failures become ApiError, carrying the server's stable id, message and field messages.
 * - Successful bodies are checked against the zod schema the caller gives.
 */

export class ApiError extends Error {
  readonly status: number;
  /** Stable id from the server (see ERROR_IDS), or 'network' / 'response.invalid' for client-side failures. */
  readonly code: string;
  readonly fields: Record<string, string>;
  /** Structured detail the server sent with the refusal (e.g. a forces file's per-row report). */
  readonly details: unknown;

  constructor(status: number, body: ApiErrorBody) {
    super(body.message);
    this.name = 'ApiError';
    this.status = status;
    this.code = body.error;
    this.fields = body.fields ?? {};
    this.details = body.details;
  }

  is(code: string): boolean {
    return this.code === code;
  }
}

export const NETWORK_ERROR = 'network';
export const INVALID_RESPONSE = 'response.invalid';

/** Human text for any thrown value, for error states and notices. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong. Try again.';
}

export function isApiError(error: unknown, code?: string): error is ApiError {
  return error instanceof ApiError && (code === undefined || error.code === code);
}

let csrfToken: string | null = null;

export function rememberCsrfToken(token: string): void {
  csrfToken = token;
}

/** For tests and sign-out: forget the token so the next write fetches a new one. */
export function forgetCsrfToken(): void {
  csrfToken = null;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

interface RequestOptions {
  body?: unknown;
  signal?: AbortSignal;
}

const isWrite = (method: Method) => method !== 'GET';

async function refreshCsrfToken(signal?: AbortSignal): Promise<string> {
  const session = await send('GET', '/api/session', sessionResponseSchema, { signal }, false);
  rememberCsrfToken(session.csrfToken);
  return session.csrfToken;
}

async function readError(response: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await response.json();
  } catch {
    // not JSON: fall through to the generic message
  }
  if (body && typeof body === 'object' && typeof (body as ApiErrorBody).error === 'string') {
    const b = body as ApiErrorBody;
    return new ApiError(response.status, {
      error: b.error,
      message: typeof b.message === 'string' && b.message ? b.message : `The server answered ${response.status}.`,
      fields: b.fields && typeof b.fields === 'object' ? b.fields : undefined,
      details: b.details,
    });
  }
  const message =
    response.status >= 500
      ? 'The server had a problem. Try again in a moment.'
      : `The server answered ${response.status} ${response.statusText}.`.replace(/\s+\./, '.');
  return new ApiError(response.status, { error: response.status >= 500 ? ERROR_IDS.internal : 'http.' + response.status, message });
}

async function send<S extends z.ZodType>(
  method: Method,
  path: string,
  schema: S | null,
  options: RequestOptions,
  allowCsrfRetry: boolean,
): Promise<z.infer<S>> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  if (isWrite(method)) {
    headers['X-CSRF-Token'] = csrfToken ?? (await refreshCsrfToken(options.signal));
  }

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, { error: NETWORK_ERROR, message: 'Could not reach the server. Check your connection and try again.' });
  }

  if (!response.ok) {
    const error = await readError(response);
    if (allowCsrfRetry && isWrite(method) && error.is(ERROR_IDS.csrf)) {
      await refreshCsrfToken(options.signal);
      return send(method, path, schema, options, false);
    }
    throw error;
  }

  if (schema === null || response.status === 204) return undefined as z.infer<S>;

  let json: unknown;
  try {
    json = await response.json();
  } catch {
    throw new ApiError(response.status, { error: INVALID_RESPONSE, message: 'The server sent an answer Gaugeline could not read.' });
  }
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    console.error(`Unexpected response shape from ${method} ${path}`, parsed.error.issues);
    throw new ApiError(response.status, { error: INVALID_RESPONSE, message: 'The server sent an answer Gaugeline did not expect.' });
  }
  return parsed.data;
}

export interface UploadOptions {
  /** Called as the request body goes out: bytes sent and total bytes. */
  onProgress?: (sent: number, total: number) => void;
  signal?: AbortSignal;
}

/**
 * A multipart POST (file uploads). XMLHttpRequest rather than fetch, for upload
 * progress events. Same rules as every other write: X-CSRF-Token, one retry with a
 * fresh token on a stale-token refusal, ApiError with the server's message on failure.
 */
async function sendForm<S extends z.ZodType>(path: string, schema: S, form: FormData, options: UploadOptions, allowCsrfRetry: boolean): Promise<z.infer<S>> {
  const token = csrfToken ?? (await refreshCsrfToken(options.signal));
  const response = await new Promise<Response>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', path);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader('X-CSRF-Token', token);
    xhr.responseType = 'text';
    if (options.onProgress) {
      const report = options.onProgress;
      xhr.upload.addEventListener('progress', (event) => report(event.loaded, event.lengthComputable ? event.total : 0));
    }
    const abort = () => xhr.abort();
    options.signal?.addEventListener('abort', abort, { once: true });
    xhr.addEventListener('load', () => {
      options.signal?.removeEventListener('abort', abort);
      resolve(new Response(xhr.status === 204 ? null : xhr.responseText, { status: xhr.status, statusText: xhr.statusText }));
    });
    xhr.addEventListener('error', () => reject(new ApiError(0, { error: NETWORK_ERROR, message: 'Could not reach the server. Check your connection and try again.' })));
    xhr.addEventListener('abort', () => reject(new DOMException('The upload was stopped.', 'AbortError')));
    xhr.send(form);
  });

  if (!response.ok) {
    const error = await readError(response);
    if (allowCsrfRetry && error.is(ERROR_IDS.csrf)) {
      await refreshCsrfToken(options.signal);
      return sendForm(path, schema, form, options, false);
    }
    throw error;
  }
  let json: unknown;
  try {
    json = await response.json();
  } catch {
    throw new ApiError(response.status, { error: INVALID_RESPONSE, message: 'The server sent an answer Gaugeline could not read.' });
  }
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    console.error(`Unexpected response shape from POST ${path}`, parsed.error.issues);
    throw new ApiError(response.status, { error: INVALID_RESPONSE, message: 'The server sent an answer Gaugeline did not expect.' });
  }
  return parsed.data;
}

/** Typed calls. Pass the response schema; use `null` for 204 responses. */
export const api = {
  get: <S extends z.ZodType>(path: string, schema: S, options: RequestOptions = {}) => send('GET', path, schema, options, true),
  post: <S extends z.ZodType>(path: string, schema: S | null, body?: unknown, options: RequestOptions = {}) =>
    send('POST', path, schema, { ...options, body }, true),
  put: <S extends z.ZodType>(path: string, schema: S | null, body?: unknown, options: RequestOptions = {}) =>
    send('PUT', path, schema, { ...options, body }, true),
  patch: <S extends z.ZodType>(path: string, schema: S | null, body?: unknown, options: RequestOptions = {}) =>
    send('PATCH', path, schema, { ...options, body }, true),
  delete: <S extends z.ZodType>(path: string, schema: S | null, options: RequestOptions = {}) =>
    send('DELETE', path, schema, options, true),
  /** multipart/form-data POST with upload progress (see sendForm). */
  upload: <S extends z.ZodType>(path: string, schema: S, form: FormData, options: UploadOptions = {}) => sendForm(path, schema, form, options, true),
};

/** Encode one path segment, e.g. apiPath`/api/projects/${id}`. */
export function apiPath(strings: TemplateStringsArray, ...values: Array<string | number>): string {
  return strings.reduce((out, s, i) => out + s + (i < values.length ? encodeURIComponent(String(values[i])) : ''), '');
}
