import { ERROR_IDS } from '@shared/api/errors';

/**
 * The one error type routes and services throw. Each carries an HTTP status and a
 * stable id (see shared/api/errors.ts); the error handler turns it into JSON.
 */
export class AppError extends Error {
  constructor(
    public readonly status: number,
    public readonly id: string,
    message: string,
    public readonly fields?: Record<string, string>,
    /** Structured detail for the client, e.g. a per-row report of a rejected file. */
    public readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

/** A few factories, so ids and statuses stay consistent across the code base. */
export const errors = {
  validation: (message: string, fields?: Record<string, string>) => new AppError(400, ERROR_IDS.validation, message, fields),
  unauthenticated: () => new AppError(401, ERROR_IDS.unauthenticated, 'Sign in to continue.'),
  badCredentials: () => new AppError(401, ERROR_IDS.badCredentials, 'The e-mail address or password is not correct.'),
  forbidden: (message = 'Your role does not allow this.') => new AppError(403, ERROR_IDS.forbidden, message),
  csrf: () => new AppError(403, ERROR_IDS.csrf, 'The request is missing its security token. Reload the page and try again.'),
  rateLimited: (retryAfterSeconds: number, what = 'sign-in attempts') =>
    new AppError(429, ERROR_IDS.rateLimited, `Too many ${what}. Try again in ${Math.ceil(retryAfterSeconds / 60)} minute(s).`),
  notFound: (what: string) => new AppError(404, ERROR_IDS.notFound, `${what} was not found.`),
  conflict: (message: string) => new AppError(409, ERROR_IDS.conflict, message),
  dbDown: () => new AppError(503, ERROR_IDS.dbDown, 'The database is not reachable just now. Try again shortly.'),
};
