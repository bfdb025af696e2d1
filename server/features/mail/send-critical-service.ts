import { mkdir, rm, writeFile } from 'node:fs/promises';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import type { z } from 'zod';
import type { Sequelize, Transaction } from 'sequelize';
import { memberQuerySchema } from '@shared/api/members';
import type { sendCriticalRequestSchema } from '@shared/api/mail';
import type { SessionUser } from '@shared/api/session';
import type { AppConfig } from '../../config/config';
import type { ProjectModel } from '../../db/models/project';
import type { RevisionModel } from '../../db/models/revision';
import type { StoredAttachment } from '../../db/models/mail-message';
import { AuditEntryModel } from '../../db/models/audit-entry';
import { errors } from '../../http/errors';
import { validateRecipients, type MailService } from '../../mail/mail-service';
import { criticalMembersMail } from '../../mail/templates';
import { loadExportBundle } from '../exports/export-service';
import { exportFileName } from '../exports/export-query';
import { FORMAT_INFO } from '../../exports/export-format-info';
import { writeExportInWorker } from '../../exports/export-pool';

/**
 * Sends the critical members of a revision (CSV and/or PDF attached) to project members
 * and typed addresses. The files are written once and kept with the queued message, so a
 * mail service that is down delays the message but loses nothing. The message and its
 * project-log entry are stored in one transaction: one never exists without the other.
 */
export async function sendCriticalMembers(
  sequelize: Sequelize,
  config: AppConfig,
  mail: MailService,
  user: SessionUser,
  project: ProjectModel,
  revision: RevisionModel,
  req: z.output<typeof sendCriticalRequestSchema>,
): Promise<{ mailId: number; members: number }> {
  const to = validateRecipients(req.recipients);
  const query = memberQuerySchema.parse({ scope: 'tension', minUtilisation: req.minUtilisation, sort: 'utilisation', dir: 'desc' });
  const bundle = await loadExportBundle(project, revision, query);
  if (!bundle.members.length) throw errors.validation(`No member of revision ${revision.number} has a utilisation of ${req.minUtilisation} or more; nothing to send.`);
  const dir = path.resolve(config.dataDir, 'mail-attachments');
  await mkdir(dir, { recursive: true });
  const attachments: StoredAttachment[] = [];
  for (const format of req.attach) {
    const bytes = await writeExportInWorker(format, bundle);
    const filename = exportFileName(bundle.modelName, revision.number, query, FORMAT_INFO[format].extension);
    const file = path.join(dir, `${randomBytes(8).toString('hex')}-${filename}`);
    await writeFile(file, bytes);
    attachments.push({ filename, contentType: FORMAT_INFO[format].contentType, path: file });
  }
  const { subject, text } = criticalMembersMail({
    sender: user.name,
    projectName: project.name,
    modelName: bundle.modelName,
    revisionNumber: revision.number,
    standard: revision.standard,
    message: req.message,
    count: bundle.members.length,
    filter: bundle.filterDescription,
    link: `${config.publicUrl}/projects/${project.id}/revisions/${revision.id}`,
  });
  const row = await queueWithLogEntry(sequelize, attachments, async (transaction) => {
    const queued = await mail.enqueue({ kind: 'critical-members', to, subject, text, attachments, projectId: project.id, createdById: user.id }, transaction);
    await AuditEntryModel.create(
      {
        actorId: user.id,
        projectId: project.id,
        action: 'mail.critical-members',
        subject: `revision:${revision.id}`,
        detail: {
          mailId: queued.id,
          revision: revision.number,
          recipients: to.length,
          addresses: to,
          attachments: attachments.map((a) => a.filename),
          members: bundle.members.length,
          minUtilisation: req.minUtilisation,
        },
        reason: null,
      },
      { transaction },
    );
    return queued;
  });
  return { mailId: row.id, members: bundle.members.length };
}

/** Runs the queueing transaction; if it fails, the attachment files written for it are removed. */
async function queueWithLogEntry<T>(sequelize: Sequelize, attachments: StoredAttachment[], work: (transaction: Transaction) => Promise<T>): Promise<T> {
  try {
    return await sequelize.transaction(work);
  } catch (err) {
    await Promise.all(attachments.map((a) => rm(a.path, { force: true })));
    throw err;
  }
}
