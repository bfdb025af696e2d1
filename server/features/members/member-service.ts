import { fn, col, type WhereOptions } from 'sequelize';
import type { z } from 'zod';
import type { memberQuerySchema } from '@shared/api/members';
import type { RevisionOverview } from '@shared/api/member-sheet';
import { RESULT_BANDS, type ResultBand } from '@shared/api/results';
import { MemberModel } from '../../db/models/member';
import type { RevisionModel } from '../../db/models/revision';
import { errors } from '../../http/errors';
import { memberWhere } from './member-query';
import { cachedMemberPageJson } from './member-table-cache';
import { presentMemberRow } from './member-presenter';

const ROW_ATTRIBUTES = { exclude: ['detail'] };

/** One page of the member table as JSON text (MemberPage), from the revision's in-memory copy (member-table-cache.ts): the table route sends it as it is. */
export async function listMembersJson(revision: Pick<RevisionModel, 'id' | 'resultsVersion'>, q: z.output<typeof memberQuerySchema>): Promise<string> {
  return cachedMemberPageJson(revision.id, revision.resultsVersion, q);
}

export async function findMember(revisionId: number, globalId: string): Promise<MemberModel> {
  const member = await MemberModel.findOne({ where: { revisionId, globalId } });
  if (!member) throw errors.notFound('That member');
  return member;
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
