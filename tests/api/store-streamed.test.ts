// Storing an import's members as they arrive in slices: all or nothing, the claim respected,
// and the connection handed back to the pool as it was taken (key and constraint checks on).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO } from '../support/api-client';
import { waitFor } from '../support/wait-for';
import { MemberModel } from '../../server/db/models/member';
import { RevisionModel } from '../../server/db/models/revision';
import { storeStreamed } from '../../server/imports/store-outcome';
import type { StorableMember, StorableSlice } from '../../server/imports/member-slices';
import type { RevisionSummary } from '../../shared/api/models';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));
const OWNER = 'store-streamed-test';

let app: TestApp;
let revisionId: number;
let summary: RevisionSummary;

// Storage rows only: the values are not engineering data and nothing here checks them as such.
function member(i: number): StorableMember {
  return {
    globalId: `0StoreTest${String(i).padStart(12, '0')}`, name: `slice member ${i}`, tag: null, ifcClass: 'IfcMember', storey: null, assembly: null,
    profileName: 'FL100x10', gradeName: null, lengthMm: 1000, isTension: true, holeCount: 0, designForceN: 1000 * i, forceSource: 'manual',
    netAreaMm2: 1000, designCapacityN: 200_000, utilisation: (1000 * i) / 200_000, governing: 'yield', band: 'spare', warningCount: 0,
    forces: [{ loadCase: 'LC1', axialN: 1000 * i, source: 'manual' }], detailJson: JSON.stringify({ i }), capacityKey: capacityKeyOf(i),
  } as StorableMember;
}

/** Members share seven capacities; a slice hands over those no earlier slice did. */
const capacityKeyOf = (i: number) => (i * 5) % 7;

async function* slicesOf(count: number, size: number, failAfter?: number): AsyncGenerator<StorableSlice> {
  const sent = new Set<number>();
  for (let i = 0, n = 0; i < count; i += size, n++) {
    if (failAfter !== undefined && n === failAfter) throw new Error('worker lost');
    const members = Array.from({ length: Math.min(size, count - i) }, (_, k) => member(i + k));
    const keys = [...new Set(members.map((m) => m.capacityKey!))].filter((k) => !sent.has(k));
    keys.forEach((k) => sent.add(k));
    yield { members, capacities: keys.map((key) => ({ key, bodyJson: JSON.stringify({ key }) })) };
  }
}

const sql = <T extends object>(query: string, replacements: unknown[] = []) => MemberModel.sequelize!.query<T>(query, { replacements, type: QueryTypes.SELECT });
const counts = async () => (await sql<{ members: number; forces: number; results: number; capacities: number }>(
  `SELECT (SELECT COUNT(*) FROM members WHERE revision_id = ?) AS members,
          (SELECT COUNT(*) FROM member_forces f JOIN members m ON m.id = f.member_id WHERE m.revision_id = ?) AS forces,
          (SELECT COUNT(*) FROM check_results r JOIN members m ON m.id = r.member_id WHERE m.revision_id = ?) AS results,
          (SELECT COUNT(*) FROM check_capacities c WHERE c.revision_id = ?) AS capacities`,
  [revisionId, revisionId, revisionId, revisionId],
))[0];

/** The revision back in the state of a job this test owns, with no members. */
async function reclaim(owner = OWNER) {
  await MemberModel.destroy({ where: { revisionId } });
  await MemberModel.sequelize!.query('DELETE FROM check_capacities WHERE revision_id = ?', { replacements: [revisionId] });
  await RevisionModel.update({ status: 'checking', claimedBy: owner }, { where: { id: revisionId } });
}

beforeAll(async () => {
  // One pooled connection: every statement below runs on the connection the store used.
  app = await startTestApp({ IMPORT_POLL_MS: '100', DB_POOL_MAX: '1' });
  const engineer = await signIn(app.url, DEMO.engineer);
  const projectId = (await engineer.call('get', '/api/projects')).body.projects[0].id;
  const up = await engineer.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', engineer.csrf).attach('file', SAMPLE, 'kestrel-yard-shed.ifc');
  const done = await waitFor(() => engineer.call('get', `/api/projects/${projectId}/revisions/${up.body.revision.id}`), (r) => ['done', 'failed'].includes(r.body.status), 90_000);
  expect(done.body.status).toBe('done');
  revisionId = up.body.revision.id;
  summary = (await RevisionModel.findByPk(revisionId))!.summary as RevisionSummary;
});
afterAll(async () => {
  await app?.stop();
});

