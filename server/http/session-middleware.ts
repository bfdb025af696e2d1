import session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../config/config';
import type { IncomingMessage } from 'node:http';
import type { RequestHandler } from 'express';
import { leaveReadAhead, type AccountRow, type Companion, type CompanionRead, type RevisionAhead, type RevisionRow } from './request-read-ahead';
import { plainRead } from '../db/plain-read';

const SequelizeStore = connectSessionSequelize(session.Store);

/** Sessions live in MariaDB (table `sessions`, created by migration, never by sync). */
/** `companions`: statements features send along with the session read (request-read-ahead.ts). */
export function createSessionMiddleware(sequelize: Sequelize, config: AppConfig, companions: Companion[] = []) {
  const store = new SequelizeStore({
    db: sequelize,
    table: 'SessionRecord',
    checkExpirationInterval: 15 * 60 * 1000,
    expiration: config.session.maxAgeMs,
  });
  throttleTouch(store);
  const reading = readWithPlainQuery(store, sequelize, companions);
  const withSession = session({
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
  // express-session calls store.get synchronously inside its middleware call (with no request
  // at hand), so the request is lent to the store for exactly that call. Should a later version
  // defer the call, nothing is read ahead and every route reads for itself: slower, never wrong.
  const middleware: RequestHandler = (req, res, next) => {
    reading.request = req;
    try {
      withSession(req, res, next);
    } finally {
      reading.request = undefined;
    }
  };
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

/** GET paths under one revision, relative to /api: /projects/:projectId/revisions/:revisionId[/...]. */
const REVISION_PATH = /^\/projects\/(\d{1,15})\/revisions\/(\d{1,15})(?:[/?]|$)/;

function revisionPathOf(req: IncomingMessage): { projectId: number; revisionId: number } | undefined {
  if (req.method !== 'GET' && req.method !== 'HEAD') return undefined;
  const m = REVISION_PATH.exec(req.url ?? '');
  return m ? { projectId: Number(m[1]), revisionId: Number(m[2]) } : undefined;
}

const SESSION_AND_ACCOUNT = `SELECT s.data, u.id, u.email, u.name, u.role, u.active FROM sessions s
  LEFT JOIN users u ON u.id = CAST(JSON_VALUE(s.data, '$.passport.user') AS UNSIGNED)
  WHERE s.sid = ?`;

// The same, plus the revision when its project is visible to that account: the query of
// findVisibleRevision (features/models/visible-revision.ts) with the account's role and id.
const SESSION_ACCOUNT_AND_REVISION = `SELECT s.data, u.id, u.email, u.name, u.role, u.active,
    r.id AS revId, r.model_id AS revModelId, r.number AS revNumber, r.standard AS revStandard,
    r.file_name AS revFileName, r.status AS revStatus, r.results_version AS revResultsVersion
  FROM sessions s
  LEFT JOIN users u ON u.id = CAST(JSON_VALUE(s.data, '$.passport.user') AS UNSIGNED)
  LEFT JOIN (revisions r JOIN models m ON m.id = r.model_id)
    ON r.id = ? AND m.project_id = ? AND u.id IS NOT NULL
    AND (u.role = 'admin' OR EXISTS (SELECT 1 FROM project_members pm WHERE pm.project_id = m.project_id AND pm.user_id = u.id))
  WHERE s.sid = ?`;

type SessionReadRow = { data: string } & Partial<AccountRow> & {
  revId?: number | null; revModelId?: number; revNumber?: number; revStandard?: RevisionRow['standard']; revFileName?: string; revStatus?: RevisionRow['status']; revResultsVersion?: number;
};

function revisionOf(row: SessionReadRow): RevisionRow | null {
  if (row.revId == null) return null;
  return {
    id: row.revId, modelId: row.revModelId!, number: row.revNumber!, standard: row.revStandard!,
    fileName: row.revFileName!, status: row.revStatus!, resultsVersion: row.revResultsVersion!,
  };
}

/**
 * Every API request reads its session, and a signed-in one its account too. The store's own
 * read goes through a model (about half a millisecond of CPU here); one fixed statement (db/plain-read.ts) reads
 * both, and leaves the account for passport's deserializer (request-read-ahead.ts). A request
 * for something under a revision gets that revision and its access check in the same statement,
 * which spares the member table, the overview and the 3D view's columns a round trip each.
 * Same meaning: the stored JSON by id; express-session itself refuses an expired cookie.
 */
function readWithPlainQuery(store: session.Store, sequelize: Sequelize, companions: Companion[]): { request: IncomingMessage | undefined } {
  const reading: { request: IncomingMessage | undefined } = { request: undefined };
  store.get = (sid, done) => {
    const req = reading.request;
    reading.request = undefined;
    const wanted = req && revisionPathOf(req);
    const statement = wanted
      ? { sql: SESSION_ACCOUNT_AND_REVISION, values: [wanted.revisionId, wanted.projectId, sid] }
      : { sql: SESSION_AND_ACCOUNT, values: [sid] };
    const along = req ? companions.flatMap((c) => { const s = c.statementsFor(req); return s ? [{ name: c.name, ...s }] : []; }) : [];
    plainRead<[SessionReadRow[], ...unknown[][]]>(sequelize, [statement, ...along.flatMap((a) => a.statements)]).then(([rows, ...rest]) => {
      const row = rows[0];
      if (!row) return done(null, null);
      const data = JSON.parse(row.data) as session.SessionData & { passport?: { user?: number } };
      const userId = data.passport?.user;
      if (req && typeof userId === 'number') {
        const account = row.id != null ? ({ id: row.id, email: row.email, name: row.name, role: row.role, active: row.active } as AccountRow) : null;
        const revision: RevisionAhead | undefined = wanted && { ...wanted, row: revisionOf(row) };
        const read = new Map<string, CompanionRead>();
        for (const a of along) read.set(a.name, { key: a.key, results: rest.splice(0, a.statements.length) });
        leaveReadAhead(req, { userId, account, revision, companions: read });
      }
      done(null, data);
    }, (err) => done(err));
  };
  return reading;
}
