import { fn, col, type WhereOptions } from 'sequelize';
import type { z } from 'zod';
import type { memberQuerySchema } from '@shared/api/members';
import type { MemberSheet, RevisionOverview } from '@shared/api/member-sheet';
import { RESULT_BANDS, type ResultBand } from '@shared/api/results';
import { CAUTIONS } from '@shared/api/cautions';
import type { SessionUser } from '@shared/api/session';
import { MemberModel } from '../../db/models/member';
import type { RevisionModel } from '../../db/models/revision';
import { errors } from '../../http/errors';
import { memberWhere } from './member-query';
import { cachedMemberPageJson } from './member-table-cache';
import { plainRead } from '../../db/plain-read';
import { presentMemberRow } from './member-presenter';

const ROW_ATTRIBUTES = { exclude: ['detail'] };

/** One page of the member table, served from the revision's in-memory copy (member-table-cache.ts). */
/** One page of the member table as JSON text (MemberPage): the table route sends it as it is. */
export async function listMembersJson(revision: Pick<RevisionModel, 'id' | 'resultsVersion'>, q: z.output<typeof memberQuerySchema>): Promise<string> {
  return cachedMemberPageJson(revision.id, revision.resultsVersion, q);
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
 * The member sheet as JSON text, or null when the caller cannot see such a member. Two queries
 * run side by side on one connection (db/plain-read.ts): the member with its revision, its stored result and the caller's access
 * (admins, or members of the project) in one join, and its forces. The stored detail and result
 * (about 6 KB per member) are JSON we wrote; they are read as text and placed in the answer as
 * they are, not parsed and written again. The sheet is the busiest read after the table.
 * Shape: MemberSheet.
 */
export async function memberSheetJson(user: SessionUser, projectId: number, revisionId: number, globalId: string): Promise<string | null> {
  const [rows, forces] = await plainRead<[(Record<string, unknown> & SheetExtras)[], { loadCase: string; axialN: number; source: string }[]]>(MemberModel.sequelize!, [
    {
      sql: `SELECT ${MEMBER_SELECT()}, CAST(m.detail AS CHAR) AS detailText, CAST(cr.result AS CHAR) AS resultText, cr.engine_version AS engineVersion,
                   r.number AS revisionNumber, r.standard AS revisionStandard, r.file_name AS revisionFileName
            FROM members m
            JOIN revisions r ON r.id = m.revision_id
            JOIN models md ON md.id = r.model_id
            LEFT JOIN check_results cr ON cr.member_id = m.id AND cr.standard = r.standard
            WHERE m.revision_id = ? AND m.global_id = ? AND md.project_id = ?
              AND (? OR EXISTS (SELECT 1 FROM project_members pm WHERE pm.project_id = md.project_id AND pm.user_id = ?))
            LIMIT 1`,
      values: [revisionId, globalId, projectId, user.role === 'admin', user.id],
    },
    // Read alongside; only answered when the query above shows the caller may see the member.
    {
      sql: `SELECT f.load_case AS loadCase, f.axial_n AS axialN, f.source FROM member_forces f JOIN members m ON m.id = f.member_id
            WHERE m.revision_id = ? AND m.global_id = ? ORDER BY f.source ASC, f.load_case ASC`,
      values: [revisionId, globalId],
    },
  ]);
  const row = rows[0];
  if (!row) return null;
  const member = presentMemberRow({ ...row, isTension: Boolean(row.isTension) } as unknown as MemberModel);
  const rest: Omit<MemberSheet, 'detail' | 'result'> = {
    revision: { id: revisionId, number: row.revisionNumber, standard: row.revisionStandard, fileName: row.revisionFileName },
    member,
    forces: forces.map((f) => ({ loadCase: f.loadCase, axialN: f.axialN, source: f.source })),
    engineVersion: row.engineVersion ?? null,
    cautions: CAUTIONS,
  };
  return `${JSON.stringify(rest).slice(0, -1)},"detail":${row.detailText},"result":${row.resultText ?? 'null'}}`;
}

interface SheetExtras {
  detailText: string;
  resultText: string | null;
  engineVersion: string | null;
  revisionNumber: number;
  revisionStandard: string;
  revisionFileName: string;
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
