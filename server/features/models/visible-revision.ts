import type { Request } from 'express';
import type { SessionUser } from '@shared/api/session';
import { currentUser } from '../../http/require-user';
import { takeVisibleRevision } from '../../http/request-read-ahead';
import { parseId } from '../../http/validate';
import { RevisionModel } from '../../db/models/revision';
import { plainRead } from '../../db/plain-read';
import { findVisibleProject } from '../projects/project-policy';
import { findRevision } from './model-service';

export type RevisionRef = Pick<RevisionModel, 'id' | 'modelId' | 'number' | 'standard' | 'fileName' | 'status' | 'resultsVersion'>;

/**
 * A revision through a project the caller may see, in one query: the hot path of the
 * member table and sheet. Only the columns those routes use are read.
 * When nothing matches, the step-by-step lookup runs to give the same "not found" answer
 * (project or revision) as every other route.
 */
export async function findVisibleRevision(user: SessionUser, projectId: number, revisionId: number): Promise<RevisionRef> {
  // One fixed statement (the revision, if its project is visible to the caller): this runs on every table page and sheet.
  const [[revision]] = await plainRead<[RevisionRef[]]>(RevisionModel.sequelize!, [
    {
      sql: `SELECT r.id, r.model_id AS modelId, r.number, r.standard, r.file_name AS fileName, r.status, r.results_version AS resultsVersion
            FROM revisions r JOIN models m ON m.id = r.model_id
            WHERE r.id = ? AND m.project_id = ?
              AND (? OR EXISTS (SELECT 1 FROM project_members pm WHERE pm.project_id = m.project_id AND pm.user_id = ?))`,
      values: [revisionId, projectId, user.role === 'admin', user.id],
    },
  ]);
  if (revision) return revision;
  const project = await findVisibleProject(user, projectId);
  return findRevision(project.id, revisionId);
}

/**
 * The revision named by the request's :projectId and :revisionId, through a project the
 * signed-in caller may see. Usually already read with the session (http/request-read-ahead.ts);
 * otherwise, and for every "not found", the lookup above.
 */
export async function findRequestedRevision(req: Request): Promise<RevisionRef> {
  const user = currentUser(req);
  const params = req.params as Record<string, string>;
  const projectId = parseId(params.projectId, 'That project');
  const revisionId = parseId(params.revisionId, 'That revision');
  return takeVisibleRevision(req, user.id, projectId, revisionId) ?? findVisibleRevision(user, projectId, revisionId);
}
