import session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import { QueryTypes, type Sequelize } from 'sequelize';
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
  throttleTouch(store);
  readWithPlainQuery(store, sequelize);
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

/** How often a session's expiry is written back while it is in use. */
const TOUCH_EVERY_MS = 60_000;

/**
 * A rolling session would otherwise cost an UPDATE on every request. The expiry written
 * lags use by at most a minute, which matters nothing against a session lifetime of hours.
 */
function throttleTouch(store: session.Store): void {
  const lastTouch = new Map<string, number>();
  const touch = store.touch!.bind(store);
  store.touch = (sid, data, done) => {
    const now = Date.now();
    if (now - (lastTouch.get(sid) ?? 0) < TOUCH_EVERY_MS) return done?.();
    // Bounded: forget everything once in a while rather than track expiry per entry.
    if (lastTouch.size > 10_000) lastTouch.clear();
    lastTouch.set(sid, now);
    touch(sid, data, done);
  };
}

/**
 * Every API request reads its session. The store's own read goes through a model
 * (about half a millisecond of CPU here); one fixed statement costs half as much.
 * Same meaning: the stored JSON by id; express-session itself refuses an expired cookie.
 */
function readWithPlainQuery(store: session.Store, sequelize: Sequelize): void {
  store.get = (sid, done) => {
    sequelize
      .query<{ data: string }>('SELECT data FROM sessions WHERE sid = ?', { replacements: [sid], type: QueryTypes.SELECT })
      .then((rows) => done(null, rows[0] ? (JSON.parse(rows[0].data) as session.SessionData) : null), (err) => done(err));
  };
}
