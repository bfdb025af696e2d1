import type { Project, ProjectMember } from '@shared/api/projects';
import type { ProjectModel } from '../../db/models/project';
import type { UserModel } from '../../db/models/user';

export function presentProject(project: ProjectModel, peopleCount: number): Project {
  return {
    id: project.id,
    name: project.name,
    description: project.description,
    standard: project.standard,
    defaultGrade: project.defaultGrade,
    peopleCount,
    createdAt: project.createdAt.toISOString(),
    updatedAt: project.updatedAt.toISOString(),
  };
}

export function presentProjectMember(user: UserModel, addedAt: Date): ProjectMember {
  return { userId: user.id, email: user.email, name: user.name, role: user.role, addedAt: addedAt.toISOString() };
}
