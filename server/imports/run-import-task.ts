import type { MessagePort } from 'node:worker_threads';
import type { StandardId } from '@shared/api/projects';
import type { JobStatus, RevisionSummary } from '@shared/api/models';
import { readIfcModel } from '../ifc/read-model';
import { isIfcReadError } from '../ifc/ifc-errors';
import { readUploadBytes } from './read-upload-bytes';
import { ImportFailure, type FailureData } from './import-failure';
import { checkModel, type MemberRecord } from './check-members';
import { summarise } from './summarise';
import { buildDisplayGeometry } from '../ifc/display-geometry';
import { move, transferableSymbol, valueSymbol } from 'piscina';
import { matchForceRows } from './match-force-rows';
import type { ForceRow } from '@shared/forces/parse-forces-csv';

export interface ImportTask {
  filePath: string;
  kind: 'ifc' | 'ifczip';
  standard: StandardId;
  defaultGrade: string;
  inflateLimitBytes: number;
  progressPort?: MessagePort;
  /** Rows of a forces table to apply before checking (the command line's --forces). */
  forceRows?: ForceRow[];
}

export type ImportOutcome =
  | { ok: true; summary: RevisionSummary; members: MemberRecord[]; /** Display geometry file (shared/geometry), or null when it could not be built. */ geometry: Uint8Array | null }
  | { ok: false; failure: FailureData };

export interface ProgressMessage {
  status: JobStatus;
  progress: number;
}

/**
 * The whole import of one file, as run inside a worker thread: bytes → extraction →
 * checks. Returns plain data; expected failures come back as { ok: false } so their
 * id and message survive the thread boundary.
 */
export async function runImportTask(task: ImportTask): Promise<ImportOutcome> {
  const post = (status: JobStatus, progress: number) => task.progressPort?.postMessage({ status, progress } satisfies ProgressMessage);
  const timings: Record<string, number> = {};
  let t0 = performance.now();
  try {
    post('reading', 0);
    const bytes = await readUploadBytes(task.filePath, task.kind, task.inflateLimitBytes);
    const model = await readIfcModel(bytes, {
      progress: (phase, fraction) => post(phase === 'reading' ? 'reading' : 'extracting', phase === 'reading' ? fraction : fraction),
    });
    timings.readAndExtractMs = performance.now() - t0;
    t0 = performance.now();
    post('checking', 0);
    let tableForces: Map<string, { loadCase: string; axialN: number }[]> | undefined;
    if (task.forceRows) {
      const matched = matchForceRows(task.forceRows, model.members.filter((m) => !m.notSteelReason));
      const first = matched.problems[0];
      if (first) throw new ImportFailure('forces.rejected', `The forces file does not fit the model: line ${first.line}: ${first.message}${matched.problems.length > 1 ? ` (and ${matched.problems.length - 1} more)` : ''}.`);
      tableForces = matched.byGlobalId;
    }
    const members = checkModel(model, { standard: task.standard, defaultGrade: task.defaultGrade, tableForces }, (f) => post('checking', f));
    timings.checkMs = performance.now() - t0;
    t0 = performance.now();
    // Display geometry for the 3D view. Its failure is a warning, never a failed import.
    let geometry: Uint8Array | null = null;
    let geometryProblem: string | null = null;
    try {
      // Bounded, so a slow geometry kernel cannot push the whole import past its time limit.
      const built = await buildDisplayGeometry(bytes, { timeBudgetMs: GEOMETRY_BUDGET_MS });
      geometry = built.bytes;
      if (built.stats.skipped) geometryProblem = `partial: ${built.stats.skipped} of ${built.stats.elements} elements left out after ${Math.round(GEOMETRY_BUDGET_MS / 1000)} s`;
    } catch (e) {
      geometryProblem = e instanceof Error ? e.message : String(e);
    }
    timings.geometryMs = performance.now() - t0;
    const summary = summarise(model, members, timings);
    if (geometryProblem !== null && geometry) summary.warnings.push({ code: 'geometry.partial', message: 'The 3D view of this revision shows only part of the model (preparing it took too long); results are not affected.', count: 1, examples: [geometryProblem.slice(0, 200)] });
    else if (geometryProblem !== null) summary.warnings.push({ code: 'geometry.failed', message: 'The 3D view of this revision could not be prepared; results are not affected.', count: 1, examples: [geometryProblem.slice(0, 200)] });
    return transferGeometry({ ok: true, summary, members, geometry });
  } catch (err) {
    if (err instanceof ImportFailure) return { ok: false, failure: { id: err.id, message: err.message } };
    if (isIfcReadError(err)) return { ok: false, failure: { id: err.id, message: err.message } };
    return { ok: false, failure: { id: 'import.failed', message: `The model could not be processed: ${(err as Error)?.message ?? String(err)}` } };
  } finally {
    task.progressPort?.close();
  }
}

/** Time the display geometry may take inside an import (the import's own limit defaults to 900 s). */
const GEOMETRY_BUDGET_MS = 300_000;

/** Lets piscina move the geometry bytes to the main thread instead of copying them. */
function transferGeometry(outcome: ImportOutcome): ImportOutcome {
  if (!outcome.ok || !outcome.geometry) return outcome;
  Object.defineProperty(outcome, transferableSymbol, { value: [outcome.geometry.buffer] });
  Object.defineProperty(outcome, valueSymbol, { value: { ...outcome } });
  return move(outcome as never) as unknown as ImportOutcome;
}
