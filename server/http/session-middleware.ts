import session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../config/config';

const SequelizeStore = connectSessionSequelize(session.Store);

/** Sessions live in MariaDB (table `sessions`, created by migration, never by sync). */
export function createSessionMiddleware(sequelize: Sequelize, config: AppConfig) {
  const store = new SequelizeStore({
    db: sequelize,
    table: 'SessionRecord',
    checkExpirationInterval: 15 * 60 * 1000,
    expiration: config.session.maxAgeMs,
  });
  const middleware = session({
    name: 'gaugeline.sid',
    secret: config.session.secret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.session.secureCookie,
      maxAge: config.session.maxAgeMs,
    },
  });
  return { middleware, stop: () => (store as unknown as { stopExpiringSessions(): void }).stopExpiringSessions() };
}
