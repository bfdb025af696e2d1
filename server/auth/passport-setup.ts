import type { IncomingMessage } from 'node:http';
import passport from 'passport';
import { QueryTypes } from 'sequelize';
import { Strategy as LocalStrategy } from 'passport-local';
import { UserModel } from '../db/models/user';
import { decoyPasswordHash, verifyPassword } from './passwords';
import { takeAccount, type AccountRow } from '../http/request-read-ahead';
import type { SessionUser } from '@shared/api/session';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

export function toSessionUser(user: Pick<UserModel, 'id' | 'email' | 'name' | 'role'>): SessionUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}

/**
 * E-mail + password strategy. Unknown e-mails, wrong passwords and deactivated
 * accounts all give the same answer after the same amount of work.
 */
export function configurePassport(): passport.PassportStatic {
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const user = await UserModel.findOne({ where: { email: email.trim().toLowerCase() } });
        const hash = user?.passwordHash ?? (await decoyPasswordHash());
        const ok = await verifyPassword(password, hash);
        if (!user || !ok || !user.active || !user.passwordHash) return done(null, false);
        return done(null, toSessionUser(user));
      } catch (err) {
        return done(err);
      }
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  // Re-read the account on every request so role changes and deactivation take effect at once.
  passport.deserializeUser(async (req: IncomingMessage, id: number, done: (err: unknown, user?: Express.User | false) => void) => {
    try {
      // Usually read with the session in the same statement (http/request-read-ahead.ts); else one fixed statement.
      let user = takeAccount(req, id);
      if (user === undefined) {
        [user] = await UserModel.sequelize!.query<AccountRow>('SELECT id, email, name, role, active FROM users WHERE id = ?', { replacements: [id], type: QueryTypes.SELECT });
      }
      done(null, user && user.active ? toSessionUser(user) : false);
    } catch (err) {
      done(err);
    }
  });
  return passport;
}
