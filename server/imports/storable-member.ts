import type { MemberRecord } from './check-members';
import { runImportTask, type ImportOutcome, type ImportTask } from './run-import-task';

/**
 * A checked member as the store writes it: the sheet's detail and the engine's result
 * already serialised. Made in the worker thread, so the hand-over to the request thread
 * copies strings instead of cloning and rebuilding 20,000 nested object graphs, and the
 * request thread never serialises them itself.
 */
export type StorableMember = Omit<MemberRecord, 'detail' | 'result'> & { detailJson: string; resultJson: string | null };

export function toStorable({ detail, result, ...rest }: MemberRecord): StorableMember {
  return { ...rest, detailJson: JSON.stringify(detail), resultJson: result ? JSON.stringify(result) : null };
}

export type StorableImportOutcome = Exclude<ImportOutcome, { ok: true }> | (Omit<Extract<ImportOutcome, { ok: true }>, 'members'> & { members: StorableMember[] });

/** The import task as the app's worker runs it: checked members come back ready to store. */
export async function runImportTaskForStore(task: ImportTask): Promise<StorableImportOutcome> {
  const outcome = await runImportTask(task);
  if (!outcome.ok) return outcome;
  const members = outcome.members.map(toStorable);
  return { ...outcome, members };
}
