import { BAND_STYLE, bandOf, type MemberRow, type ResultBand } from '@shared/api';
import type { DisplayGeometryEntry } from '@shared/geometry/display-geometry-format';

/**
 * How one element is drawn: a result band (the one `bandOf` + `BAND_STYLE` pair that also
 * colours the tables, legend and exports), steel that is not checked, or building context.
 */
export type Look = { kind: 'band'; band: ResultBand } | { kind: 'not-checked' } | { kind: 'context' };

/** Steel the tool does not check (members in compression or bending, bolts, plates): drawn see-through. */
export const NOT_CHECKED_STYLE = { label: 'not checked', colour: '#9AA1A8', description: 'steel outside the tension checks, drawn see-through' };
/** Slabs, walls, footings…: faint, and can be hidden. */
export const CONTEXT_STYLE = { label: 'building context', colour: '#B7B1A6', description: 'slabs, walls, footings; never checked' };

export const isChecked = (row: MemberRow) => row.inclusion !== 'excluded' && (row.isTension || row.inclusion === 'included');

export function lookOf(entry: DisplayGeometryEntry, row: MemberRow | undefined): Look {
  if (entry.context) return { kind: 'context' };
  if (!row || !isChecked(row)) return { kind: 'not-checked' };
  return { kind: 'band', band: bandOf(row.utilisation) };
}

const FASTENER = /fastener/i;

/** Why an element has no result, in plain words; null when it has one. */
export function missingReason(entry: DisplayGeometryEntry, row: MemberRow | undefined): string | null {
  if (entry.context) return 'building context, not checked';
  if (!row) return FASTENER.test(entry.ifcClass) ? 'bolt or fastener, checked with its member’s ends' : 'not among the checked members (not read as steel)';
  if (row.inclusion === 'excluded') return 'excluded from the checks by hand';
  if (!isChecked(row)) return 'not a tension member, so not checked';
  if (row.utilisation != null && Number.isFinite(row.utilisation)) return null;
  if (row.designForceN == null) return 'no design force';
  if (row.designCapacityN == null) return row.warningCount ? `missing input (${row.warningCount} note${row.warningCount === 1 ? '' : 's'} on its sheet)` : 'missing input for the capacity';
  return 'no result';
}

export const bandLabel = (band: ResultBand) => BAND_STYLE[band].label;
