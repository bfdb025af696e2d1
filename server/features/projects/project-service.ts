import { fn, col, type Sequelize } from 'sequelize';
import type { SessionUser } from '@shared/api/session';
import type { CreateProjectRequest, UpdateProjectRequest } from '@shared/api/projects';
import { ProjectModel } from '../../db/models/project';
import { ProjectMemberModel } from '../../db/models/project-member';
import { UserModel } from '../../db/models/user';
import { AuditEntryModel } from '../../db/models/audit-entry';
import { errors } from '../../http/errors';

/** Member counts for several projects in one query. */
export async function peopleCounts(projectIds: number[]): Promise<Map<number, number>> {
  if (!projectIds.length) return new Map();
  const rows = (await ProjectMemberModel.findAll({
    attributes: ['projectId', [fn('COUNT', col('user_id')), 'n']],
    where: { projectId: projectIds },
    group: ['projectId'],
    raw: true,
  })) as unknown as { projectId: number; n: number | string }[];
  return new Map(rows.map((r) => [Number(r.projectId), Number(r.n)]));
}

export async function listVisibleProjects(user: SessionUser): Promise<ProjectModel[]> {
  if (user.role === 'admin') return ProjectModel.findAll({ order: [['name', 'ASC']] });
  const memberships = await ProjectMemberModel.findAll({ where: { userId: user.id }, attributes: ['projectId'] });
  return ProjectModel.findAll({ where: { id: memberships.map((m) => m.projectId) }, order: [['name', 'ASC']] });
}

/** Creates a project; the creator becomes its first member. */
export async function createProject(sequelize: Sequelize, user: SessionUser, input: CreateProjectRequest): Promise<ProjectModel> {
  return sequelize.transaction(async (transaction) => {
    const project = await ProjectModel.create(
      {
        name: input.name,
        description: input.description ?? '',
        standard: input.standard ?? 'as4100',
        defaultGrade: input.defaultGrade ?? 'AS/NZS 3679.1-300',
        createdById: user.id,
      },
      { transaction },
    );
    await ProjectMemberModel.create({ projectId: project.id, userId: user.id }, { transaction });
    await AuditEntryModel.create(
      { actorId: user.id, projectId: project.id, action: 'project.created', subject: `project:${project.id}`, detail: { name: project.name }, reason: null },
      { transaction },
    );
    return project;
  });
}

export async function updateProject(sequelize: Sequelize, user: SessionUser, project: ProjectModel, input: UpdateProjectRequest): Promise<ProjectModel> {
  return sequelize.transaction(async (transaction) => {
    const before = { name: project.name, description: project.description, standard: project.standard, defaultGrade: project.defaultGrade };
    project.set(input);
    await project.save({ transaction });
    await AuditEntryModel.create(
      { actorId: user.id, projectId: project.id, action: 'project.updated', subject: `project:${project.id}`, detail: { before, after: input }, reason: null },
      { transaction },
    );
    return project;
  });
}

export async function listProjectMembers(projectId: number): Promise<{ user: UserModel; addedAt: Date }[]> {
  const rows = await ProjectMemberModel.findAll({ where: { projectId }, include: [{ model: UserModel, as: 'user' }], order: [['createdAt', 'ASC']] });
  return rows.map((r) => ({ user: (r as unknown as { user: UserModel }).user, addedAt: r.createdAt }));
}

export async function addProjectMember(sequelize: Sequelize, actorId: number, projectId: number, userId: number): Promise<void> {
  const user = await UserModel.findByPk(userId);
  if (!user) throw errors.notFound('That person');
  await sequelize.transaction(async (transaction) => {
    const [, created] = await ProjectMemberModel.findOrCreate({ where: { projectId, userId }, transaction });
    if (created) {
      await AuditEntryModel.create(
        { actorId, projectId, action: 'project.member-added', subject: `user:${userId}`, detail: { email: user.email }, reason: null },
        { transaction },
      );
    }
  });
}

export async function removeProjectMember(sequelize: Sequelize, actorId: number, projectId: number, userId: number): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const removed = await ProjectMemberModel.destroy({ where: { projectId, userId }, transaction });
    if (!removed) throw errors.notFound('That membership');
    await AuditEntryModel.create(
      { actorId, projectId, action: 'project.member-removed', subject: `user:${userId}`, detail: {}, reason: null },
      { transaction },
    );
  });
}
