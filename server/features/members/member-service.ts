import { fn, col, QueryTypes, type WhereOptions } from 'sequelize';
import type { z } from 'zod';
import type { memberQuerySchema, MemberPage } from '@shared/api/members';
import type { MemberSheet, RevisionOverview } from '@shared/api/member-sheet';
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

/** Member columns as attribute names (the detail JSON left out), for the sheet's one-query read below. */
let memberSelect: string | undefined;
const MEMBER_SELECT = () =>
  (memberSelect ??= Object.entries(MemberModel.getAttributes() as Record<string, { field?: string }>)
    .filter(([name]) => name !== 'detail')
    .map(([name, a]) => `m.\`${a.field ?? name}\` AS \`${name}\``)
    .join(', '));

/**
 * The member sheet as JSON text, in two queries run side by side: the member with its stored
 * result (one join), and its forces. The stored detail and result (about 6 KB per member) are
 * JSON we wrote; they are read as text and placed in the answer as they are, not parsed and
 * written again. The sheet is the busiest read after the table. Shape: MemberSheet.
 */
export async function memberSheetJson(revision: Pick<RevisionModel, 'id' | 'number' | 'standard' | 'fileName'>, globalId: string): Promise<string> {
  const sequelize = MemberModel.sequelize!;
  const [rows, forces] = await Promise.all([
    sequelize.query<Record<string, unknown> & { detailText: string; resultText: string | null; engineVersion: string | null }>(
      `SELECT ${MEMBER_SELECT()}, CAST(m.detail AS CHAR) AS detailText, CAST(cr.result AS CHAR) AS resultText, cr.engine_version AS engineVersion
       FROM members m LEFT JOIN check_results cr ON cr.member_id = m.id AND cr.standard = :standard
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
  const member = presentMemberRow({ ...row, isTension: Boolean(row.isTension) } as unknown as MemberModel);
  const rest: Omit<MemberSheet, 'detail' | 'result'> = {
    revision: { id: revision.id, number: revision.number, standard: revision.standard, fileName: revision.fileName },
    member,
    forces: forces.map((f) => ({ loadCase: f.loadCase, axialN: f.axialN, source: f.source })),
    engineVersion: row.engineVersion ?? null,
    cautions: CAUTIONS,
  };
  return `${JSON.stringify(rest).slice(0, -1)},"detail":${row.detailText},"result":${row.resultText ?? 'null'}}`;
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
