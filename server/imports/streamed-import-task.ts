import type { RevisionSummary } from '@shared/api/models';
import { CapacityChecks } from './capacity-checks';
import { checkModelInSlices } from './check-members';
import { SLICE_SIZE, SLICES_IN_FLIGHT, StorableSlices, type SliceMessage, type SliceTaken } from './member-slices';
import { guardedImport, readForChecks, type ImportTask } from './run-import-task';
import type { FailureData } from './import-failure';
import { addToTally, emptyTally, summarise } from './summarise';

export type StreamedImportOutcome = { ok: true; summary: RevisionSummary } | { ok: false; failure: FailureData };

/**
 * The import task as the app's worker runs it: members are checked in slices and each slice
 * goes to the request thread ready to store (SliceMessage on the task's port) while the next
 * is checked, so storing in MariaDB overlaps checking, and neither thread ever holds every
 * member's serialised result. The summary comes back as the task's result.
 */
export async function runImportTaskForStore(task: ImportTask): Promise<StreamedImportOutcome> {
  const port = task.progressPort;
  if (!port) throw new Error('runImportTaskForStore needs the task port to hand members over');
  return guardedImport(task, async (post, timings) => {
    const { model, settings } = await readForChecks(task, post, timings);
    const t0 = performance.now();
    const tally = emptyTally();
    // Time the check stood still because the request thread had not yet stored earlier slices.
    let waitedMs = 0;
    let inFlight = 0;
    let wake: (() => void) | null = null;
    port.on('message', (m: SliceTaken) => {
      if (!m?.taken) return;
      inFlight--;
      wake?.();
    });
    const checks = new CapacityChecks();
    const storable = new StorableSlices();
    await checkModelInSlices(model, settings, SLICE_SIZE, async (records, fraction) => {
      addToTally(tally, records);
      port.postMessage(storable.of(records) satisfies SliceMessage);
      inFlight++;
      post('checking', fraction);
      const t = performance.now();
      while (inFlight >= SLICES_IN_FLIGHT) await new Promise<void>((resolve) => (wake = resolve));
      waitedMs += performance.now() - t;
      wake = null;
    }, checks);
    port.postMessage({ end: true, count: tally.candidates } satisfies SliceMessage);
    timings.checkMs = performance.now() - t0;
    timings.storeWaitMs = waitedMs;
    // How often an end's input repeated one already checked (the engine ran for `endsChecked`).
    timings.endsChecked = checks.counts.checked;
    timings.endsReused = checks.counts.reused;
    const summary = summarise(model, tally, timings);
    // The 3D view's geometry is built afterwards (run-geometry-task.ts), so it never holds results back.
    summary.geometry = 'pending';
    return { ok: true as const, summary };
  });
}
