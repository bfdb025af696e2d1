import type { ProjectLogEntry } from '@shared/api';
import { formatCount } from '../../../lib/format';

const ACTION_LABELS: Record<string, string> = {
  'model.uploaded': 'Uploaded a model',
  'member.override': 'Changed member inputs',
  'forces.applied': 'Applied a forces table',
  'export.created': 'Exported results',
  'mail.critical-members': 'Mailed critical members',
  'project.created': 'Created the project',
  'project.updated': 'Changed project settings',
  'project.member-added': 'Added a person',
  'project.member-removed': 'Removed a person',
};

export const actionLabel = (action: string) => ACTION_LABELS[action] ?? action;

const str = (v: unknown) => (typeof v === 'string' ? v : null);
const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const shown = (v: unknown) => (v === null || v === undefined || v === '' ? '—' : String(v));
const plural = (n: number, one: string, many = `${one}s`) => `${formatCount(n)} ${n === 1 ? one : many}`;

function fileSize(bytes: number): string {
  if (bytes < 1024 * 1024) return `${formatCount(Math.ceil(bytes / 1024))} KB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

const FIELD_WORDS: Record<string, string> = {
  fy: 'fy (MPa)',
  fu: 'fu (MPa)',
  holeDiameter: 'hole diameter (mm)',
  designForceN: 'design force (N)',
};

/** "design force (N) 100000 → 125000; grade — → S355": a before/after list, whatever the fields. */
function changeWords(change: unknown): string {
  if (!change || typeof change !== 'object') return '';
  return Object.entries(change as Record<string, { before?: unknown; after?: unknown }>)
    .map(([field, c]) => `${FIELD_WORDS[field] ?? field} ${shown(c?.before)} → ${shown(c?.after)}`)
    .join('; ');
}

/** One line saying what the entry holds, in words; unknown actions show their fields plainly. */
export function detailWords(entry: ProjectLogEntry): string {
  const d = entry.detail;
  switch (entry.action) {
    case 'model.uploaded': {
      const size = num(d.size);
      return [str(d.fileName), size !== null ? fileSize(size) : null].filter(Boolean).join(', ');
    }
    case 'member.override':
      return changeWords(d.change);
    case 'forces.applied': {
      const rows = num(d.rows) ?? 0;
      const members = num(d.members) ?? 0;
      return `${plural(rows, 'row')} for ${plural(members, 'member')}${str(d.unit) ? ` (${str(d.unit)})` : ''}`;
    }
    case 'export.created':
      return `${shown(d.format).toUpperCase()} of ${plural(num(d.members) ?? 0, 'member')}: ${shown(d.filter)}`;
    case 'mail.critical-members': {
      const to = Array.isArray(d.addresses) ? d.addresses.join(', ') : shown(d.recipients);
      const files = Array.isArray(d.attachments) ? d.attachments.join(', ') : '';
      return `${plural(num(d.members) ?? 0, 'member')} to ${to}${files ? `; attached ${files}` : ''}`;
    }
    case 'project.created':
      return shown(d.name);
    case 'project.updated':
      return d.after && typeof d.after === 'object' ? `Changed ${Object.keys(d.after).join(', ')}` : '';
    default:
      return Object.entries(d)
        .map(([k, v]) => `${k}: ${typeof v === 'object' ? JSON.stringify(v) : shown(v)}`)
        .join('; ');
  }
}
