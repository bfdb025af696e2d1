import type { MessagePort } from 'node:worker_threads';
import type { SliceMessage, SliceTaken, StorableSlice } from './member-slices';

/**
 * The request thread's end of a worker's member slices (SliceMessage on the task's port):
 * an async iterable for the store. Each slice is acknowledged once the store asks for the
 * next one, which lets the worker check further (it keeps at most a few slices in flight).
 * `fail` ends the iteration with an error (the task failed or its worker was lost), and so
 * does the port closing before the worker said it had sent everything.
 */
export class MemberSliceStream implements AsyncIterable<StorableSlice> {
  private readonly queue: StorableSlice[] = [];
  private ended = false;
  private failure: unknown = null;
  private wake: (() => void) | null = null;

  constructor(private readonly port: MessagePort) {
    // A port that closes before the end was announced (the worker thread went away) ends the slices with an error.
    port.once('close', () => this.fail(new Error('the import worker stopped before handing over all checked members')));
  }

  /** Takes one message of the port; false when it is not about slices (progress, for example). */
  take(message: unknown): boolean {
    const m = message as Partial<SliceMessage> | null;
    if (m && Array.isArray((m as { members?: unknown }).members)) this.queue.push({ members: (m as StorableSlice).members, capacities: (m as StorableSlice).capacities ?? [] });
    else if (m && (m as { end?: unknown }).end === true) this.ended = true;
    else return false;
    this.notify();
    return true;
  }

  /** Ends the iteration with `error`, unless every slice has already arrived. */
  fail(error: unknown): void {
    if (this.ended) return;
    this.failure ??= error;
    this.notify();
  }

  private notify(): void {
    const wake = this.wake;
    this.wake = null;
    wake?.();
  }

  async *[Symbol.asyncIterator](): AsyncIterator<StorableSlice> {
    for (;;) {
      if (this.failure) throw this.failure;
      const slice = this.queue.shift();
      if (slice) {
        yield slice;
        this.port.postMessage({ taken: true } satisfies SliceTaken);
        continue;
      }
      if (this.ended) return;
      await new Promise<void>((resolve) => (this.wake = resolve));
    }
  }
}
