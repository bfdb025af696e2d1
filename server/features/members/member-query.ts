import { Op, literal, type WhereOptions, type Order } from 'sequelize';
import type { z } from 'zod';
import type { memberQuerySchema, MemberSortKey } from '@shared/api/members';
import { MemberModel } from '../../db/models/member';

type Query = z.output<typeof memberQuerySchema>;

const SORT_COLUMN: Record<MemberSortKey, string> = {
  utilisation: 'utilisation',
  globalId: 'globalId',
  tag: 'tag',
  name: 'name',
  ifcClass: 'ifcClass',
  profile: 'profileName',
  grade: 'gradeName',
  designForceN: 'designForceN',
  designCapacityN: 'designCapacityN',
  governing: 'governing',
  warningCount: 'warningCount',
};

/** Escapes LIKE wildcards so a search for "50%" means the text "50%". */
const like = (s: string) => `%${s.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

export function memberWhere(revisionId: number, q: Query): WhereOptions {
  const and: WhereOptions[] = [{ revisionId }];
  if (q.scope === 'tension') {
    and.push({ [Op.or]: [{ isTension: true, inclusion: { [Op.ne]: 'excluded' } }, { inclusion: 'included' }] });
  }
  if (q.band?.length) and.push({ band: { [Op.in]: q.band } });
  if (q.minUtilisation !== undefined) and.push({ utilisation: { [Op.gte]: q.minUtilisation } });
  if (q.ifcClass) and.push({ ifcClass: q.ifcClass });
  if (q.storey) and.push({ storey: q.storey });
  if (q.assembly) and.push({ assembly: q.assembly });
  if (q.profile) and.push({ profileName: q.profile });
  if (q.ids) and.push({ globalId: { [Op.in]: q.ids.split(',').map((s) => s.trim()).filter(Boolean).slice(0, 1000) } });
  if (q.q) {
    const pattern = like(q.q.trim());
    and.push({ [Op.or]: [{ globalId: { [Op.like]: pattern } }, { tag: { [Op.like]: pattern } }, { name: { [Op.like]: pattern } }, { profileName: { [Op.like]: pattern } }] });
  }
  return { [Op.and]: and };
}

/**
 * Rows without a value sort last in either direction; GlobalId breaks ties so pages are
 * stable. MariaDB already puts NULLs last when sorting descending, so the default order
 * (utilisation, descending) needs no extra term and can walk the (revision, utilisation) index.
 */
export function memberOrder(q: Query): Order {
  const column = SORT_COLUMN[q.sort];
  if (q.dir === 'desc') return [[column, 'DESC'], ['globalId', 'ASC']];
  const field = (MemberModel.getAttributes() as Record<string, { field?: string }>)[column]?.field ?? column;
  return [
    [literal(`\`${field}\` IS NULL`), 'ASC'],
    [column, 'ASC'],
    ['globalId', 'ASC'],
  ];
}
