import type { MemberRecord } from './check-members';
import { CapacityTexts, type StorableCapacity } from './capacity-texts';

export type { StorableCapacity } from './capacity-texts';

/**
 * A checked member as the store writes it: the sheet's detail already serialised, and its
 * result as the number of a capacity (capacity-texts.ts) to which the member's design force is
 * applied when it is read. Made in the worker thread, so the hand-over to the request thread
 * copies strings instead of cloning and rebuilding nested object graphs, and the request
 * thread never serialises them itself.
 */
export type StorableMember = Omit<MemberRecord, 'detail' | 'result'> & { detailJson: string; capacityKey: number | null };

/** Members in store form, with the texts of the capacities first met among them. */
export interface StorableSlice {
  members: StorableMember[];
  capacities: StorableCapacity[];
}

/** Makes the slices of one import: each capacity's text goes with the first slice that needs it. */
export class StorableSlices {
  private readonly texts = new CapacityTexts();

  of(records: MemberRecord[]): StorableSlice {
    const capacities: StorableCapacity[] = [];
    const members = records.map(({ detail, result, ...rest }): StorableMember => ({
      ...rest,
      detailJson: JSON.stringify(detail),
      capacityKey: result ? this.texts.keyOf(result, capacities) : null,
    }));
    return { members, capacities };
  }
}

/** Members per slice handed to the request thread (about 2 MB of JSON at 1,000). */
export const SLICE_SIZE = 1000;
/** Slices handed over and not yet stored before checking waits: bounds memory on both sides. */
export const SLICES_IN_FLIGHT = 2;

/** Messages on the task's port besides progress: checked members, then the end of them. */
export type SliceMessage = StorableSlice | { end: true; count: number };
/** The request thread's answer once it has stored a slice. */
export type SliceTaken = { taken: true };
