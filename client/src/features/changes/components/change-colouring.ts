import { CHANGE_PRECEDENCE, CHANGE_STYLE, changeLookOf } from '@shared/compare/change-look';
import type { ChangeKind } from '@shared/compare/compare-revisions';
import { formatUtilisation } from '../../../lib/units';
import type { Comparison, ComparisonChange } from '../api/use-comparison';
import { CHANGE_WORDS } from './change-words';

/**
 * A comparison as a per-member colouring of the newer revision's 3D view (the shape the
 * model view takes as its overlay; routes pass one to the other). Colours and the order of
 * the key come from shared/compare/change-look.ts, words from change-words.ts, so the key,
 * the colours, the hover words and the changes table all agree.
 */
export interface ChangeColouring {
  title: string;
  entries: { id: string; label: string; description: string; colour: string; outlined: boolean }[];
  members: ReadonlyMap<string, { entry: string; words: string[] }>;
  rest: { label: string; description: string; words: string };
  note: string;
  absent: { title: string; empty: string; members: { globalId: string; label: string; words: string[]; href?: string }[] };
  warnings: string[];
}

export interface ColouringOptions {
  /** A force in N as text in the reader's units, e.g. "96.4 kN". */
  force(n: number): string;
  /** Where a member of the earlier revision opens (for taken-out members). */
  hrefBefore?(globalId: string): string;
}

const WORD_ORDER: ChangeKind[] = [...CHANGE_PRECEDENCE, 'removed'];
const orNone = (v: string | null) => v ?? 'none';
const util = (u: number | null | undefined) => (u == null ? 'no result' : formatUtilisation(u));

/** One line per kind of change, most urgent first (so the first line names the colour), with the figures before → after. */
export function changeWords(c: ComparisonChange, o: ColouringOptions): string[] {
  const b = c.before;
  const a = c.after;
  const force = (m: typeof a) => (m?.designForceN == null ? 'no force' : o.force(m.designForceN));
  const detail: Partial<Record<ChangeKind, string>> = {
    'newly-critical': b && a ? `${b.band} → ${a.band}` : a ? a.band : undefined,
    'utilisation-up': `${util(b?.utilisation)} → ${util(a?.utilisation)}`,
    'utilisation-down': `${util(b?.utilisation)} → ${util(a?.utilisation)}`,
    resized: `${orNone(b?.profile ?? null)} → ${orNone(a?.profile ?? null)}`,
    regraded: `${orNone(b?.grade ?? null)} → ${orNone(a?.grade ?? null)}`,
    'force-changed': `${force(b)} → ${force(a)}`,
  };
  const words = WORD_ORDER.filter((k) => c.kinds.includes(k)).map((k) => (detail[k] ? `${CHANGE_WORDS[k].word}: ${detail[k]}` : CHANGE_WORDS[k].word));
  if (c.previousGlobalId) words.push(`matched by tag; GlobalId was ${c.previousGlobalId}`);
  return words;
}

export function changeColouring(comparison: Comparison, o: ColouringOptions): ChangeColouring {
  const since = `revision ${comparison.before.number}`;
  const members = new Map<string, { entry: string; words: string[] }>();
  const absent: ChangeColouring['absent']['members'] = [];
  for (const c of comparison.changes) {
    const look = changeLookOf(c.kinds);
    if (look.kind === 'drawn') members.set(c.globalId, { entry: look.shownAs, words: changeWords(c, o) });
    else if (look.kind === 'removed') {
      const profile = c.before?.profile ? ` · was ${c.before.profile}` : '';
      absent.push({ globalId: c.globalId, label: `${c.tag ?? c.name ?? 'Member'}${profile}`, words: changeWords(c, o), href: o.hrefBefore?.(c.globalId) });
    }
  }
  absent.sort((x, y) => x.label.localeCompare(y.label, 'en', { numeric: true }));
  return {
    title: `Change since ${since}`,
    entries: CHANGE_PRECEDENCE.map((k) => ({ id: k, label: CHANGE_WORDS[k].heading, description: CHANGE_WORDS[k].hint, ...CHANGE_STYLE[k] })),
    members,
    rest: { label: 'unchanged', description: `no change found since ${since}; drawn faint`, words: `no change found since ${since}` },
    note: 'A member with several changes takes the colour of the first of them in this list (darker = look sooner); hover or pick it to read every change.',
    absent: { title: `Taken out since ${since}`, empty: `No member of ${since} is missing from this one.`, members: absent },
    warnings: comparison.warnings,
  };
}
