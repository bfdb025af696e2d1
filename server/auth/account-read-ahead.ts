/** The account columns a request needs (see toSessionUser). */
export interface AccountRow {
  id: number;
  email: string;
  name: string;
  role: 'admin' | 'engineer' | 'viewer';
  active: boolean | number;
}

interface Ahead {
  userId: number;
  account: AccountRow | null;
  at: number;
}

/** An account read with its session is used within the same request, so it is dropped soon after. */
const KEEP_MS = 5_000;
const ahead = new Map<string, Ahead>();

/**
 * The session read (session-middleware.ts) also reads the signed-in account in the same
 * statement and leaves it here for passport's deserializer, which runs next in the same
 * request: one round trip to MariaDB instead of two on every signed-in request, and still a
 * fresh read of the account each time (role changes and deactivation count at once).
 */
export function leaveAccount(sessionId: string, userId: number, account: AccountRow | null): void {
  if (ahead.size > 10_000) ahead.clear();
  ahead.set(sessionId, { userId, account, at: Date.now() });
}

/** The account read with this session for this user, once; undefined when there is none to take. */
export function takeAccount(sessionId: string | undefined, userId: number): AccountRow | null | undefined {
  if (!sessionId) return undefined;
  const a = ahead.get(sessionId);
  if (!a) return undefined;
  ahead.delete(sessionId);
  if (a.userId !== userId || Date.now() - a.at > KEEP_MS) return undefined;
  return a.account;
}
