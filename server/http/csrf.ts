import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { errors } from './errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The session's CSRF token, created on first use (synchroniser-token pattern). */
export function csrfToken(req: Request): string {
  const session = req.session as typeof req.session & { csrfToken?: string };
  if (!session.csrfToken) session.csrfToken = randomBytes(24).toString('base64url');
  return session.csrfToken;
}

/** Every state-changing request, sign-in included, must echo the token in X-CSRF-Token. */
export const requireCsrf: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  const expected = (req.session as { csrfToken?: string } | undefined)?.csrfToken;
  const given = req.get('x-csrf-token');
  if (!expected || !given) return next(errors.csrf());
  const a = Buffer.from(expected);
  const b = Buffer.from(given);
  if (a.length !== b.length || !timingSafeEqual(a, b)) return next(errors.csrf());
  next();
};
