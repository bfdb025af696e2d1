// The account read with a session is handed to the same request's deserializer once, and only for its own user.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { leaveAccount, takeAccount } from '../../server/auth/account-read-ahead';

const account = { id: 7, email: 'e@example.test', name: 'E', role: 'engineer' as const, active: 1 };

afterEach(() => vi.useRealTimers());

describe('account read with the session', () => {
  it('is taken once, by the same session and user', () => {
    leaveAccount('sid-a', 7, account);
    expect(takeAccount('sid-a', 7)).toEqual(account);
    expect(takeAccount('sid-a', 7)).toBeUndefined();
  });

  it('is not given for another user id or a missing session id (the caller reads the account itself)', () => {
    leaveAccount('sid-b', 7, account);
    expect(takeAccount('sid-b', 8)).toBeUndefined();
    expect(takeAccount(undefined, 7)).toBeUndefined();
  });

  it('passes on a deleted account as null, and goes stale after a few seconds', () => {
    leaveAccount('sid-c', 9, null);
    expect(takeAccount('sid-c', 9)).toBeNull();
    vi.useFakeTimers();
    leaveAccount('sid-d', 7, account);
    vi.advanceTimersByTime(6_000);
    expect(takeAccount('sid-d', 7)).toBeUndefined();
  });
});
