import { Op, literal } from 'sequelize';
import type { SessionUser } from '@shared/api/session';
import { RevisionModel } from '../../db/models/revision';
import { findVisibleProject } from '../projects/project-policy';
import { findRevision } from './model-service';

/**
 * A revision through a project the caller may see, in one query: the hot path of the
 * member table and sheet. The stored summary (import warnings, possibly large) is left out.
 * When nothing matches, the step-by-step lookup runs to give the same "not found" answer
 * (project or revision) as every other route.
 */
export type RevisionRef = Pick<RevisionModel, 'id' | 'modelId' | 'number' | 'standard' | 'fileName' | 'status' | 'resultsVersion'>;

const REF_ATTRIBUTES = ['id', 'modelId', 'number', 'standard', 'fileName', 'status', 'resultsVersion'] as const;

export async function findVisibleRevision(user: SessionUser, projectId: number, revisionId: number): Promise<RevisionRef> {
  // Both ids are parsed integers and the user id comes from the session; escape anyway.
  const esc = (n: number) => RevisionModel.sequelize!.escape(n);
  const member = user.role === 'admin' ? '' : ` AND EXISTS (SELECT 1 FROM project_members pm WHERE pm.project_id = m.project_id AND pm.user_id = ${esc(user.id)})`;
  const visible = literal(`EXISTS (SELECT 1 FROM models m WHERE m.id = \`Revision\`.\`model_id\` AND m.project_id = ${esc(projectId)}${member})`);
  // Plain values, not a model instance: this runs on every table page and sheet.
  const revision = (await RevisionModel.findOne({ where: { [Op.and]: [{ id: revisionId }, visible] }, attributes: [...REF_ATTRIBUTES], raw: true })) as RevisionRef | null;
  if (revision) return revision;
  const project = await findVisibleProject(user, projectId);
  return findRevision(project.id, revisionId);
}
