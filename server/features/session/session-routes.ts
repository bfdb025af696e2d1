import { Router, type Request, type Response } from 'express';
import type passport from 'passport';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { signInRequestSchema, changePasswordRequestSchema, passwordResetRequestSchema, setPasswordWithTokenSchema, type SessionResponse } from '@shared/api/session';
import type { Sequelize } from 'sequelize';
import type { MailService } from '../../mail/mail-service';
import { requestPasswordReset, setPasswordWithToken } from './account-links-service';
import type { AppConfig } from '../../config/config';
import { parseBody } from '../../http/validate';
import { csrfToken } from '../../http/csrf';
import { currentUser, requireSignedIn } from '../../http/require-user';
import { errors } from '../../http/errors';
import { changePassword, recordSignIn } from './session-service';

function sessionBody(req: Request): SessionResponse {
  return { user: req.user ?? null, csrfToken: csrfToken(req) };
}

/** Runs passport's local strategy as a promise so the route stays linear. */
function authenticate(pp: passport.PassportStatic, req: Request, res: Response): Promise<Express.User | false> {
  return new Promise((resolve, reject) => {
    pp.authenticate('local', { session: false }, (err: unknown, user: Express.User | false) => (err ? reject(err) : resolve(user)))(req, res, reject);
  });
}

function logIn(req: Request, user: Express.User): Promise<void> {
  // passport regenerates the session here, so the session id changes at sign-in.
  return new Promise((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));
}

export function sessionRoutes(pp: passport.PassportStatic, config: AppConfig, sequelize: Sequelize, mail: MailService): Router {
  const router = Router();

  // Failed attempts per address and e-mail; a successful sign-in does not count.
  const signInLimiter = rateLimit({
    windowMs: config.signInLimit.windowMs,
    limit: config.signInLimit.max,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler: (_req, _res, next, options) => next(errors.rateLimited(options.windowMs / 1000)),
  });

  // Reset requests per address and e-mail, so the form cannot be used to flood a mailbox.
  const resetLimiter = rateLimit({
    windowMs: config.signInLimit.windowMs,
    limit: config.signInLimit.max,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `reset|${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler: (_req, _res, next, options) => next(errors.rateLimited(options.windowMs / 1000, 'requests for a reset link')),
  });

  router.post('/password-reset', resetLimiter, async (req, res) => {
    const body = parseBody(passwordResetRequestSchema, req.body);
    await requestPasswordReset(sequelize, config, mail, body.email);
    res.status(202).json({ message: 'If an account uses that address, a link to choose a new password is on its way.' });
  });

  router.post('/password-token', async (req, res) => {
    const body = parseBody(setPasswordWithTokenSchema, req.body);
    await setPasswordWithToken(sequelize, body.token, body.newPassword);
    res.status(204).end();
  });

  router.get('/', (req, res) => {
    res.json(sessionBody(req));
  });

  router.post('/', signInLimiter, async (req, res) => {
    const body = parseBody(signInRequestSchema, req.body);
    req.body = body;
    const user = await authenticate(pp, req, res);
    if (!user) throw errors.badCredentials();
    await logIn(req, user);
    await recordSignIn(user.id);
    res.json(sessionBody(req));
  });

  router.delete('/', async (req, res) => {
    await new Promise<void>((resolve, reject) => req.logOut((err) => (err ? reject(err) : resolve())));
    res.json(sessionBody(req));
  });

  router.put('/password', requireSignedIn, async (req, res) => {
    const body = parseBody(changePasswordRequestSchema, req.body);
    await changePassword(currentUser(req).id, body.currentPassword, body.newPassword);
    res.status(204).end();
  });

  return router;
}
