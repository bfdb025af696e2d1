import { Op, QueryTypes, literal, type Sequelize, type Transaction } from 'sequelize';
import type { RevisionSummary } from '@shared/api/models';
import { CheckCapacityModel } from '../db/models/check-result';
import { MemberModel } from '../db/models/member';
import { RevisionModel } from '../db/models/revision';
import { ENGINE_VERSION } from './engine-version';
import { batchInsert } from '../db/batch-insert';
import type { MemberRecord } from './check-members';
import { SLICE_SIZE, StorableSlices, type StorableSlice } from './member-slices';

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
  members: MemberRecord[],
): Promise<boolean> {
  async function* slices() {
    const storable = new StorableSlices();
    for (let i = 0; i < members.length; i += SLICE_SIZE) yield storable.of(members.slice(i, i + SLICE_SIZE));
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
  slices: AsyncIterable<StorableSlice>,
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
    // Its capacities too: they are found again by revision and number, and old ones would be linked.
    if (await CheckCapacityModel.findOne({ where: { revisionId }, attributes: ['id'], transaction })) {
      await CheckCapacityModel.destroy({ where: { revisionId }, transaction });
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
    const written: Written = { lastMemberId: 0, lastCapacityId: 0, capacityIds: new Map() };
    try {
      for (let slice = first; !slice.done; slice = await iterator.next()) await writeSlice(transaction, revisionId, standard, slice.value, written);
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

/** What the slices written so far left: the highest ids, and each capacity's row by its number in the import. */
interface Written {
  lastMemberId: number;
  lastCapacityId: number;
  capacityIds: Map<number, number>;
}

/** A slice's capacities and members, then the members' forces and results (by the ids just given). */
async function writeSlice(transaction: Transaction, revisionId: number, standard: string, { members, capacities }: StorableSlice, written: Written): Promise<void> {
  const now = new Date();
  const sequelize = MemberModel.sequelize!;
  // This transaction is the only writer of the revision's members and capacities, so the new
  // rows are those above the last ids seen. Both inserts go to the connection at once.
  const [memberRows, capacityRows] = await Promise.all([
    // The driver's bulk protocol: no model instance per row and no SQL text to escape.
    batchInsert(transaction, 'members', MEMBER_COLUMNS, members.map((m) => [
      revisionId, m.globalId, m.name?.slice(0, 255) ?? null, m.tag?.slice(0, 120) ?? null, m.ifcClass,
      m.storey?.slice(0, 160) ?? null, m.assembly?.slice(0, 160) ?? null, m.profileName?.slice(0, 120) ?? null, m.gradeName?.slice(0, 120) ?? null,
      m.lengthMm, m.isTension, 'auto', m.holeCount, m.designForceN, m.forceSource, m.netAreaMm2, m.designCapacityN, m.utilisation,
      m.governing, m.band, m.warningCount, m.detailJson, now, now,
    ])).then(() => sequelize.query<{ id: number; globalId: string }>(
      'SELECT id, global_id AS globalId FROM members WHERE revision_id = ? AND id > ?',
      { replacements: [revisionId, written.lastMemberId], type: QueryTypes.SELECT, transaction },
    )),
    capacities.length
      ? batchInsert(transaction, 'check_capacities', ['revision_id', 'import_key', 'body', 'created_at'], capacities.map((c) => [revisionId, c.key, c.bodyJson, now]))
        .then(() => sequelize.query<{ id: number; importKey: number }>(
          'SELECT id, import_key AS importKey FROM check_capacities WHERE revision_id = ? AND id > ?',
          { replacements: [revisionId, written.lastCapacityId], type: QueryTypes.SELECT, transaction },
        ))
      : Promise.resolve([]),
  ]);
  for (const r of capacityRows) {
    written.capacityIds.set(r.importKey, r.id);
    written.lastCapacityId = Math.max(written.lastCapacityId, r.id);
  }
  const idOf = new Map(memberRows.map((r) => [r.globalId, r.id]));
  written.lastMemberId = memberRows.reduce((max, r) => Math.max(max, r.id), written.lastMemberId);
  const capacityId = (key: number) => {
    const id = written.capacityIds.get(key);
    if (id === undefined) throw new Error(`the import's capacity ${key} was referred to before it was handed over`);
    return id;
  };
  await Promise.all([
    batchInsert(transaction, 'member_forces', ['member_id', 'load_case', 'axial_n', 'source', 'created_at'],
      members.flatMap((m) => m.forces.map((f) => [idOf.get(m.globalId)!, f.loadCase.slice(0, 120), f.axialN, f.source, now]))),
    batchInsert(transaction, 'check_results', ['member_id', 'standard', 'engine_version', 'capacity_id', 'created_at'],
      members.filter((m) => m.capacityKey !== null).map((m) => [idOf.get(m.globalId)!, standard, ENGINE_VERSION, capacityId(m.capacityKey!), now])),
  ]);
}

class LostClaimError extends Error {}
