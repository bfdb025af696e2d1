import { fn, col, type WhereOptions } from 'sequelize';
import type { z } from 'zod';
import type { memberQuerySchema, MemberPage } from '@shared/api/members';
import type { MemberSheet, RevisionOverview } from '@shared/api/member-sheet';
import type { MemberDetail } from '@shared/api/member-detail';
import { RESULT_BANDS, type ResultBand } from '@shared/api/results';
import { CAUTIONS } from '@shared/api/cautions';
import { MemberModel } from '../../db/models/member';
import { MemberForceModel } from '../../db/models/member-force';
import { CheckResultModel } from '../../db/models/check-result';
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

export async function memberSheet(revision: Pick<RevisionModel, 'id' | 'number' | 'standard' | 'fileName'>, globalId: string): Promise<MemberSheet> {
  const member = await findMember(revision.id, globalId);
  const [forces, result] = await Promise.all([
    MemberForceModel.findAll({ where: { memberId: member.id }, order: [['source', 'ASC'], ['loadCase', 'ASC']] }),
    CheckResultModel.findOne({ where: { memberId: member.id, standard: revision.standard } }),
  ]);
  return {
    revision: { id: revision.id, number: revision.number, standard: revision.standard, fileName: revision.fileName },
    member: presentMemberRow(member),
    detail: member.detail as MemberDetail,
    forces: forces.map((f) => ({ loadCase: f.loadCase, axialN: f.axialN, source: f.source })),
    result: (result?.result as MemberSheet['result']) ?? null,
    engineVersion: result?.engineVersion ?? null,
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
