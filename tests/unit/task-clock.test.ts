// The import time limit runs from the task's first step in a thread, not from its hand-over.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { TaskClock } from '../../server/imports/task-clock';

beforeEach(() => vi.useFakeTimers());
afterEach(() => vi.useRealTimers());

describe('TaskClock', () => {
  it('does not count the time before the task begins against its limit', () => {
    const clock = new TaskClock(2_000, 60_000);
    vi.advanceTimersByTime(10_000); // a thread still loading
    expect(clock.signal.aborted).toBe(false);
    clock.begin();
    vi.advanceTimersByTime(1_999);
    expect(clock.signal.aborted).toBe(false);
    vi.advanceTimersByTime(1);
    expect(clock.signal.aborted).toBe(true);
    expect(clock.expired).toBe('limit');
    expect((clock.signal.reason as Error).name).toBe('TimeoutError');
  });

  it('starts the limit once: later messages do not extend it', () => {
    const clock = new TaskClock(2_000, 60_000);
    clock.begin();
    vi.advanceTimersByTime(1_500);
    clock.begin();
    vi.advanceTimersByTime(500);
    expect(clock.expired).toBe('limit');
  });

  it('stops a task that no thread begins within the start allowance', () => {
    const clock = new TaskClock(2_000, 60_000);
    vi.advanceTimersByTime(59_999);
    expect(clock.expired).toBeNull();
    vi.advanceTimersByTime(1);
    expect(clock.expired).toBe('not-begun');
    clock.begin(); // too late: stays stopped for the reason it stopped
    expect(clock.expired).toBe('not-begun');
  });

  it('stops nothing once disposed', () => {
    const clock = new TaskClock(2_000, 60_000);
    clock.begin();
    clock.dispose();
    vi.advanceTimersByTime(10_000);
    expect(clock.signal.aborted).toBe(false);
  });
});
