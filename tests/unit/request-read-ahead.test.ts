// What one request read with its session is handed to that request only, and only for its own user and path.
import type { IncomingMessage } from 'node:http';
import { describe, expect, it } from 'vitest';
import { leaveReadAhead, takeAccount, takeVisibleRevision, type RevisionRow } from '../../server/http/request-read-ahead';

const account = { id: 7, email: 'e@example.test', name: 'E', role: 'engineer' as const, active: 1 };
const row: RevisionRow = { id: 3, modelId: 2, number: 1, standard: 'as4100', fileName: 'a.ifc', status: 'done', resultsVersion: 4 };
const request = () => ({}) as IncomingMessage;

describe('read with the session', () => {
  it('gives the account to the same request and user only', () => {
    const a = request();
    leaveReadAhead(a, { userId: 7, account });
    expect(takeAccount(a, 7)).toEqual(account);
    expect(takeAccount(a, 8)).toBeUndefined();
    expect(takeAccount(request(), 7)).toBeUndefined();
  });

  it('passes on a deleted account as null', () => {
    const a = request();
    leaveReadAhead(a, { userId: 9, account: null });
    expect(takeAccount(a, 9)).toBeNull();
  });

  it('gives the revision only for the same user, project and revision, and only when it was found visible', () => {
    const a = request();
    leaveReadAhead(a, { userId: 7, account, revision: { projectId: 5, revisionId: 3, row } });
    expect(takeVisibleRevision(a, 7, 5, 3)).toEqual(row);
    expect(takeVisibleRevision(a, 8, 5, 3)).toBeUndefined();
    expect(takeVisibleRevision(a, 7, 6, 3)).toBeUndefined();
    expect(takeVisibleRevision(a, 7, 5, 4)).toBeUndefined();
    const b = request();
    leaveReadAhead(b, { userId: 7, account, revision: { projectId: 5, revisionId: 3, row: null } });
    expect(takeVisibleRevision(b, 7, 5, 3)).toBeUndefined();
  });
});
