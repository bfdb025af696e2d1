import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { sendCriticalRequestSchema } from '@shared/api/mail';
import type { AppConfig } from '../../config/config';
import type { MailService } from '../../mail/mail-service';
import { parseBody, parseId } from '../../http/validate';
import { currentUser, requireRole } from '../../http/require-user';
import { findEditableProject } from '../projects/project-policy';
import { findRevision } from '../models/model-service';
import { sendCriticalMembers } from './send-critical-service';

/** POST /api/projects/:projectId/revisions/:revisionId/send-critical (engineers and admins). */
export function sendCriticalRoutes(sequelize: Sequelize, config: AppConfig, mail: MailService): Router {
  const router = Router({ mergeParams: true });
  router.post('/', requireRole('admin', 'engineer'), async (req, res) => {
    const user = currentUser(req);
    const project = await findEditableProject(user, parseId(req.params.projectId, 'That project'));
    const revision = await findRevision(project.id, parseId(req.params.revisionId, 'That revision'));
    const body = parseBody(sendCriticalRequestSchema, req.body);
    const sent = await sendCriticalMembers(sequelize, config, mail, user, project, revision, body);
    res.status(202).json({ ...sent, message: `${sent.members} member(s) are queued for sending. If the mail service is down, the message waits and is tried again; nothing is lost.` });
  });
  return router;
}
