import type { MemberRecord } from './check-members';
import { resultJson } from './result-json';

/**
 * A checked member as the store writes it: the sheet's detail and the engine's result
 * already serialised. Made in the worker thread, so the hand-over to the request thread
 * copies strings instead of cloning and rebuilding nested object graphs, and the request
 * thread never serialises them itself.
 */
export type StorableMember = Omit<MemberRecord, 'detail' | 'result'> & { detailJson: string; resultJson: string | null };

export function toStorable({ detail, result, ...rest }: MemberRecord): StorableMember {
  return { ...rest, detailJson: JSON.stringify(detail), resultJson: result ? resultJson(result) : null };
}

/** Members per slice handed to the request thread (about 6 MB of JSON at 1,000). */
export const SLICE_SIZE = 1000;
/** Slices handed over and not yet stored before checking waits: bounds memory on both sides. */
export const SLICES_IN_FLIGHT = 2;

/** Messages on the task's port besides progress: checked members, then the end of them. */
export type SliceMessage = { members: StorableMember[] } | { end: true; count: number };
/** The request thread's answer once it has stored a slice. */
export type SliceTaken = { taken: true };
