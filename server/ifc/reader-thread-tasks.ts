/**
 * What the reader thread does for a request (reader-thread.mjs): index the rest of a text, or
 * read the bolt groups. Plain functions of the request, so tests can call them in one thread.
 */
import { type BoltGroupsAnswer, type BoltGroupsRequest, readBoltGroups } from './bolt-groups-read.ts';
import { getIfcApi } from './ifc-api.ts';
import { StepText, type StepTextRest } from './step-text.ts';

export type ReaderThreadRequest = { kind: 'index-rest'; bytes: Uint8Array; from: number } | ({ kind: 'bolt-groups' } & BoltGroupsRequest);

export type IndexRestAnswer = { ok: true; rest: StepTextRest } | { ok: false; message: string };
export type ReaderThreadAnswer = IndexRestAnswer | BoltGroupsAnswer;

export async function answer(request: ReaderThreadRequest): Promise<{ reply: ReaderThreadAnswer; transfer: ArrayBuffer[] }> {
  if (request.kind === 'bolt-groups') return { reply: await readBoltGroups(request), transfer: [] };
  try {
    const api = await getIfcApi();
    const rest = StepText.indexRest(request.bytes, request.from, (name) => api.GetTypeCodeFromName(name));
    // Handed over, not copied: the offsets are this thread's own memory.
    return { reply: { ok: true, rest }, transfer: [rest.offsets.buffer as ArrayBuffer] };
  } catch (e) {
    return { reply: { ok: false, message: e instanceof Error ? e.message : String(e) }, transfer: [] };
  }
}
