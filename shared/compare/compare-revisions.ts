import type { ResultBand } from '../api/results';

/** What a member looks like in one revision, for comparison. Force N, tension positive. */
export interface ComparableMember {
  globalId: string;
  tag: string | null;
  name: string | null;
  profile: string | null;
  grade: string | null;
  /** A stable text of the member's holes (positions and diameters, rounded); equal text = same bolting. */
  holeSignature: string;
  designForceN: number | null;
  utilisation: number | null;
  band: ResultBand;
}

export const CHANGE_KINDS = ['added', 'removed', 'resized', 'regraded', 'rebolted', 'force-changed', 'utilisation-up', 'utilisation-down', 'newly-critical'] as const;
export type ChangeKind = (typeof CHANGE_KINDS)[number];

export interface MemberChange {
  globalId: string;
  /** GlobalId in the earlier revision when matched by tag (GlobalIds were regenerated). */
  previousGlobalId: string | null;
  tag: string | null;
  name: string | null;
  kinds: ChangeKind[];
  before: ComparableMember | null;
  after: ComparableMember | null;
}

export interface RevisionComparison {
  matchedByGlobalId: number;
  matchedByTag: number;
  counts: Record<ChangeKind, number>;
  changes: MemberChange[];
  warnings: string[];
}

const CRITICAL: ResultBand[] = ['tight', 'over'];
/** Changes smaller than these are round-off, not news. */
const FORCE_TOLERANCE = 0.005;
const UTILISATION_TOLERANCE = 0.005;

function differs(a: number | null, b: number | null, relative: number): boolean {
  if (a === null || b === null) return a !== b;
  return Math.abs(a - b) > relative * Math.max(Math.abs(a), Math.abs(b), 1e-9);
}

function kindsOf(before: ComparableMember, after: ComparableMember): ChangeKind[] {
  const kinds: ChangeKind[] = [];
  if ((before.profile ?? '') !== (after.profile ?? '')) kinds.push('resized');
  if ((before.grade ?? '') !== (after.grade ?? '')) kinds.push('regraded');
  if (before.holeSignature !== after.holeSignature) kinds.push('rebolted');
  if (differs(before.designForceN, after.designForceN, FORCE_TOLERANCE)) kinds.push('force-changed');
  if (before.utilisation !== null && after.utilisation !== null) {
    if (after.utilisation - before.utilisation > UTILISATION_TOLERANCE) kinds.push('utilisation-up');
    if (before.utilisation - after.utilisation > UTILISATION_TOLERANCE) kinds.push('utilisation-down');
  }
  if (CRITICAL.includes(after.band) && !CRITICAL.includes(before.band)) kinds.push('newly-critical');
  return kinds;
}

/**
 * Compares two revisions of a model. Members are matched by GlobalId, then — for those
 * left over on both sides — by a tag that is unique on both sides (some exporters make new
 * GlobalIds on every export), which is reported as a warning. Only members that changed
 * are listed.
 */
export function compareRevisions(before: ComparableMember[], after: ComparableMember[]): RevisionComparison {
  const beforeById = new Map(before.map((m) => [m.globalId, m]));
  const afterById = new Map(after.map((m) => [m.globalId, m]));
  const pairs: [ComparableMember, ComparableMember, boolean][] = [];
  for (const a of after) {
    const b = beforeById.get(a.globalId);
    if (b) pairs.push([b, a, false]);
  }
  const leftBefore = before.filter((m) => !afterById.has(m.globalId));
  const leftAfter = after.filter((m) => !beforeById.has(m.globalId));
  const uniqueTags = (list: ComparableMember[]) => {
    const count = new Map<string, number>();
    for (const m of list) if (m.tag) count.set(m.tag, (count.get(m.tag) ?? 0) + 1);
    return new Map(list.filter((m) => m.tag && count.get(m.tag) === 1).map((m) => [m.tag!, m]));
  };
  const beforeByTag = uniqueTags(leftBefore);
  const afterByTag = uniqueTags(leftAfter);
  const pairedBefore = new Set<string>();
  const pairedAfter = new Set<string>();
  for (const [tag, a] of afterByTag) {
    const b = beforeByTag.get(tag);
    if (!b) continue;
    pairs.push([b, a, true]);
    pairedBefore.add(b.globalId);
    pairedAfter.add(a.globalId);
  }
  const changes: MemberChange[] = [];
  for (const [b, a, byTag] of pairs) {
    const kinds = kindsOf(b, a);
    if (kinds.length) changes.push({ globalId: a.globalId, previousGlobalId: byTag ? b.globalId : null, tag: a.tag, name: a.name, kinds, before: b, after: a });
  }
  for (const a of leftAfter) if (!pairedAfter.has(a.globalId)) changes.push({ globalId: a.globalId, previousGlobalId: null, tag: a.tag, name: a.name, kinds: ['added', ...(CRITICAL.includes(a.band) ? (['newly-critical'] as ChangeKind[]) : [])], before: null, after: a });
  for (const b of leftBefore) if (!pairedBefore.has(b.globalId)) changes.push({ globalId: b.globalId, previousGlobalId: null, tag: b.tag, name: b.name, kinds: ['removed'], before: b, after: null });
  const counts = Object.fromEntries(CHANGE_KINDS.map((k) => [k, 0])) as Record<ChangeKind, number>;
  for (const c of changes) for (const k of c.kinds) counts[k]++;
  const byTag = pairs.filter((p) => p[2]).length;
  const warnings = byTag ? [`${byTag} member(s) were matched by tag because their GlobalIds changed between the revisions; check that the exporter keeps GlobalIds.`] : [];
  return { matchedByGlobalId: pairs.length - byTag, matchedByTag: byTag, counts, changes, warnings };
}

/** A rounded, ordered text of hole positions and diameters (mm), so equal bolting compares equal. */
export function holeSignature(holes: { x: number; y: number; d: number | null }[]): string {
  return holes
    .map((h) => `${h.x.toFixed(0)},${h.y.toFixed(0)},${h.d === null ? '-' : h.d.toFixed(1)}`)
    .sort()
    .join(';');
}
