import { projectLogKindOf, type ProjectLogEntry, type ProjectLogPage } from '@shared/api/project-log';
import type { AuditEntryModel } from '../../db/models/audit-entry';
import { parseSubject, type ProjectLogQuery, type ProjectLogRows } from './project-log-service';

/** The driver may hand JSON columns back as text. */
function detailOf(entry: AuditEntryModel): Record<string, unknown> {
  const raw: unknown = typeof entry.detail === 'string' ? JSON.parse(entry.detail) : entry.detail;
  return raw && typeof raw === 'object' && !Array.isArray(raw) ? (raw as Record<string, unknown>) : {};
}

function subjectWords(entry: AuditEntryModel, detail: Record<string, unknown>, rows: ProjectLogRows): Pick<ProjectLogEntry, 'subject' | 'revisionNumber' | 'globalId'> {
  const s = parseSubject(entry.subject);
  const revision = s.id != null && (s.type === 'revision' || s.type === 'member') ? rows.revisions.get(s.id) : undefined;
  const revisionWords = revision ? `${revision.modelName}, revision ${revision.number}` : 'a revision no longer stored';
  switch (s.type) {
    case 'revision':
      return { subject: revisionWords, revisionNumber: revision?.number ?? null, globalId: null };
    case 'member':
      return { subject: `member ${s.globalId ?? '?'} in ${revisionWords}`, revisionNumber: revision?.number ?? null, globalId: s.globalId };
    case 'user': {
      const person = s.id != null ? rows.people.get(s.id) : undefined;
      const email = typeof detail.email === 'string' ? detail.email : null;
      return { subject: person ? `${person.name} (${person.email})` : (email ?? 'a person no longer stored'), revisionNumber: null, globalId: null };
    }
    case 'project':
      return { subject: 'this project', revisionNumber: null, globalId: null };
    default:
      return { subject: entry.subject, revisionNumber: null, globalId: null };
  }
}

export function presentProjectLog(rows: ProjectLogRows, q: ProjectLogQuery): ProjectLogPage {
  return {
    total: rows.total,
    page: q.page,
    pageSize: q.pageSize,
    entries: rows.entries.map((e) => {
      const detail = detailOf(e);
      return {
        id: e.id,
        at: e.createdAt.toISOString(),
        by: e.actorId != null ? (rows.people.get(e.actorId) ?? null) : null,
        action: e.action,
        kind: projectLogKindOf(e.action),
        ...subjectWords(e, detail, rows),
        detail,
        reason: e.reason,
      };
    }),
  };
}
