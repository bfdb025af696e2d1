// Migration 0007 keeps every stored result: results stored whole (before it) become capacities
// of their own, read back through withForce to the same answers; its down puts them back whole.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { TestApp } from '../support/test-app';
import type { Caller } from '../support/api-client';
import { appWithSample } from '../support/imports';
import { MemberModel } from '../../server/db/models/member';
import { createMigrator } from '../../server/db/migrate';

let app: TestApp;
let engineer: Caller;
let base: string;
let revisionId: number;

const sql = <T extends object>(query: string, replacements: unknown[] = []) => MemberModel.sequelize!.query<T>(query, { replacements, type: QueryTypes.SELECT });

/** Every member's sheet of the revision, as the API answers it. */
async function sheets(): Promise<Record<string, unknown>> {
  const ids = (await sql<{ globalId: string }>('SELECT global_id AS globalId FROM members WHERE revision_id = ? ORDER BY id', [revisionId])).map((r) => r.globalId);
  const out: Record<string, unknown> = {};
  for (const id of ids) out[id] = (await engineer.call('get', `${base}/members/${id}`)).body;
  return out;
}

beforeAll(async () => {
  ({ app, engineer, revisionId, base } = await appWithSample());
}, 120_000);
afterAll(async () => {
  await app?.stop();
});

describe('migration 0007 (capacities stored once)', () => {
  it('stores an import as fewer capacities than results', async () => {
    const [n] = await sql<{ results: number; capacities: number }>(
      `SELECT (SELECT COUNT(*) FROM check_results r JOIN members m ON m.id = r.member_id WHERE m.revision_id = ?) AS results,
              (SELECT COUNT(*) FROM check_capacities WHERE revision_id = ?) AS capacities`, [revisionId, revisionId]);
    expect(Number(n!.results)).toBeGreaterThan(0);
    expect(Number(n!.capacities)).toBeLessThan(Number(n!.results));
  });

  it('a re-checked member gets a capacity of its own; one no result names any more goes', async () => {
    const shared = await sql<{ capacityId: number; n: number }>(
      `SELECT r.capacity_id AS capacityId, COUNT(*) AS n FROM check_results r JOIN members m ON m.id = r.member_id
       WHERE m.revision_id = ? GROUP BY r.capacity_id HAVING COUNT(*) > 1 ORDER BY r.capacity_id LIMIT 1`, [revisionId]);
    expect(shared.length).toBe(1);
    const members = await sql<{ globalId: string }>(
      'SELECT m.global_id AS globalId FROM check_results r JOIN members m ON m.id = r.member_id WHERE r.capacity_id = ? ORDER BY m.id', [shared[0]!.capacityId]);
    const capacityOf = async (globalId: string) => (await sql<{ id: number }>(
      'SELECT r.capacity_id AS id FROM check_results r JOIN members m ON m.id = r.member_id WHERE m.revision_id = ? AND m.global_id = ?', [revisionId, globalId]))[0]?.id;
    const exists = async (id: number) => (await sql('SELECT id FROM check_capacities WHERE id = ?', [id])).length === 1;
    const override = (globalId: string) => engineer.call('patch', `${base}/members/${globalId}/overrides`, { fy: 360, fu: 480, reason: 'Mill certificate for the bracing heat' });

    const first = members[0]!.globalId;
    expect((await override(first)).status).toBe(200);
    const own = (await capacityOf(first))!;
    expect(own).not.toBe(shared[0]!.capacityId);
    // The others still name the shared capacity, so it stays.
    expect(await exists(shared[0]!.capacityId)).toBe(true);
    // Re-checked again, the member's previous capacity of its own is no longer named by anyone.
    expect((await engineer.call('patch', `${base}/members/${first}/overrides`, { fy: 370, fu: 490, reason: 'Second certificate' })).status).toBe(200);
    expect(await exists(own)).toBe(false);
    const sheet = (await engineer.call('get', `${base}/members/${first}`)).body;
    expect(sheet.result.assumptions.find((a: { name: string }) => a.name === 'fy')?.value).toBe(370);
  });

  it('down writes each result whole, and up again answers every sheet as before', async () => {
    const before = await sheets();
    const withResult = Object.values(before).filter((s) => (s as { result: unknown }).result !== null);
    expect(withResult.length).toBeGreaterThan(0);
    // Forces reach the results (the sample carries design forces in its property sets).
    expect(withResult.some((s) => (s as { result: { utilisation: number | null } }).result.utilisation !== null)).toBe(true);
    const migrator = createMigrator(MemberModel.sequelize!);
    await migrator.down({ to: '0007-check-capacities' });
    const whole = await sql<{ globalId: string; result: string }>(
      'SELECT m.global_id AS globalId, CAST(r.result AS CHAR) AS result FROM check_results r JOIN members m ON m.id = r.member_id WHERE m.revision_id = ?', [revisionId]);
    expect(whole.length).toBe(withResult.length);
    for (const row of whole) expect(JSON.parse(row.result)).toEqual((before[row.globalId] as { result: unknown }).result);

    await migrator.up();
    // Each whole result became a capacity of its own.
    const [n] = await sql<{ results: number; capacities: number }>(
      `SELECT (SELECT COUNT(*) FROM check_results r JOIN members m ON m.id = r.member_id WHERE m.revision_id = ?) AS results,
              (SELECT COUNT(*) FROM check_capacities WHERE revision_id = ?) AS capacities`, [revisionId, revisionId]);
    expect(Number(n!.capacities)).toBe(Number(n!.results));
    expect(await sheets()).toEqual(before);
  }, 120_000);
});
