import type { IncomingMessage } from 'node:http';
import type { JobStatus } from '@shared/api/models';
import type { StandardId } from '@shared/api/projects';
import type { Statement } from '../db/plain-read';

/** The account columns a request needs (see toSessionUser). */
export interface AccountRow {
  id: number;
  email: string;
  name: string;
  role: 'admin' | 'engineer' | 'viewer';
  active: boolean | number;
}

/** The revision columns the member table, overview and 3D view read (features/models/visible-revision.ts). */
export interface RevisionRow {
  id: number;
  modelId: number;
  number: number;
  standard: StandardId;
  fileName: string;
  status: JobStatus;
  resultsVersion: number;
}

/** A revision the request's path names, read with the session when its project is visible to the session's account. */
export interface RevisionAhead {
  projectId: number;
  revisionId: number;
  /** null: not visible to this account, or not there — the caller's own lookup says which. */
  row: RevisionRow | null;
}

/**
 * Statements a feature sends with the session read for requests it recognises (one round trip
 * instead of two). They check no access themselves: their rows may be used only once the
 * request's own access check has passed, and `key` says what they read.
 */
export interface Companion {
  name: string;
  statementsFor(req: IncomingMessage): { key: string; statements: Statement[] } | undefined;
}

export interface CompanionRead {
  key: string;
  results: unknown[][];
}

interface ReadAhead {
  userId: number;
  account: AccountRow | null;
  revision?: RevisionAhead;
  companions?: Map<string, CompanionRead>;
}

// Keyed by the request object itself: what was read for one request can never serve another.
const readAhead = new WeakMap<IncomingMessage, ReadAhead>();

/**
 * The session read (session-middleware.ts) also reads the signed-in account, and for
 * paths under a revision that revision with its access check, all in one statement, and
 * leaves them here for the same request: the deserializer and the route then make no
 * round trip of their own. Every value is still read fresh for this request.
 */
export function leaveReadAhead(req: IncomingMessage, value: ReadAhead): void {
  readAhead.set(req, value);
}

/** The account read with this request's session for this user; undefined when there is none to take. */
export function takeAccount(req: IncomingMessage, userId: number): AccountRow | null | undefined {
  const a = readAhead.get(req);
  if (!a || a.userId !== userId) return undefined;
  return a.account;
}

/**
 * The revision read with this request's session, when it was read for the same user,
 * project and revision and found visible; undefined means "look it up yourself".
 */
export function takeVisibleRevision(req: IncomingMessage, userId: number, projectId: number, revisionId: number): RevisionRow | undefined {
  const a = readAhead.get(req);
  if (!a || a.userId !== userId || !a.revision) return undefined;
  const { revision } = a;
  if (revision.projectId !== projectId || revision.revisionId !== revisionId) return undefined;
  return revision.row ?? undefined;
}

/** The rows a companion read with this request's session, when it read `key`; the caller has checked access. */
export function takeCompanion(req: IncomingMessage, name: string, key: string): unknown[][] | undefined {
  const read = readAhead.get(req)?.companions?.get(name);
  return read && read.key === key ? read.results : undefined;
}