describe('storing members in slices', () => {
  it('writes every slice with its forces and results, then marks the revision done', async () => {
    await reclaim();
    const kept = await storeStreamed(MemberModel.sequelize!, revisionId, OWNER, 'as4100', slicesOf(2500, 1000), async () => summary);
    expect(kept).toBe(true);
    expect(await counts()).toEqual({ members: 2500, forces: 2500, results: 2500, capacities: 7 });
    // Forces and results belong to the member with the same GlobalId, across slices.
    const wrong = await sql<{ n: number }>(
      `SELECT COUNT(*) AS n FROM member_forces f JOIN members m ON m.id = f.member_id
       WHERE m.revision_id = ? AND f.axial_n <> 1000 * CAST(SUBSTRING(m.global_id, 11) AS UNSIGNED)`, [revisionId]);
    expect(Number(wrong[0]?.n)).toBe(0);
    // Each result names the capacity its member was given, wherever that capacity was handed over.
    const misplaced = await sql<{ n: number }>(
      `SELECT COUNT(*) AS n FROM check_results r JOIN members m ON m.id = r.member_id JOIN check_capacities c ON c.id = r.capacity_id
       WHERE m.revision_id = ? AND JSON_VALUE(c.body, '$.key') <> MOD(5 * CAST(SUBSTRING(m.global_id, 11) AS UNSIGNED), 7)`, [revisionId]);
    expect(Number(misplaced[0]?.n)).toBe(0);
    expect((await RevisionModel.findByPk(revisionId))!.status).toBe('done');
  });

  it('replaces what an earlier attempt left, capacities included, and links none of it', async () => {
    await reclaim();
    // A leftover capacity under a number the new import uses too, with another body.
    await MemberModel.sequelize!.query(
      'INSERT INTO check_capacities (revision_id, import_key, body, created_at) VALUES (?, 0, ?, NOW())', { replacements: [revisionId, JSON.stringify({ key: 'stale' })] });
    expect(await storeStreamed(MemberModel.sequelize!, revisionId, OWNER, 'as4100', slicesOf(1200, 1000), async () => summary)).toBe(true);
    expect(await counts()).toEqual({ members: 1200, forces: 1200, results: 1200, capacities: 7 });
    const stale = await sql<{ n: number }>("SELECT COUNT(*) AS n FROM check_capacities WHERE revision_id = ? AND JSON_VALUE(body, '$.key') = 'stale'", [revisionId]);
    expect(Number(stale[0]?.n)).toBe(0);
  });

  it('keeps nothing when a result names a capacity that was never handed over', async () => {
    await reclaim();
    async function* missing(): AsyncGenerator<StorableSlice> {
      yield { members: [member(1), member(2)], capacities: [{ key: capacityKeyOf(1), bodyJson: '{}' }] };
    }
    await expect(storeStreamed(MemberModel.sequelize!, revisionId, OWNER, 'as4100', missing(), async () => summary)).rejects.toThrow(/capacity 3 .*before it was handed over/);
    expect(await counts()).toEqual({ members: 0, forces: 0, results: 0, capacities: 0 });
  });

  it('keeps nothing when the slices fail part-way, and passes the error on', async () => {
    await reclaim();
    await expect(storeStreamed(MemberModel.sequelize!, revisionId, OWNER, 'as4100', slicesOf(3000, 1000, 2), async () => summary)).rejects.toThrow('worker lost');
    expect(await counts()).toEqual({ members: 0, forces: 0, results: 0, capacities: 0 });
    expect((await RevisionModel.findByPk(revisionId))!.status).toBe('checking');
  });

  it('keeps nothing when the task fails after its last slice (the summary never comes)', async () => {
    await reclaim();
    await expect(storeStreamed(MemberModel.sequelize!, revisionId, OWNER, 'as4100', slicesOf(1500, 1000), async () => {
      throw new Error('task failed');
    })).rejects.toThrow('task failed');
    expect(await counts()).toEqual({ members: 0, forces: 0, results: 0, capacities: 0 });
  });

  it('keeps nothing once another process holds the claim', async () => {
    await reclaim('another-process');
    expect(await storeStreamed(MemberModel.sequelize!, revisionId, OWNER, 'as4100', slicesOf(1200, 1000), async () => summary)).toBe(false);
    expect(await counts()).toEqual({ members: 0, forces: 0, results: 0, capacities: 0 });
  });

  it('hands its connection back with foreign key and constraint checks on', async () => {
    const [row] = await sql<{ on: number; checks: number }>('SELECT @@SESSION.foreign_key_checks AS `on`, @@SESSION.check_constraint_checks + 0 AS checks');
    expect(Number(row?.on)).toBe(1);
    expect(Number(row?.checks)).toBe(1);
    await expect(MemberModel.sequelize!.query('INSERT INTO member_forces (member_id, load_case, axial_n, source, created_at) VALUES (999999999, ?, 1, ?, NOW())', { replacements: ['LC', 'manual'] }))
      .rejects.toThrow(/foreign key/i);
  });
});
