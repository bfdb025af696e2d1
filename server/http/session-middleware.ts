import session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../config/config';
import { leaveAccount, type AccountRow } from '../auth/account-read-ahead';
import { plainRead } from '../db/plain-read';

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
 * Every API request reads its session, and a signed-in one its account too. The store's own
 * read goes through a model (about half a millisecond of CPU here); one fixed statement (db/plain-read.ts) reads
 * both, and leaves the account for passport's deserializer (auth/account-read-ahead.ts).
 * Same meaning: the stored JSON by id; express-session itself refuses an expired cookie.
 */
function readWithPlainQuery(store: session.Store, sequelize: Sequelize): void {
  store.get = (sid, done) => {
    plainRead<[({ data: string } & Partial<AccountRow>)[]]>(sequelize, [
      {
        sql: `SELECT s.data, u.id, u.email, u.name, u.role, u.active FROM sessions s
              LEFT JOIN users u ON u.id = CAST(JSON_VALUE(s.data, '$.passport.user') AS UNSIGNED)
              WHERE s.sid = ?`,
        values: [sid],
      },
    ]).then(([rows]) => {
        const row = rows[0];
        if (!row) return done(null, null);
        const data = JSON.parse(row.data) as session.SessionData & { passport?: { user?: number } };
        const userId = data.passport?.user;
        if (typeof userId === 'number') leaveAccount(sid, userId, row.id != null ? (row as AccountRow) : null);
        done(null, data);
      }, (err) => done(err));
  };
}
