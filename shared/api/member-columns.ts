import { z } from 'zod';
import { RESULT_BANDS } from './results';
import type { MemberRow } from './members';

/**
 * Every member of a revision in one answer, column by column (GET …/revisions/:id/member-columns),
 * for the 3D view, which colours, filters and labels all of them at once. The same rows as the
 * member table (`MemberRow`), in a form about a fifth the size of a JSON array of objects: texts
 * that repeat (storeys, profiles, classes…) are stored once in `texts` and referred to by index.
 */

/** Text columns stored as indexes into `texts` (-1 for none). */
const TEXT_COLUMNS = ['tag', 'name', 'ifcClass', 'storey', 'assembly', 'profile', 'grade', 'inclusion', 'forceSource', 'governing', 'band'] as const;
/** Number columns, null where there is no value. */
const NUMBER_COLUMNS = ['lengthMm', 'designForceN', 'netAreaMm2', 'designCapacityN', 'utilisation'] as const;
/** Whole-number columns that always have a value. */
const COUNT_COLUMNS = ['holeCount', 'warningCount'] as const;

type TextColumn = (typeof TEXT_COLUMNS)[number];
type NumberColumn = (typeof NUMBER_COLUMNS)[number];
type CountColumn = (typeof COUNT_COLUMNS)[number];

const indexes = z.array(z.number().int().min(-1));
const numbers = z.array(z.number().nullable());
const counts = z.array(z.number().int());

export const memberColumnsSchema = z.object({
  count: z.number().int().min(0),
  /** Distinct texts of the text columns. */
  texts: z.array(z.string()),
  globalId: z.array(z.string()),
  /** 1 for a member found to be in tension, else 0. */
  isTension: z.array(z.number().int().min(0).max(1)),
  ...(Object.fromEntries(TEXT_COLUMNS.map((c) => [c, indexes])) as Record<TextColumn, typeof indexes>),
  ...(Object.fromEntries(NUMBER_COLUMNS.map((c) => [c, numbers])) as Record<NumberColumn, typeof numbers>),
  ...(Object.fromEntries(COUNT_COLUMNS.map((c) => [c, counts])) as Record<CountColumn, typeof counts>),
});
export type MemberColumns = z.infer<typeof memberColumnsSchema>;

/** Rows → columns (server). Numbers are kept exactly as they are: filters compare them with the table's. */
export function encodeMemberColumns(rows: readonly MemberRow[]): MemberColumns {
  const texts: string[] = [];
  const textIndex = new Map<string, number>();
  const ref = (s: string | null): number => {
    if (s == null) return -1;
    let i = textIndex.get(s);
    if (i === undefined) {
      i = texts.push(s) - 1;
      textIndex.set(s, i);
    }
    return i;
  };
  const out = { count: rows.length, texts, globalId: rows.map((r) => r.globalId), isTension: rows.map((r) => (r.isTension ? 1 : 0)) } as MemberColumns;
  for (const c of TEXT_COLUMNS) out[c] = rows.map((r) => ref(r[c]));
  for (const c of NUMBER_COLUMNS) out[c] = rows.map((r) => r[c]);
  for (const c of COUNT_COLUMNS) out[c] = rows.map((r) => r[c]);
  return out;
}

export class MemberColumnsError extends Error {}

const INCLUSIONS = new Set<string>(['auto', 'included', 'excluded']);
const BANDS = new Set<string>(RESULT_BANDS);

/** Columns → rows (client); refuses columns of unequal length, indexes outside `texts` and unknown enum values. */
export function decodeMemberColumns(cols: MemberColumns): MemberRow[] {
  const n = cols.count;
  const all = [cols.globalId, cols.isTension, ...TEXT_COLUMNS.map((c) => cols[c]), ...NUMBER_COLUMNS.map((c) => cols[c]), ...COUNT_COLUMNS.map((c) => cols[c])];
  if (all.some((a) => a.length !== n)) throw new MemberColumnsError('member columns: a column does not have one value per member');
  const text = (c: TextColumn, i: number): string | null => {
    const k = cols[c][i];
    if (k === -1) return null;
    if (k >= cols.texts.length) throw new MemberColumnsError(`member columns: ${c} of member ${i} points outside the texts`);
    return cols.texts[k];
  };
  const rows: MemberRow[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const inclusion = text('inclusion', i);
    const band = text('band', i);
    const ifcClass = text('ifcClass', i);
    if (inclusion === null || !INCLUSIONS.has(inclusion)) throw new MemberColumnsError(`member columns: inclusion of member ${i} is not known`);
    if (band === null || !BANDS.has(band)) throw new MemberColumnsError(`member columns: band of member ${i} is not known`);
    if (ifcClass === null) throw new MemberColumnsError(`member columns: member ${i} has no IFC class`);
    rows[i] = {
      globalId: cols.globalId[i],
      tag: text('tag', i),
      name: text('name', i),
      ifcClass,
      storey: text('storey', i),
      assembly: text('assembly', i),
      profile: text('profile', i),
      grade: text('grade', i),
      lengthMm: cols.lengthMm[i],
      isTension: cols.isTension[i] === 1,
      inclusion: inclusion as MemberRow['inclusion'],
      holeCount: cols.holeCount[i],
      designForceN: cols.designForceN[i],
      forceSource: text('forceSource', i),
      netAreaMm2: cols.netAreaMm2[i],
      designCapacityN: cols.designCapacityN[i],
      utilisation: cols.utilisation[i],
      governing: text('governing', i),
      band: band as MemberRow['band'],
      warningCount: cols.warningCount[i],
    };
  }
  return rows;
}
