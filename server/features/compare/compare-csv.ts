import type { RevisionComparison } from '@shared/compare/compare-revisions';
import { CAUTION_SUMMARY } from '@shared/api/cautions';

const cell = (v: unknown): string => {
  if (v === null || v === undefined) return '';
  let s = String(v);
  // A cell that a spreadsheet would run as a formula is kept as text.
  if (/^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};
const kN = (n: number | null | undefined) => (n == null ? null : (n / 1000).toFixed(1));
const u = (n: number | null | undefined) => (n == null ? null : n.toFixed(2));

/** One row per changed member; forces in kN; UTF-8 with a byte-order mark so spreadsheets read φ and ≥. */
export function comparisonCsv(c: RevisionComparison, meta: { model: string; before: number; after: number; standard: string; exportedAt: string }): Buffer {
  const header = ['GlobalId', 'Previous GlobalId', 'Tag', 'Name', 'Changes', 'Profile before', 'Profile after', 'Grade before', 'Grade after', 'Design force before [kN]', 'Design force after [kN]', 'Utilisation before', 'Utilisation after', 'Band before', 'Band after', 'Model', 'Revisions', 'Standard', 'Exported at', 'Cautions'];
  const lines = [header.map(cell).join(',')];
  for (const ch of c.changes) {
    lines.push(
      [ch.globalId, ch.previousGlobalId, ch.tag, ch.name, ch.kinds.join(' '), ch.before?.profile, ch.after?.profile, ch.before?.grade, ch.after?.grade, kN(ch.before?.designForceN), kN(ch.after?.designForceN), u(ch.before?.utilisation), u(ch.after?.utilisation), ch.before?.band, ch.after?.band, meta.model, `r${meta.before} → r${meta.after}`, meta.standard, meta.exportedAt, CAUTION_SUMMARY]
        .map(cell)
        .join(','),
    );
  }
  return Buffer.from(`\uFEFF${lines.join('\r\n')}\r\n`, 'utf8');
}
