import { Router } from 'express';
import { projectLogQuerySchema } from '@shared/api/project-log';
import { parseBody, parseId } from '../../http/validate';
import { currentUser, requireSignedIn } from '../../http/require-user';
import { findLogReadableProject } from '../projects/project-policy';
import { readProjectLog } from './project-log-service';
import { presentProjectLog } from './project-log-presenter';

/**
 * GET /api/projects/:projectId/audit: the project log, newest first, paged, optionally one
 * kind. Admins and the project's engineers; its viewers are refused, outsiders not told.
 */
export function projectLogRoutes(): Router {
  const router = Router({ mergeParams: true });
  router.use(requireSignedIn);
  router.get('/', async (req, res) => {
    const query = parseBody(projectLogQuerySchema, req.query);
    const project = await findLogReadableProject(currentUser(req), parseId((req.params as Record<string, string>).projectId, 'That project'));
    const rows = await readProjectLog(project.id, query);
    res.json(presentProjectLog(rows, query));
  });
  return router;
}
