import type { Request, RequestHandler } from 'express';
import type { Role } from '@shared/api/roles';
import type { SessionUser } from '@shared/api/session';
import { errors } from './errors';

/** The signed-in user, or a 401. */
export function currentUser(req: Request): SessionUser {
  if (!req.user) throw errors.unauthenticated();
  return req.user;
}

/** Route guard: signed in, and (if roles are given) one of them. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(errors.unauthenticated());
    if (roles.length && !roles.includes(req.user.role)) return next(errors.forbidden());
    next();
  };
}

export const requireSignedIn: RequestHandler = requireRole();
