import type { z } from 'zod';
import type { memberQuerySchema } from '@shared/api/members';
import { CRITICAL_BANDS } from '../../exports/bcf-export';
import type { ExportFormat } from '../../exports/export-format-info';
import { slug } from '../../exports/export-text';

export type ExportQuery = z.output<typeof memberQuerySchema>;

const hasOwnFilter = (q: ExportQuery) => !!(q.band?.length || q.minUtilisation !== undefined || q.ids || q.q || q.ifcClass || q.storey || q.assembly || q.profile);

/** BCF is a list of issues: without a filter of the caller's, it lists only the critical members. */
export function effectiveQuery(format: ExportFormat, q: ExportQuery): ExportQuery {
  if (format === 'bcf' && !hasOwnFilter(q)) return { ...q, band: [...CRITICAL_BANDS] };
  return q;
}

const isCritical = (q: ExportQuery) => !!q.band && q.band.length === CRITICAL_BANDS.length && CRITICAL_BANDS.every((b) => q.band!.includes(b));

/** Plain words for the filter, written into every export so a reader knows what was left out. */
export function describeFilter(q: ExportQuery): string {
  const parts = [q.scope === 'all' ? 'all steel members' : 'tension members', 'with a check result'];
  if (q.band?.length) parts.push(`in band(s) ${q.band.join(', ')}`);
  if (q.minUtilisation !== undefined) parts.push(`with utilisation ≥ ${q.minUtilisation}`);
  if (q.ifcClass) parts.push(`of class ${q.ifcClass}`);
  if (q.storey) parts.push(`on storey "${q.storey}"`);
  if (q.assembly) parts.push(`in assembly "${q.assembly}"`);
  if (q.profile) parts.push(`with profile ${q.profile}`);
  if (q.q) parts.push(`matching "${q.q}"`);
  if (q.ids) parts.push('in the selection');
  return parts.join(' ');
}

/** e.g. kestrel-yard-shed-r1-critical.xlsx: ASCII only, so every browser saves it as named. */
export function exportFileName(modelName: string, revisionNumber: number, q: ExportQuery, extension: string): string {
  const label = isCritical(q) ? 'critical' : hasOwnFilter(q) ? 'filtered' : q.scope === 'all' ? 'all' : 'tension';
  return `${slug(modelName, 'model')}-r${revisionNumber}-${label}.${extension}`;
}
