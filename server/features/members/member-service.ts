import { fn, col, QueryTypes, type WhereOptions } from 'sequelize';
import type { z } from 'zod';
import type { memberQuerySchema, MemberPage } from '@shared/api/members';
import type { MemberSheet, RevisionOverview } from '@shared/api/member-sheet';
import type { MemberDetail } from '@shared/api/member-detail';
import { RESULT_BANDS, type ResultBand } from '@shared/api/results';
import { CAUTIONS } from '@shared/api/cautions';
import { MemberModel } from '../../db/models/member';
import type { RevisionModel } from '../../db/models/revision';
import { errors } from '../../http/errors';
import { memberWhere } from './member-query';
import { cachedMemberPage } from './member-table-cache';
import { presentMemberRow } from './member-presenter';

const ROW_ATTRIBUTES = { exclude: ['detail'] };

/** One page of the member table, served from the revision's in-memory copy (member-table-cache.ts). */
export async function listMembers(revision: Pick<RevisionModel, 'id' | 'resultsVersion'>, q: z.output<typeof memberQuerySchema>): Promise<MemberPage> {
  return cachedMemberPage(revision.id, revision.resultsVersion, q);
}

export async function findMember(revisionId: number, globalId: string): Promise<MemberModel> {
  const member = await MemberModel.findOne({ where: { revisionId, globalId } });
  if (!member) throw errors.notFound('That member');
  return member;
}

/** Member columns as attribute names, for the sheet's one-query read below. */
let memberSelect: string | undefined;
const MEMBER_SELECT = () =>
  (memberSelect ??= Object.entries(MemberModel.getAttributes() as Record<string, { field?: string }>)
    .map(([name, a]) => `m.\`${a.field ?? name}\` AS \`${name}\``)
    .join(', '));

const parseJson = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v);

/**
 * The member sheet in two queries run side by side: the member with its stored result
 * (one join), and its forces. The sheet is the busiest read after the table.
 */
export async function memberSheet(revision: Pick<RevisionModel, 'id' | 'number' | 'standard' | 'fileName'>, globalId: string): Promise<MemberSheet> {
  const sequelize = MemberModel.sequelize!;
  const [rows, forces] = await Promise.all([
    sequelize.query<Record<string, unknown>>(
      `SELECT ${MEMBER_SELECT()}, cr.result AS resultJson, cr.engine_version AS engineVersion FROM members m
       LEFT JOIN check_results cr ON cr.member_id = m.id AND cr.standard = :standard
       WHERE m.revision_id = :revisionId AND m.global_id = :globalId LIMIT 1`,
      { replacements: { standard: revision.standard, revisionId: revision.id, globalId }, type: QueryTypes.SELECT },
    ),
    sequelize.query<{ loadCase: string; axialN: number; source: string }>(
      `SELECT f.load_case AS loadCase, f.axial_n AS axialN, f.source FROM member_forces f JOIN members m ON m.id = f.member_id
       WHERE m.revision_id = :revisionId AND m.global_id = :globalId ORDER BY f.source ASC, f.load_case ASC`,
      { replacements: { revisionId: revision.id, globalId }, type: QueryTypes.SELECT },
    ),
  ]);
  const row = rows[0];
  if (!row) throw errors.notFound('That member');
  const member = MemberModel.build({ ...row, isTension: Boolean(row.isTension), detail: parseJson(row.detail) } as never, { raw: true, isNewRecord: false });
  return {
    revision: { id: revision.id, number: revision.number, standard: revision.standard, fileName: revision.fileName },
    member: presentMemberRow(member),
    detail: member.detail as MemberDetail,
    forces: forces.map((f) => ({ loadCase: f.loadCase, axialN: f.axialN, source: f.source })),
    result: row.resultJson == null ? null : (parseJson(row.resultJson) as MemberSheet['result']),
    engineVersion: (row.engineVersion as string | null) ?? null,
    cautions: CAUTIONS,
  };
}

/** Counts per band, a utilisation histogram and the most critical members of the tension scope. */
export async function revisionOverview(revisionId: number): Promise<RevisionOverview> {
  const where = memberWhere(revisionId, { scope: 'tension' } as z.output<typeof memberQuerySchema>) as WhereOptions;
  const bandRows = (await MemberModel.findAll({ where, attributes: ['band', [fn('COUNT', col('id')), 'n']], group: ['band'], raw: true })) as unknown as { band: ResultBand; n: number }[];
  const bands = Object.fromEntries(RESULT_BANDS.map((b) => [b, 0])) as Record<ResultBand, number>;
  for (const r of bandRows) bands[r.band] = Number(r.n);
  const utils = (await MemberModel.findAll({ where, attributes: ['utilisation'], raw: true })) as unknown as { utilisation: number | null }[];
  const histogram: RevisionOverview['histogram'] = [];
  for (let i = 0; i < 15; i++) histogram.push({ from: i / 10, to: (i + 1) / 10, count: 0 });
  histogram.push({ from: 1.5, to: null, count: 0 });
  for (const { utilisation: u } of utils) {
    if (u == null) continue;
    histogram[Math.min(15, Math.max(0, Math.floor(u * 10 + 1e-9)))].count++;
  }
  const critical = await MemberModel.findAll({ where, order: [[col('utilisation'), 'DESC']], limit: 10, attributes: ROW_ATTRIBUTES });
  return {
    total: Object.values(bands).reduce((a, b) => a + b, 0),
    bands,
    histogram,
    critical: critical.filter((m) => m.utilisation != null).map(presentMemberRow),
  };
}
