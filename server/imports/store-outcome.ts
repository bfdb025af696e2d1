import { Op, QueryTypes, literal, type Sequelize, type Transaction } from 'sequelize';
import type { RevisionSummary } from '@shared/api/models';
import { MemberModel } from '../db/models/member';
import { RevisionModel } from '../db/models/revision';
import { ENGINE_VERSION } from './engine-version';
import { batchInsert } from '../db/batch-insert';
import { SLICE_SIZE, type StorableMember } from './member-slices';

const MEMBER_COLUMNS = [
  'revision_id', 'global_id', 'name', 'tag', 'ifc_class', 'storey', 'assembly', 'profile_name', 'grade_name',
  'length_mm', 'is_tension', 'inclusion', 'hole_count', 'design_force_n', 'force_source', 'net_area_mm2', 'design_capacity_n', 'utilisation',
  'governing', 'band', 'warning_count', 'detail', 'created_at', 'updated_at',
] as const;

/**
 * Writes a finished import in one transaction: members, forces, check results and the
 * revision's state. If another process has taken the job over meanwhile, nothing is kept.
 */
export async function storeOutcome(
  sequelize: Sequelize,
  revisionId: number,
  owner: string,
  standard: string,
  summary: RevisionSummary,
  members: StorableMember[],
): Promise<boolean> {
  async function* slices() {
    for (let i = 0; i < members.length; i += SLICE_SIZE) yield members.slice(i, i + SLICE_SIZE);
  }
  return storeStreamed(sequelize, revisionId, owner, standard, slices(), async () => summary);
}

/**
 * The same, with members arriving in slices while the worker still checks the rest: the
 * transaction opens with the first slice (or the end), each slice is written as it comes,
 * and the revision is marked done with the summary once the slices end. If the slices or
 * the summary fail, everything written is rolled back and the error passes on.
 */
export async function storeStreamed(
  sequelize: Sequelize,
  revisionId: number,
  owner: string,
  standard: string,
  slices: AsyncIterable<StorableMember[]>,
  summary: () => Promise<RevisionSummary>,
): Promise<boolean> {
  const iterator = slices[Symbol.asyncIterator]();
  // No transaction is held open while the worker is still reading the model.
  const first = await iterator.next();
  return sequelize.transaction(async (transaction) => {
    // A retried job may have left nothing (writes are atomic), but be sure. Look before deleting:
    // a DELETE locks the index gap where this revision's rows would go even when there are none,
    // and two imports storing at once (two app processes) then deadlocked on their inserts into
    // that gap. A plain read locks nothing.
    if (await MemberModel.findOne({ where: { revisionId }, attributes: ['id'], transaction })) {
      await MemberModel.destroy({ where: { revisionId }, transaction });
    }
    // Checking the members' key to their revision would hold a shared lock on the revision's
    // row until commit, and the job's progress and heartbeat updates of that row would wait
    // (holding pool connections) for as long as slices keep coming. The revision is the one
    // this process has claimed, so the check is left out for these inserts, and only them; if
    // the revision went meanwhile, the claim check at the end fails and nothing is kept.
    // MariaDB's JSON columns carry a JSON_VALID check; the detail and result texts are the
    // worker's JSON.stringify output, and validating them again took about half of MariaDB's
    // CPU for these inserts (20,000 members: 1.6–2.0 s → 0.9–1.1 s). Off for them too.
    await sequelize.query('SET SESSION foreign_key_checks = 0, check_constraint_checks = 0', { transaction });
    let lastId = 0;
    try {
      for (let slice = first; !slice.done; slice = await iterator.next()) lastId = await writeSlice(transaction, revisionId, standard, slice.value, lastId);
    } finally {
      await sequelize.query('SET SESSION foreign_key_checks = 1, check_constraint_checks = 1', { transaction });
    }
    const s = await summary();
    const [affected] = await RevisionModel.update(
      // The results version moves so that a retried job's rows replace any copy held in memory.
      { resultsVersion: literal('results_version + 1'), status: 'done', progress: 1, summary: s, schemaName: s.schema, finishedAt: new Date(), heartbeatAt: new Date() },
      { where: { id: revisionId, claimedBy: owner, status: { [Op.notIn]: ['done', 'failed'] } }, transaction },
    );
    if (affected !== 1) throw new LostClaimError();
    return true;
  }).catch(async (err) => {
    // Let a producer that is still running finish (a generator's finally, a worker's port).
    await iterator.return?.();
    if (err instanceof LostClaimError) return false;
    throw err;
  });
}

/** Members of one slice, then their forces and results (by the ids just given). Returns the highest member id so far. */
async function writeSlice(transaction: Transaction, revisionId: number, standard: string, members: StorableMember[], lastId: number): Promise<number> {
  const now = new Date();
  // The driver's bulk protocol: no model instance per row and no SQL text to escape.
  await batchInsert(transaction, 'members', MEMBER_COLUMNS, members.map((m) => [
    revisionId, m.globalId, m.name?.slice(0, 255) ?? null, m.tag?.slice(0, 120) ?? null, m.ifcClass,
    m.storey?.slice(0, 160) ?? null, m.assembly?.slice(0, 160) ?? null, m.profileName?.slice(0, 120) ?? null, m.gradeName?.slice(0, 120) ?? null,
    m.lengthMm, m.isTension, 'auto', m.holeCount, m.designForceN, m.forceSource, m.netAreaMm2, m.designCapacityN, m.utilisation,
    m.governing, m.band, m.warningCount, m.detailJson, now, now,
  ]));
  // This transaction is the only writer of the revision's members, so the new rows are those above the last id seen.
  const rows = await MemberModel.sequelize!.query<{ id: number; globalId: string }>(
    'SELECT id, global_id AS globalId FROM members WHERE revision_id = ? AND id > ?',
    { replacements: [revisionId, lastId], type: QueryTypes.SELECT, transaction },
  );
  const idOf = new Map(rows.map((r) => [r.globalId, r.id]));
  // Both go to the connection at once: the driver sends the second while MariaDB writes the
  // first, so this thread prepares the results' 4 MB while MariaDB stores the forces.
  await Promise.all([
    batchInsert(transaction, 'member_forces', ['member_id', 'load_case', 'axial_n', 'source', 'created_at'],
      members.flatMap((m) => m.forces.map((f) => [idOf.get(m.globalId)!, f.loadCase.slice(0, 120), f.axialN, f.source, now]))),
    batchInsert(transaction, 'check_results', ['member_id', 'standard', 'engine_version', 'result', 'created_at'],
      members.filter((m) => m.resultJson).map((m) => [idOf.get(m.globalId)!, standard, ENGINE_VERSION, m.resultJson, now])),
  ]);
  return rows.reduce((max, r) => Math.max(max, r.id), lastId);
}

class LostClaimError extends Error {}
