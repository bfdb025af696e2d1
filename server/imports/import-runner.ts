import { MessageChannel } from 'node:worker_threads';
import { hostname, tmpdir } from 'node:os';
import { promises as fsp } from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { parseForcesCsv, type ForceRow } from '@shared/forces/parse-forces-csv';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../config/config';
import type { FileStore } from '../storage/file-store';
import type { Logger } from '../logger';
import { RevisionModel } from '../db/models/revision';
import { IfcModelModel } from '../db/models/ifc-model';
import { ProjectModel } from '../db/models/project';
import type { StandardId } from '@shared/api/projects';
import { claimNextJob, failJob, heartbeat, reportProgress } from './job-claims';
import { storeStreamed } from './store-outcome';
import type { ImportTask, ProgressMessage } from './run-import-task';
import type { StreamedImportOutcome } from './streamed-import-task';
import { MemberSliceStream } from './member-slice-stream';
import { ImportPools, importPoolFor } from './import-pools';
import { TaskClock, THREAD_START_ALLOWANCE_MS } from './task-clock';
import type { FailureData } from './import-failure';
import type { GeometryOutcome, GeometryTask } from './run-geometry-task';
import type { RevisionSummary } from '@shared/api/models';
import { geometryGzipKey, geometryKey } from '../features/geometry/geometry-key';
import { memberColumnsOf } from '../features/member-columns/member-columns-service';
import { prepareMemberTable } from '../features/members/member-table-cache';

/**
 * Runs import jobs in worker threads, never on the request thread. Jobs are claimed
 * from MariaDB, so several app processes can share one queue; a job whose process
 * died is taken over when its heartbeat goes stale.
 */
