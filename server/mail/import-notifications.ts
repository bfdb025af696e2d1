import type { AppConfig } from '../config/config';
import type { Logger } from '../logger';
import { RevisionModel } from '../db/models/revision';
import { IfcModelModel } from '../db/models/ifc-model';
import { ProjectModel } from '../db/models/project';
import { UserModel } from '../db/models/user';
import { MemberModel } from '../db/models/member';
import type { RevisionSummary } from '@shared/api/models';
import type { MailService } from './mail-service';
import { importFailedMail, importFinishedMail } from './templates';

/** Tells the uploader that an import finished or failed. Never throws: mail must not break imports. */
export async function notifyImportOutcome(mail: MailService, config: AppConfig, logger: Logger, revisionId: number): Promise<void> {
  try {
    const revision = await RevisionModel.findByPk(revisionId);
    if (!revision?.uploadedById || !['done', 'failed'].includes(revision.status)) return;
    const uploader = await UserModel.findByPk(revision.uploadedById);
    const model = await IfcModelModel.findByPk(revision.modelId);
    const project = model ? await ProjectModel.findByPk(model.projectId) : null;
    if (!uploader?.active || !model || !project) return;
    const projectLink = `${config.publicUrl}/projects/${project.id}`;
    if (revision.status === 'failed') {
      const m = importFailedMail({ projectName: project.name, modelName: model.name, revisionNumber: revision.number, reason: revision.failureMessage ?? 'unknown', link: projectLink });
      await mail.enqueue({ kind: 'import-failed', to: [uploader.email], ...m, projectId: project.id });
      return;
    }
    const summary = revision.summary as RevisionSummary | null;
    const count = (band: string) => MemberModel.count({ where: { revisionId, band, isTension: true } });
    const m = importFinishedMail({
      projectName: project.name,
      modelName: model.name,
      revisionNumber: revision.number,
      standard: revision.standard,
      link: `${projectLink}/revisions/${revision.id}`,
      tensionMembers: summary?.tensionMembers ?? 0,
      checked: summary?.checked ?? 0,
      over: await count('over'),
      tight: await count('tight'),
    });
    await mail.enqueue({ kind: 'import-finished', to: [uploader.email], ...m, projectId: project.id });
  } catch (err) {
    logger.warn(`import ${revisionId}: the notification could not be queued (${(err as Error).message})`);
  }
}
