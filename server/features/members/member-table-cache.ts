import { QueryTypes } from 'sequelize';
import type { z } from 'zod';
import type { memberQuerySchema, MemberRow, MemberSortKey } from '@shared/api/members';
import { MemberModel } from '../../db/models/member';
import { presentMemberRow } from './member-presenter';
import { sortOrder, textRanksOf, TEXT_RANK_SQL, type SortableRow } from './member-table-order';
import { filterKey, filterMask, pageJsonOf, toTableRow, type FilterMask, type TableRow } from './member-table-rows';

type Query = z.output<typeof memberQuerySchema>;

/**
 * The member table of recently read revisions, held in memory so a page costs a walk over
 * an array instead of a sort in MariaDB. Each copy is labelled with the revision's
 * `resultsVersion`, which every request reads from the database anyway; a different
 * number drops the copy, so all app processes sharing a database see every change.
 * Text orders come from MariaDB's collation as ranks (member-table-order.ts), read with the rows.
 */
interface Entry {
  version: number;
  rows: Promise<{ rows: (TableRow & SortableRow)[] }>;
  orders: Map<string, Promise<Int32Array>>;
  /** Recent filters' masks: a filter is evaluated once, then any order or page walks a byte array. */
  masks: Map<string, FilterMask>;
  size: number;
}

/** Filter masks kept per revision (one byte per member each). */
const MASKS_KEPT = 64;
/** Rows kept across all revisions (about 1 KB each); least recently used copies go first. */
const ROW_BUDGET = 250_000;
const entries = new Map<number, Entry>();

function touch(revisionId: number, entry: Entry): void {
  entries.delete(revisionId);
  entries.set(revisionId, entry);
}

function evict(): void {
  let total = [...entries.values()].reduce((n, e) => n + e.size, 0);
  for (const [id, e] of entries) {
    if (total <= ROW_BUDGET || entries.size <= 1) break;
    entries.delete(id);
    total -= e.size;
  }
}

async function loadRows(revisionId: number, entry: Entry) {
  // Plain rows: building 20,000 model instances took longer than the query.
  const [raw, ranks] = await Promise.all([
    MemberModel.findAll({ where: { revisionId }, attributes: { exclude: ['detail'] }, raw: true }) as unknown as Promise<MemberModel[]>,
    MemberModel.sequelize!.query<Record<string, number>>(TEXT_RANK_SQL, { replacements: [revisionId], type: QueryTypes.SELECT }),
  ]);
  const rankOf = new Map(ranks.map((r) => [Number(r.id), textRanksOf(r)]));
  // A member written between the two reads belongs to a newer version; leave it out.
  const rows = raw
    .filter((m) => rankOf.has(m.id))
    .map((m) => ({ ...toTableRow(m.id, presentMemberRow({ ...m, isTension: Boolean(m.isTension) } as MemberModel)), ranks: rankOf.get(m.id)! }));
  entry.size = rows.length;
  evict();
  return { rows };
}

function entryFor(revisionId: number, version: number): Entry {
  const held = entries.get(revisionId);
  if (held && held.version === version) {
    touch(revisionId, held);
    return held;
  }
  const entry: Entry = { version, orders: new Map(), masks: new Map(), size: 0, rows: undefined as never };
  entry.rows = loadRows(revisionId, entry);
  // A failed load must not stay cached.
  entry.rows.catch(() => entries.get(revisionId) === entry && entries.delete(revisionId));
  touch(revisionId, entry);
  return entry;
}

function orderFor(entry: Entry, sort: MemberSortKey, dir: 'asc' | 'desc'): Promise<Int32Array> {
  const key = `${sort}:${dir}`;
  let order = entry.orders.get(key);
  if (!order) {
    order = entry.rows.then(({ rows }) => sortOrder(rows, sort, dir));
    order.catch(() => entry.orders.get(key) === order && entry.orders.delete(key));
    entry.orders.set(key, order);
  }
  return order;
}

async function pageParts(revisionId: number, resultsVersion: number, q: Query) {
  const entry = entryFor(revisionId, resultsVersion);
  const [{ rows }, order] = await Promise.all([entry.rows, orderFor(entry, q.sort, q.dir)]);
  const key = filterKey(q);
  let mask = entry.masks.get(key);
  if (mask) entry.masks.delete(key);
  else mask = filterMask(rows, q);
  entry.masks.set(key, mask);
  if (entry.masks.size > MASKS_KEPT) entry.masks.delete(entry.masks.keys().next().value!);
  return { rows, order, mask };
}

/** One page of a revision's member table (filtered, sorted) with the total of matches, as JSON text (MemberPage) from rows serialised once per copy. */
export async function cachedMemberPageJson(revisionId: number, resultsVersion: number, q: Query): Promise<string> {
  const { rows, order, mask } = await pageParts(revisionId, resultsVersion, q);
  return pageJsonOf(rows, order, mask, q);
}

/** Every member row of the revision in GlobalId order, from the same copy (the 3D view's member columns). */
export async function cachedMemberRows(revisionId: number, resultsVersion: number): Promise<MemberRow[]> {
  const entry = entryFor(revisionId, resultsVersion);
  const [{ rows }, order] = await Promise.all([entry.rows, orderFor(entry, 'globalId', 'asc')]);
  return Array.from(order, (i) => rows[i].row);
}

/** Loads the copy of a revision's table and its default order ahead of the first request. */
export async function prepareMemberTable(revisionId: number, resultsVersion: number): Promise<void> {
  await orderFor(entryFor(revisionId, resultsVersion), 'utilisation', 'desc');
}

/** Forgets every copy (tests, and a revision deleted). */
export function clearMemberTableCache(): void {
  entries.clear();
}
