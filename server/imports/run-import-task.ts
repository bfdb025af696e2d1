import type { MessagePort } from 'node:worker_threads';
import type { StandardId } from '@shared/api/projects';
import type { JobStatus, RevisionSummary } from '@shared/api/models';
import { readIfcModel } from '../ifc/read-model';
import { isIfcReadError } from '../ifc/ifc-errors';
import { readUploadBytes } from './read-upload-bytes';
import { ImportFailure, type FailureData } from './import-failure';
import { checkModel, type MemberRecord } from './check-members';
import { summarise } from './summarise';
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
  | { ok: true; summary: RevisionSummary; members: MemberRecord[] }
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
    const summary = summarise(model, members, timings);
    // The 3D view's geometry is built afterwards (run-geometry-task.ts), so it never holds results back.
    summary.geometry = 'pending';
    return { ok: true, summary, members };
  } catch (err) {
    if (err instanceof ImportFailure) return { ok: false, failure: { id: err.id, message: err.message } };
    if (isIfcReadError(err)) return { ok: false, failure: { id: err.id, message: err.message } };
    return { ok: false, failure: { id: 'import.failed', message: `The model could not be processed: ${(err as Error)?.message ?? String(err)}` } };
  } finally {
    task.progressPort?.close();
  }
}
