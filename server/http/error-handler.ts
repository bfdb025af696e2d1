import type { ErrorRequestHandler, RequestHandler } from 'express';
import { BaseError, ConnectionError } from 'sequelize';
import { ERROR_IDS, type ApiErrorBody } from '@shared/api/errors';
import { AppError, errors } from './errors';

/** Unknown /api routes answer in JSON, not with the client's index page. */
export const apiNotFound: RequestHandler = (_req, _res, next) => next(errors.notFound('That API route'));

function isDbDown(err: unknown): boolean {
  if (err instanceof ConnectionError) return true;
  // Only the database's own errors: an unreachable file store (S3) is a different failure and is logged.
  if (!(err instanceof BaseError) && (err as { name?: string })?.name !== 'SqlError') return false;
  const code = (err as { code?: string; parent?: { code?: string } })?.code ?? (err as any)?.parent?.code;
  return ['ECONNREFUSED', 'ER_GET_CONNECTION_TIMEOUT', 'ER_CONNECTION_ALREADY_CLOSED', 'ER_SOCKET_UNEXPECTED_CLOSE'].includes(code ?? '');
}

/** The single place where errors become responses. */
export function errorHandler(log: (msg: string, err: unknown) => void): ErrorRequestHandler {
  return (err, _req, res, _next) => {
    let appError: AppError;
    if (err instanceof AppError) appError = err;
    else if (isDbDown(err)) appError = errors.dbDown();
    else if (err?.type === 'entity.parse.failed') appError = errors.validation('The request body is not valid JSON.');
    else if (err?.type === 'entity.too.large') appError = new AppError(413, ERROR_IDS.validation, 'The request body is too large.');
    else {
      log('unexpected error', err);
      appError = new AppError(500, ERROR_IDS.internal, 'Something went wrong on the server. The problem has been logged.');
    }
    const body: ApiErrorBody = { error: appError.id, message: appError.message };
    if (appError.fields) body.fields = appError.fields;
    if (appError.details !== undefined) body.details = appError.details;
    if (res.headersSent) return;
    res.status(appError.status).json(body);
  };
}
