import type { z } from 'zod';
import type { memberQuerySchema, MemberRow } from '@shared/api/members';

type Query = z.output<typeof memberQuerySchema>;

/**
 * One member of the in-memory member table: the row as the API shows it plus the
 * folded texts filters compare. Folding (NFKD, marks removed, lower case) stands in for
 * the database's case- and accent-insensitive collation, so a search for "ü" and "U"
 * finds the same members in memory as it did in SQL.
 */
export interface TableRow {
  id: number;
  row: MemberRow;
  inTensionScope: boolean;
  search: string;
  ifcClass: string;
  storey: string;
  assembly: string;
  profile: string;
  /** The row as JSON, written the first time a page shows it (rows never change inside a copy). */
  json?: string;
}

export const fold = (s: string | null | undefined): string =>
  (s ?? '').normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase();

export function toTableRow(id: number, row: MemberRow): TableRow {
  return {
    id,
    row,
    // The tension scope: tension members not excluded by hand, and members included by hand.
    inTensionScope: (row.isTension && row.inclusion !== 'excluded') || row.inclusion === 'included',
    // A separator no search text can contain keeps matches inside one field.
    search: [row.globalId, row.tag, row.name, row.profile].map(fold).join('\u0000'),
    ifcClass: fold(row.ifcClass),
    storey: fold(row.storey),
    assembly: fold(row.assembly),
    profile: fold(row.profile),
  };
}

/** The member-table filter (same meaning as the SQL one in member-query.ts) as a predicate. */
export function tableFilter(q: Query): (r: TableRow) => boolean {
  const tests: ((r: TableRow) => boolean)[] = [];
  if (q.scope === 'tension') tests.push((r) => r.inTensionScope);
  if (q.band?.length) {
    const bands = new Set<string>(q.band);
    tests.push((r) => bands.has(r.row.band));
  }
  if (q.minUtilisation !== undefined) {
    const min = q.minUtilisation;
    tests.push((r) => r.row.utilisation != null && r.row.utilisation >= min);
  }
  const equal = (key: 'ifcClass' | 'storey' | 'assembly' | 'profile', value: string | undefined) => {
    // An empty filter means no filter, as in member-query.ts.
    if (!value) return;
    const wanted = fold(value);
    // As in SQL, a missing value equals nothing, not even an empty filter.
    const field = key === 'profile' ? 'profile' : key;
    tests.push((r) => r.row[field] != null && r[key] === wanted);
  };
  equal('ifcClass', q.ifcClass);
  equal('storey', q.storey);
  equal('assembly', q.assembly);
  equal('profile', q.profile);
  if (q.ids) {
    const ids = new Set(q.ids.split(',').map((s) => s.trim()).filter(Boolean).slice(0, 1000));
    tests.push((r) => ids.has(r.row.globalId));
  }
  if (q.q?.trim()) {
    const needle = fold(q.q.trim());
    tests.push((r) => r.search.includes(needle));
  }
  return (r) => tests.every((t) => t(r));
}

/** The filter part of a query as a stable key (sort, direction and paging left out). */
export function filterKey(q: Query): string {
  return JSON.stringify([q.scope, q.band ?? null, q.minUtilisation ?? null, q.ifcClass ?? '', q.storey ?? '', q.assembly ?? '', q.profile ?? '', q.ids ?? '', q.q?.trim() ?? '']);
}

/** Which rows (by position) the query's filter keeps, and how many: evaluated once per filter, whatever the sort. */
export interface FilterMask {
  keep: Uint8Array;
  count: number;
}

export function filterMask(rows: readonly TableRow[], q: Query): FilterMask {
  const test = tableFilter(q);
  const keep = new Uint8Array(rows.length);
  let count = 0;
  for (let i = 0; i < rows.length; i++) {
    if (!test(rows[i])) continue;
    keep[i] = 1;
    count++;
  }
  return { keep, count };
}

/** Positions (into rows) of one page of the kept rows in the given order; walks only as far as the page. */
function pagePositions(order: Int32Array, mask: FilterMask, q: Query): number[] {
  const from = (q.page - 1) * q.pageSize;
  const to = Math.min(from + q.pageSize, mask.count);
  const positions: number[] = [];
  for (let i = 0, seen = 0; i < order.length && seen < to; i++) {
    if (!mask.keep[order[i]]) continue;
    if (seen >= from) positions.push(order[i]);
    seen++;
  }
  return positions;
}

/**
 * One page of the kept rows in the given order, as JSON text (MemberPage). Each row is written once per copy and reused by
 * every page that shows it: serialising 50-row pages was the largest single CPU cost of a
 * table request under load.
 */
export function pageJsonOf(rows: readonly TableRow[], order: Int32Array, mask: FilterMask, q: Query): string {
  const members = pagePositions(order, mask, q).map((i) => (rows[i].json ??= JSON.stringify(rows[i].row)));
  return `{"total":${mask.count},"page":${q.page},"pageSize":${q.pageSize},"members":[${members.join(',')}]}`;
}
