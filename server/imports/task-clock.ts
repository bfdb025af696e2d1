/**
 * The time limit of an import task, counted from when a worker thread begins it (its first
 * progress message), not from when it was handed to the pool. A thread that is still loading —
 * the replacement of a thread stopped at its limit loads tsx, web-ifc and the engine, which took
 * 2 s on an idle machine and 8 s beside a starting app — is not the file's fault, and the limit
 * says "the file may be malformed". A task that no thread begins within the start allowance is
 * stopped too, so a thread that never loads cannot hold a job forever.
 */
export type ClockExpiry = 'not-begun' | 'limit';

export class TaskClock {
  private readonly controller = new AbortController();
  private timer: NodeJS.Timeout;
  private begun = false;
  private expiry: ClockExpiry | null = null;

  /** Both in milliseconds: the task's own limit, and how long a thread may take to begin it. */
  constructor(
    private readonly limitMs: number,
    startAllowanceMs: number,
  ) {
    this.timer = setTimeout(() => this.expire('not-begun'), startAllowanceMs);
  }

  /** Aborts the task (piscina's run option) when the clock runs out. */
  get signal(): AbortSignal {
    return this.controller.signal;
  }

  /** Why the clock stopped the task, or null if it did not. */
  get expired(): ClockExpiry | null {
    return this.expiry;
  }

  /** Starts the task's own limit; later calls do nothing. */
  begin(): void {
    if (this.begun || this.expiry) return;
    this.begun = true;
    clearTimeout(this.timer);
    this.timer = setTimeout(() => this.expire('limit'), this.limitMs);
  }

  /** Stops the timer once the task has ended. */
  dispose(): void {
    clearTimeout(this.timer);
  }

  private expire(why: ClockExpiry): void {
    this.expiry = why;
    this.controller.abort(new DOMException(why === 'limit' ? 'time limit reached' : 'no thread began the task', 'TimeoutError'));
  }
}

/** How long a thread may take to begin an import task, ms: loading takes seconds; minutes mean it never will. */
export const THREAD_START_ALLOWANCE_MS = 120_000;