export class ImportRunner {
  readonly owner = `${hostname()}:${process.pid}:${randomBytes(3).toString('hex')}`;
  private readonly pools: ImportPools;
  private readonly active = new Set<Promise<void>>();
  private timer: NodeJS.Timeout | undefined;
  private ticking = false;
  private stopping = false;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly config: AppConfig,
    private readonly store: FileStore,
    private readonly logger: Logger,
    /** Called after a job ends (done or failed) in this process. */
    private readonly onFinished: (revisionId: number) => void = () => {},
  ) {
    this.pools = new ImportPools({ maxThreads: config.imports.workers, memoryLimitMb: config.imports.memoryLimitMb });
  }

  start(): void {
    if (this.config.imports.workers === 0) return;
    this.timer = setInterval(() => this.kick(), this.config.imports.pollMs);
    this.kick();
  }

  /** Looks for work now (called after an upload, so jobs start without waiting for the poll). */
  kick(): void {
    if (this.stopping || this.ticking || this.config.imports.workers === 0) return;
    this.ticking = true;
    void this.fill()
      .catch((err) => this.logger.warn(`import runner: ${(err as Error).message}`))
      .finally(() => (this.ticking = false));
  }

  private async fill(): Promise<void> {
    while (!this.stopping && this.active.size < this.config.imports.workers) {
      const job = await claimNextJob(this.owner, this.config.imports.staleMs, this.config.imports.maxAttempts);
      if (!job) return;
      const run = this.runJob(job).finally(() => {
        this.active.delete(run);
        if (!this.stopping) this.onFinished(job.id);
        this.kick();
      });
      this.active.add(run);
    }
  }

  private async runJob(job: RevisionModel): Promise<void> {
    const beat = setInterval(() => void heartbeat(job.id, this.owner).catch(() => undefined), Math.max(1000, this.config.imports.staleMs / 4));
    const channel = new MessageChannel();
    const slices = new MemberSliceStream(channel.port1);
    // The limit runs from the task's first message, its first step in the thread (task-clock.ts).
    const clock = new TaskClock(this.config.imports.timeLimitMs, THREAD_START_ALLOWANCE_MS);
    let lastReport = 0;
    let lastStatus = '';
    channel.port1.on('message', (m: ProgressMessage) => {
      clock.begin();
      if (slices.take(m)) return;
      const now = Date.now();
      if (m.status === lastStatus && now - lastReport < 300) return;
      lastStatus = m.status;
      lastReport = now;
      void reportProgress(job.id, this.owner, m.status, m.progress).catch(() => undefined);
    });
    let local: { path: string; release(): Promise<void> } | undefined;
    try {
      const model = await IfcModelModel.findByPk(job.modelId);
      const project = model ? await ProjectModel.findByPk(model.projectId) : null;
      if (!project) throw new Error('the project of this revision no longer exists');
      const forceRows = job.forcesStorageKey ? await this.readForcesFile(job.forcesStorageKey) : undefined;
      if (forceRows && 'failure' in forceRows) {
        await failJob(job.id, this.owner, 'forces.rejected', forceRows.failure);
        return;
      }
      local = await this.store.fetchToLocal(job.storageKey);
      const kind = fileKind(job);
      const task: ImportTask & { job: 'import-for-store' } = {
        job: 'import-for-store',
        filePath: local.path,
        kind,
        standard: job.standard as StandardId,
        defaultGrade: project.defaultGrade,
        inflateLimitBytes: this.config.uploads.archiveInflateLimitBytes,
        progressPort: channel.port2,
        forceRows,
      };
      // Checked members arrive in slices on the task's port and are stored while the worker
      // checks the rest (streamed-import-task.ts); the summary is the task's result.
      const stop = new AbortController();
      const outcome = this.pools.run<StreamedImportOutcome>(importPoolFor(job.fileSize, kind), task, {
        transferList: [channel.port2] as never,
        signal: AbortSignal.any([clock.signal, stop.signal]),
      });
      outcome.then((o) => !o.ok && slices.fail(new TaskFailed(o.failure)), (err) => slices.fail(err));
      let kept: boolean;
      try {
        kept = await storeStreamed(this.sequelize, job.id, this.owner, job.standard, slices, async () => {
          const o = await outcome;
          if (!o.ok) throw new TaskFailed(o.failure);
          return o.summary;
        });
      } catch (err) {
        // A store that failed stops the worker too; a task that failed has rolled the store back.
        stop.abort();
        await outcome.catch(() => undefined);
        if (!(err instanceof TaskFailed)) throw err;
        await failJob(job.id, this.owner, err.failure.id, err.failure.message);
        return;
      }
      if (!kept) this.logger.warn(`import ${job.id}: another process took the job over; this result was dropped`);
      else {
        this.track(this.buildGeometry(job));
        this.track(this.prepareReadCopies(job.id));
      }
    } catch (err) {
      // While shutting down, leave the job claimed: its heartbeat goes stale and a running process takes it over.
      if (this.stopping) return;
      const e = err as Error & { name?: string; code?: string };
      if (clock.expired === 'not-begun') {
        await failJob(job.id, this.owner, 'import.worker-lost', `The import could not start: no import thread was ready within ${THREAD_START_ALLOWANCE_MS / 1000} s. Try again; if it happens again, the server needs attention.`);
      } else if (clock.expired === 'limit') {
        await failJob(job.id, this.owner, 'import.time-limit', `The import took longer than the ${Math.round(this.config.imports.timeLimitMs / 1000)} s limit and was stopped. The file may be malformed; try exporting it again.`);
      } else if (/ERR_WORKER_OUT_OF_MEMORY|out of memory/i.test(`${e?.code} ${e?.message}`)) {
        await failJob(job.id, this.owner, 'import.memory-limit', `The import needed more memory than the ${this.config.imports.memoryLimitMb} MB limit and was stopped.`);
      } else {
        this.logger.error(`import ${job.id} failed`, err);
        await failJob(job.id, this.owner, 'import.worker-lost', `The import stopped unexpectedly (${e?.message ?? 'unknown error'}).`);
      }
    } finally {
      clearInterval(beat);
      clock.dispose();
      channel.port1.close();
      await local?.release().catch(() => undefined);
    }
  }

  /**
   * Builds and stores the 3D view's geometry after the results are stored. It takes a
   * worker slot like a job; a failure only marks the view as unavailable.
   */
  private async buildGeometry(job: RevisionModel): Promise<void> {
    let local: { path: string; release(): Promise<void> } | undefined;
    let status: 'ready' | 'failed' = 'failed';
    let problem: string | null = null;
    const tmp = path.join(tmpdir(), `gaugeline-geometry-${job.id}-${randomBytes(4).toString('hex')}.bin`);
    try {
      local = await this.store.fetchToLocal(job.storageKey);
      const kind = fileKind(job);
      const task: GeometryTask = {
        job: 'geometry',
        filePath: local.path,
        kind,
        inflateLimitBytes: this.config.uploads.archiveInflateLimitBytes,
        timeBudgetMs: Math.max(1000, this.config.imports.timeLimitMs - 30_000),
      };
      const out = await this.pools.run<GeometryOutcome>(importPoolFor(job.fileSize, kind), task, { signal: AbortSignal.timeout(this.config.imports.timeLimitMs) });
      problem = out.problem;
      if (out.geometry) {
        // The gzipped copy first: once the plain file exists the view may be served, and then in either form.
        if (out.gzipped) {
          await fsp.writeFile(tmp, out.gzipped);
          await this.store.put(geometryGzipKey(job.id), tmp);
        }
        await fsp.writeFile(tmp, out.geometry);
        await this.store.put(geometryKey(job.id), tmp);
        status = 'ready';
      }
    } catch (err) {
      if (this.stopping) return;
      problem = (err as Error).message;
    } finally {
      await fsp.rm(tmp, { force: true }).catch(() => undefined);
      await local?.release().catch(() => undefined);
    }
    await this.recordGeometry(job.id, status, problem).catch((err) => this.logger.warn(`import ${job.id}: ${(err as Error).message}`));
  }

  /**
   * Builds the 3D view's member columns and this process's copy of the member table now,
   * so the first view and the first table page after an import find them ready.
   */
  private async prepareReadCopies(revisionId: number): Promise<void> {
    try {
      const revision = await RevisionModel.findByPk(revisionId, { attributes: ['id', 'resultsVersion'] });
      if (revision) await Promise.all([memberColumnsOf(revision), prepareMemberTable(revision.id, revision.resultsVersion)]);
    } catch (err) {
      this.logger.warn(`import ${revisionId}: member table and columns not prepared (${(err as Error).message}); they are built on first use`);
    }
  }

  private async recordGeometry(revisionId: number, status: 'ready' | 'failed', problem: string | null): Promise<void> {
    const revision = await RevisionModel.findByPk(revisionId);
    if (!revision?.summary) return;
    const summary = { ...(revision.summary as RevisionSummary), geometry: status };
    if (problem) {
      const partial = status === 'ready';
      summary.warnings = [
        ...summary.warnings,
        {
          code: partial ? 'geometry.partial' : 'geometry.failed',
          message: partial ? 'The 3D view of this revision shows only part of the model (preparing it took too long); results are not affected.' : 'The 3D view of this revision could not be prepared; results are not affected.',
          count: 1,
          examples: [problem.slice(0, 200)],
        },
      ];
    }
    await revision.update({ summary });
  }

  /** Keeps a background piece of work in the running set, so the slot count and stop() see it. */
  private track(work: Promise<void>): void {
    const run = work.finally(() => {
      this.active.delete(run);
      this.kick();
    });
    this.active.add(run);
  }

  /** The rows of a forces table stored with the upload, or the reason it cannot be used. */
  private async readForcesFile(key: string): Promise<ForceRow[] | { failure: string }> {
    const local = await this.store.fetchToLocal(key);
    try {
      const parsed = parseForcesCsv(await readFile(local.path, 'utf8'));
      if (!parsed.problems.length) return parsed.rows;
      const first = parsed.problems[0];
      return { failure: `The forces table was not applied: line ${first.line}: ${first.message}${parsed.problems.length > 1 ? ` (and ${parsed.problems.length - 1} more)` : ''}.` };
    } finally {
      await local.release();
    }
  }

  /** Stops taking jobs; running ones are abandoned to be taken over after a restart. */
  async stop(): Promise<void> {
    this.stopping = true;
    if (this.timer) clearInterval(this.timer);
    await this.pools.destroy();
    await Promise.allSettled([...this.active]);
  }

  /** Waits until no job is running here (tests). */
  async idle(): Promise<void> {
    while (this.active.size) await Promise.allSettled([...this.active]);
  }
}

function fileKind(job: RevisionModel): 'ifc' | 'ifczip' {
  return job.storageKey.endsWith('.ifczip') ? 'ifczip' : 'ifc';
}

/** An import task that ended with a failure a person should read (not a crash). */
class TaskFailed extends Error {
  constructor(readonly failure: FailureData) {
    super(failure.message);
  }
}
