import type { MemberRow, MemberSortKey } from '@shared/api/members';

/** Text sort keys: their order comes from MariaDB's collation, as ranks (see TEXT_RANK_SQL). */
export const TEXT_SORT_COLUMNS = {
  globalId: 'global_id',
  tag: 'tag',
  name: 'name',
  ifcClass: 'ifc_class',
  profile: 'profile_name',
  grade: 'grade_name',
  governing: 'governing',
} as const satisfies Partial<Record<MemberSortKey, string>>;
export type TextSortKey = keyof typeof TEXT_SORT_COLUMNS;

const NUMBER_SORT_FIELDS = {
  utilisation: 'utilisation',
  designForceN: 'designForceN',
  designCapacityN: 'designCapacityN',
  warningCount: 'warningCount',
} as const satisfies Partial<Record<MemberSortKey, keyof MemberRow>>;

/**
 * One statement ranks every text column of a revision's members in the database's own
 * collation (case- and accent-insensitive; equal texts share a rank), so the order in
 * memory is the order SQL gave, at the cost of one scan instead of one sort per key.
 */
export const TEXT_RANK_SQL = `SELECT id, ${Object.entries(TEXT_SORT_COLUMNS)
  // Aliases must not be column names, or the next window would order by the previous rank.
  .map(([key, column]) => `DENSE_RANK() OVER (ORDER BY m.\`${column}\`) AS \`rank_${key}\``)
  .join(', ')} FROM members m WHERE m.revision_id = ?`;

/** The ranks of one row of TEXT_RANK_SQL's answer, by sort key. */
export function textRanksOf(row: Record<string, number>): TextRanks {
  return Object.fromEntries(Object.keys(TEXT_SORT_COLUMNS).map((key) => [key, Number(row[`rank_${key}`])])) as TextRanks;
}

export type TextRanks = Record<TextSortKey, number>;

/** What the order needs of one row: its values and the ranks of its texts. */
export interface SortableRow {
  row: MemberRow;
  ranks: TextRanks;
}

/**
 * Row positions in the member table's order: the key ascending or descending, rows without
 * a value last in either direction, ties broken by GlobalId ascending (as member-query.ts
 * orders in SQL).
 */
export function sortOrder(rows: readonly SortableRow[], sort: MemberSortKey, dir: 'asc' | 'desc'): Int32Array {
  const sign = dir === 'asc' ? 1 : -1;
  const n = rows.length;
  const value = new Float64Array(n);
  const missing = new Uint8Array(n);
  const tie = new Float64Array(n);
  const textKey = (sort in TEXT_SORT_COLUMNS ? sort : null) as TextSortKey | null;
  const field = textKey ? null : NUMBER_SORT_FIELDS[sort as keyof typeof NUMBER_SORT_FIELDS];
  for (let i = 0; i < n; i++) {
    const r = rows[i];
    const raw = textKey ? r.row[textKey] : r.row[field!];
    missing[i] = raw == null ? 1 : 0;
    value[i] = textKey ? r.ranks[textKey] : Number(raw ?? 0);
    tie[i] = r.ranks.globalId;
  }
  const order = Int32Array.from({ length: n }, (_, i) => i);
  order.sort((a, b) => missing[a] - missing[b] || sign * (value[a] - value[b]) || tie[a] - tie[b]);
  return order;
}
