/**
 * Bolt groups read on their own from a file's text: what the reader thread does while the
 * reading thread extracts members (reader-thread.ts, decision 0014). The same steps as
 * extractModel before and during its bolt phase — units, the relations bolt groups read,
 * fasteners — so the groups and their warnings are the ones a read in one thread gives. It reads
 * the text as the reading thread indexed it (regular text only), and gives up (ok: false)
 * wherever the reading thread would do more than read the text — a line that needs web-ifc, a
 * file without a project — and the reading thread then reads the bolt groups itself.
 */
import * as W from 'web-ifc';
import { type BoltWork, extractBoltGroup, fastenerIds } from './bolts.ts';
import { getIfcApi } from './ifc-api.ts';
import { ModelContext } from './model-context.ts';
import { buildRelationsIndex } from './relations-index.ts';
import { StepText, type StepTextIndex } from './step-text.ts';
import type { ExtractionWarning, IfcSchema } from './types.ts';
import { readUnits } from './units.ts';
import { WarningCollector } from './warnings.ts';

export interface BoltGroupsRequest {
  bytes: Uint8Array;
  /** The reading thread's index of the same bytes (StepText.snapshot: regular text only). */
  index: StepTextIndex;
  schema: IfcSchema;
  schemaIdentifier: string;
  cacheSize?: number;
}

export type BoltGroupsAnswer =
  | { ok: true; bolts: BoltWork[]; warnings: ExtractionWarning[]; linesRead: number }
  | { ok: false; message: string };

class NeedsWebIfc extends Error {}

export async function readBoltGroups(request: BoltGroupsRequest): Promise<BoltGroupsAnswer> {
  try {
    const api = await getIfcApi();
    const text = StepText.adopt(request.bytes, request.index, (name) => api.GetTypeCodeFromName(name));
    let neededWebIfc = false;
    const refuseWebIfc = (): number => {
      neededWebIfc = true;
      throw new NeedsWebIfc('a line needs web-ifc');
    };
    const ctx = new ModelContext(api, refuseWebIfc, request.schema, request.cacheSize, text, { schemaIdentifier: request.schemaIdentifier });
    if (!ctx.listsFromText) return { ok: false, message: 'classes are not listed from the text' };
    const projectId = ctx.idsOfType(W.IFCPROJECT)[0];
    if (projectId === undefined) return { ok: false, message: 'no project' };
    ctx.units = readUnits(ctx, projectId);
    // Bolt groups read property sets and type objects only (bolts.ts, property-sets.ts).
    const ix = buildRelationsIndex(ctx, 'properties');
    // The reading thread has the warnings of units and relations already; only the bolt phase's go back.
    ctx.warnings = new WarningCollector();
    const bolts: BoltWork[] = [];
    for (const id of fastenerIds(ctx)) {
      const b = extractBoltGroup(ctx, ix, id);
      if (b) bolts.push(b);
    }
    // Extractors take a line they could not get as missing, so a refused open is looked for here.
    if (neededWebIfc) return { ok: false, message: 'a line needs web-ifc' };
    return { ok: true, bolts, warnings: ctx.warnings.list(), linesRead: ctx.linesRead };
  } catch (e) {
    return { ok: false, message: e instanceof Error ? e.message : String(e) };
  }
}
