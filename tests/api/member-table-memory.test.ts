// The member table is served from an in-memory copy per revision (member-table-cache.ts).
// These tests hold it to the SQL it replaced, query by query, and prove that a change made
// through another app process sharing the database is seen at once.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memberQuerySchema, MEMBER_SORT_KEYS, type MemberQuery } from '../../shared/api/members';
import { MemberModel } from '../../server/db/models/member';
import { MemberForceModel } from '../../server/db/models/member-force';
import { CheckResultModel } from '../../server/db/models/check-result';
import { checkMemberRaw, type MemberCheckInputRaw } from '../../shared/engine';
import type { MemberDetail } from '../../shared/api/member-detail';
import { memberOrder, memberWhere } from '../../server/features/members/member-query';
import { presentMemberRow } from '../../server/features/members/member-presenter';
import type { TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { appWithSample } from '../support/imports';
import { sharedEnvOf, spawnApp, type AppProcess } from '../support/spawn-app';

let app: TestApp;
let other: AppProcess | undefined;
let engineer: Caller;
let revisionId: number;
let base: string;

beforeAll(async () => {
  ({ app, engineer, revisionId, base } = await appWithSample());
}, 120_000);
afterAll(async () => {
  await other?.stop();
  await app?.stop();
});

/** The answer the SQL query gives for the same parameters (the behaviour before the copy in memory). */
async function bySql(query: MemberQuery) {
  const q = memberQuerySchema.parse(query);
  const { rows, count } = await MemberModel.findAndCountAll({
    where: memberWhere(revisionId, q), order: memberOrder(q), limit: q.pageSize, offset: (q.page - 1) * q.pageSize, attributes: { exclude: ['detail'] },
  });
  return { total: count, page: q.page, pageSize: q.pageSize, members: rows.map(presentMemberRow) };
}

const asParams = (q: MemberQuery) => new URLSearchParams(Object.entries(q).map(([k, v]) => [k, String(v)])).toString();

describe('member table held in memory', () => {
  it('answers every sort key, direction and filter exactly as the SQL query did', async () => {
    const all = (await engineer.call('get', `${base}/members?scope=all&pageSize=500`)).body.members as { name: string | null; profile: string | null; storey: string | null; ifcClass: string; globalId: string }[];
    expect(all.length).toBeGreaterThan(10);
    const named = all.find((m) => m.name)!;
    const profiled = all.find((m) => m.profile)!;
    const queries: MemberQuery[] = [];
    for (const sort of MEMBER_SORT_KEYS) for (const dir of ['asc', 'desc'] as const) queries.push({ sort, dir, scope: 'all', pageSize: 500 }, { sort, dir, pageSize: 7, page: 2 });
    queries.push(
      { band: 'spare,working' }, { band: 'unknown', scope: 'all' }, { minUtilisation: 0.5 }, { minUtilisation: 0 },
      { ifcClass: named.ifcClass.toUpperCase(), scope: 'all' }, { profile: profiled.profile!, scope: 'all' },
      { storey: all.find((m) => m.storey)?.storey ?? 'none', scope: 'all' }, { storey: '', scope: 'all' },
      // Case-insensitive search over GlobalId, tag, name and profile, and LIKE's wildcards taken literally.
      { q: named.name!.slice(0, 4).toUpperCase(), scope: 'all' }, { q: named.globalId.slice(3, 12) }, { q: '%' }, { q: '_' }, { q: 'zzz-no-such' },
      { ids: all.slice(0, 5).map((m) => m.globalId).join(','), scope: 'all' },
      { page: 999, pageSize: 10 },
    );
    for (const q of queries) {
      const res = await engineer.call('get', `${base}/members?${asParams(q)}`);
      expect(res.status, JSON.stringify(q)).toBe(200);
      expect(res.body, JSON.stringify(q)).toEqual(await bySql(q));
    }
  }, 120_000);

  it('reads the member sheet in one join with the same content as reading each table', async () => {
    const all = (await engineer.call('get', `${base}/members?scope=all&pageSize=500`)).body.members as { globalId: string; utilisation: number | null }[];
    const picks = [all.find((m) => m.utilisation != null)!, all.find((m) => m.utilisation == null)!, all.at(-1)!];
    for (const pick of picks) {
      const sheet = (await engineer.call('get', `${base}/members/${pick.globalId}`)).body;
      const member = (await MemberModel.findOne({ where: { revisionId, globalId: pick.globalId } }))!;
      const forces = await MemberForceModel.findAll({ where: { memberId: member.id }, order: [['source', 'ASC'], ['loadCase', 'ASC']] });
      const result = await CheckResultModel.findOne({ where: { memberId: member.id, standard: sheet.revision.standard } });
      expect(sheet.member).toEqual(presentMemberRow(member));
      expect(sheet.detail).toEqual(member.detail);
      expect(sheet.forces).toEqual(forces.map((f) => ({ loadCase: f.loadCase, axialN: f.axialN, source: f.source })));
      // The stored capacity with the member's force is what the engine answers for the member's stored input.
      const input = (member.detail as MemberDetail).checkInput;
      expect(sheet.result).toEqual(input && result ? JSON.parse(JSON.stringify(checkMemberRaw(input as MemberCheckInputRaw))) : null);
      expect(input && result ? (input as MemberCheckInputRaw).force : null).toBe(input && result ? member.designForceN : null);
      expect(sheet.engineVersion).toBe(result?.engineVersion ?? null);
    }
    expect((await engineer.call('get', `${base}/members/${'A'.repeat(22)}`)).status).toBe(404);
  });

  it('shows a change made through another app process at the next request', async () => {
    other = await spawnApp(sharedEnvOf(app.server.config));
    const viaOther = await signIn(other.url, DEMO.engineer);
    const first = (await viaOther.call('get', `${base}/members?pageSize=500`)).body;
    const target = first.members.find((m: { utilisation: number | null }) => m.utilisation != null);
    // This process now holds the table in memory; change a member through the other one.
    const changed = await engineer.call('patch', `${base}/members/${target.globalId}/overrides`, { designForceN: target.designForceN * 2, reason: 'revised load from the second analysis run' });
    expect(changed.status).toBe(200);
    const again = (await viaOther.call('get', `${base}/members?pageSize=500`)).body;
    const after = again.members.find((m: { globalId: string }) => m.globalId === target.globalId);
    expect(after.designForceN).toBeCloseTo(target.designForceN * 2, 6);
    expect(after.utilisation).toBeCloseTo(changed.body.utilisation, 9);
    expect(after.utilisation).toBeGreaterThan(target.utilisation);
  }, 120_000);
});
