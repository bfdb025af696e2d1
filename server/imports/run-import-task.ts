import type { MessagePort } from 'node:worker_threads';
import type { StandardId } from '@shared/api/projects';
import type { JobStatus, RevisionSummary } from '@shared/api/models';
import { readIfcModel } from '../ifc/read-model';
import { isIfcReadError } from '../ifc/ifc-errors';
import { readUploadBytes } from './read-upload-bytes';
import { releaseReaderMemory } from './release-reader-memory';
import { ImportFailure, type FailureData } from './import-failure';
import { checkModel, type CheckSettings, type MemberRecord } from './check-members';
import { addToTally, emptyTally, summarise } from './summarise';
import type { ExtractedModel } from '../ifc/types';
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

export type Post = (status: JobStatus, progress: number) => void;

/**
 * The first part of every import in a worker: bytes → extraction, and the forces table
 * matched to the model. Returns the model and the settings its checks use.
 */
export async function readForChecks(task: ImportTask, post: Post, timings: Record<string, number>): Promise<{ model: ExtractedModel; settings: CheckSettings }> {
  const t0 = performance.now();
  post('reading', 0);
  const { model, fileBytes } = await readAndExtract(task, post);
  releaseReaderMemory(fileBytes);
  timings.readAndExtractMs = performance.now() - t0;
  post('checking', 0);
  let tableForces: Map<string, { loadCase: string; axialN: number }[]> | undefined;
  if (task.forceRows) {
    const matched = matchForceRows(task.forceRows, model.members.filter((m) => !m.notSteelReason));
    const first = matched.problems[0];
    if (first) throw new ImportFailure('forces.rejected', `The forces file does not fit the model: line ${first.line}: ${first.message}${matched.problems.length > 1 ? ` (and ${matched.problems.length - 1} more)` : ''}.`);
    tableForces = matched.byGlobalId;
  }
  return { model, settings: { standard: task.standard, defaultGrade: task.defaultGrade, tableForces } };
}

/** Its own function so that the file's bytes are out of reach once the model is extracted. */
async function readAndExtract(task: ImportTask, post: Post): Promise<{ model: ExtractedModel; fileBytes: number }> {
  // Shared: the reader thread then reads the same memory (reader-thread.ts).
  const bytes = await readUploadBytes(task.filePath, task.kind, task.inflateLimitBytes, { shared: true });
  const model = await readIfcModel(bytes, {
    progress: (phase, fraction) => post(phase === 'reading' ? 'reading' : 'extracting', fraction),
    // Checks and the store use the members' own profiles, not the file's list of every profile.
    listProfiles: false,
  });
  return { model, fileBytes: bytes.length };
}

/**
 * Runs an import's steps with progress on the task's port, and turns expected failures into
 * { ok: false } so their id and message survive the thread boundary. Closes the port at the end.
 */
export async function guardedImport<T extends { ok: true }>(task: ImportTask, steps: (post: Post, timings: Record<string, number>) => Promise<T>): Promise<T | { ok: false; failure: FailureData }> {
  const post: Post = (status, progress) => task.progressPort?.postMessage({ status, progress } satisfies ProgressMessage);
  try {
    return await steps(post, {});
  } catch (err) {
    if (err instanceof ImportFailure) return { ok: false, failure: { id: err.id, message: err.message } };
    if (isIfcReadError(err)) return { ok: false, failure: { id: err.id, message: err.message } };
    return { ok: false, failure: { id: 'import.failed', message: `The model could not be processed: ${(err as Error)?.message ?? String(err)}` } };
  } finally {
    task.progressPort?.close();
  }
}

/**
 * The whole import of one file, as run inside a worker thread: bytes → extraction →
 * checks. Returns plain data (the command line's form; the app streams, see streamed-import-task.ts).
 */
export async function runImportTask(task: ImportTask): Promise<ImportOutcome> {
  return guardedImport(task, async (post, timings) => {
    const { model, settings } = await readForChecks(task, post, timings);
    const t0 = performance.now();
    const members = checkModel(model, settings, (f) => post('checking', f));
    timings.checkMs = performance.now() - t0;
    const summary = summarise(model, addToTally(emptyTally(), members), timings);
    // The 3D view's geometry is built afterwards (run-geometry-task.ts), so it never holds results back.
    summary.geometry = 'pending';
    return { ok: true as const, summary, members };
  });
}
