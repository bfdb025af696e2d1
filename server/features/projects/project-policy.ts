import type { SessionUser } from '@shared/api/session';
import { ProjectModel } from '../../db/models/project';
import { ProjectMemberModel } from '../../db/models/project-member';
import { errors } from '../../http/errors';

/**
 * Project visibility: admins see every project; everyone else only projects they
 * are members of. A project the caller may not see answers "not found", so ids
 * cannot be probed.
 */
export async function findVisibleProject(user: SessionUser, projectId: number): Promise<ProjectModel> {
  const project = await ProjectModel.findByPk(projectId);
  if (!project) throw errors.notFound('That project');
  if (user.role === 'admin') return project;
  const membership = await ProjectMemberModel.findOne({ where: { projectId, userId: user.id } });
  if (!membership) throw errors.notFound('That project');
  return project;
}

/** Changing a project's settings: admins, or engineers who are members. */
export async function findEditableProject(user: SessionUser, projectId: number): Promise<ProjectModel> {
  const project = await findVisibleProject(user, projectId);
  if (user.role === 'viewer') throw errors.forbidden('Viewers can browse projects but not change them.');
  return project;
}

/**
 * Reading the project log: admins, or engineers who are members. Outsiders get "not found"
 * first (as everywhere), so only a member viewer learns the log exists and is refused.
 */
export async function findLogReadableProject(user: SessionUser, projectId: number): Promise<ProjectModel> {
  const project = await findVisibleProject(user, projectId);
  if (user.role === 'viewer') throw errors.forbidden('The project log is for engineers and admins.');
  return project;
}
