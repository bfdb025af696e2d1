import { Op, literal } from 'sequelize';
import { hostname } from 'node:os';
import { RevisionModel } from '../db/models/revision';
import type { JobStatus } from '@shared/api/models';

const WORKING: JobStatus[] = ['reading', 'extracting', 'checking'];

/**
 * Claims one job for this process: a queued one, or one whose owner stopped
 * heart-beating (a crash or restart). The claim is a conditional UPDATE, so when
 * several app processes share the database exactly one of them wins each job.
 */
export async function claimNextJob(owner: string, staleMs: number, maxAttempts: number): Promise<RevisionModel | null> {
  const staleBefore = new Date(Date.now() - staleMs);
  const host = hostname();
  const candidates = await RevisionModel.findAll({
    where: {
      [Op.or]: [
        { status: 'queued' },
        { status: WORKING, heartbeatAt: { [Op.lt]: staleBefore } },
        // Same machine: a job whose process is gone can be taken at once, without waiting for staleness.
        { status: WORKING, claimedBy: { [Op.like]: `${host}:%` } },
      ],
    },
    order: [['id', 'ASC']],
    limit: 5,
    attributes: ['id', 'status', 'attempts', 'claimedBy', 'heartbeatAt'],
  });
  for (const c of candidates) {
    const orphaned = c.status !== 'queued' && isDeadLocalOwner(c.claimedBy, host, owner);
    const stale = c.status !== 'queued' && c.heartbeatAt !== null && c.heartbeatAt < staleBefore;
    if (c.status !== 'queued' && !orphaned && !stale) continue;
    if (c.attempts >= maxAttempts) {
      await failJob(c.id, c.claimedBy, 'import.gave-up', `The import stopped ${c.attempts} time(s) without finishing (the server restarted or the worker was lost), so it was not tried again. Upload the file again to retry.`, true);
      continue;
    }
    const [affected] = await RevisionModel.update(
      { claimedBy: owner, heartbeatAt: new Date(), status: 'reading', progress: 0, attempts: literal('attempts + 1') as unknown as number, startedAt: new Date() },
      {
        where: {
          id: c.id,
          status: c.status,
          ...(c.status === 'queued' ? {} : { claimedBy: c.claimedBy }),
          attempts: c.attempts,
        },
      },
    );
    if (affected === 1) return RevisionModel.findByPk(c.id);
  }
  return null;
}

/** Owners are "host:pid:nonce"; on this host a pid that no longer runs means the job was orphaned. */
function isDeadLocalOwner(claimedBy: string | null, host: string, self: string): boolean {
  if (!claimedBy || claimedBy === self || !claimedBy.startsWith(`${host}:`)) return false;
  const pid = Number(claimedBy.split(':')[1]);
  if (!Number.isInteger(pid) || pid <= 0) return false;
  if (pid === process.pid) return false; // another runner in this same process (tests) is alive
  try {
    process.kill(pid, 0);
    return false;
  } catch {
    return true;
  }
}

/** Moves a claimed job on; refuses silently when another process has taken it over. */
export async function reportProgress(id: number, owner: string, status: JobStatus, progress: number): Promise<boolean> {
  const [affected] = await RevisionModel.update(
    { status, progress: Math.max(0, Math.min(1, progress)), heartbeatAt: new Date() },
    { where: { id, claimedBy: owner, status: { [Op.notIn]: ['done', 'failed'] } } },
  );
  return affected === 1;
}

export async function heartbeat(id: number, owner: string): Promise<void> {
  await RevisionModel.update({ heartbeatAt: new Date() }, { where: { id, claimedBy: owner, status: { [Op.notIn]: ['done', 'failed'] } } });
}

export async function failJob(id: number, owner: string | null, failureId: string, message: string, anyOwner = false): Promise<void> {
  await RevisionModel.update(
    { status: 'failed', failureId, failureMessage: message, finishedAt: new Date(), heartbeatAt: new Date() },
    { where: { id, ...(anyOwner ? {} : { claimedBy: owner }), status: { [Op.notIn]: ['done', 'failed'] } } },
  );
}
