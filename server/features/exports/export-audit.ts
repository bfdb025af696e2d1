import type { SessionUser } from '@shared/api/session';
import { AuditEntryModel } from '../../db/models/audit-entry';
import type { RevisionModel } from '../../db/models/revision';
import type { ExportFormat } from '../../exports/export-format-info';

/**
 * Records an export in the project log. Called only once the file has been written, so an
 * export that fails leaves no entry; it is written before the file is sent, so every file
 * that leaves the server has its entry.
 */
export async function recordExport(
  user: SessionUser,
  projectId: number,
  revision: RevisionModel,
  what: { format: ExportFormat; fileName: string; filterDescription: string; members: number; bytes: number },
): Promise<void> {
  await AuditEntryModel.create({
    actorId: user.id,
    projectId,
    action: 'export.created',
    subject: `revision:${revision.id}`,
    detail: { format: what.format, revision: revision.number, fileName: what.fileName, filter: what.filterDescription, members: what.members, bytes: what.bytes },
    reason: null,
  });
}
