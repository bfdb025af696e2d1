import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { createProjectRequestSchema, updateProjectRequestSchema } from '@shared/api/projects';
import { parseBody, parseId } from '../../http/validate';
import { currentUser, requireRole, requireSignedIn } from '../../http/require-user';
import { findEditableProject, findVisibleProject } from './project-policy';
import { presentProject, presentProjectMember } from './project-presenter';
import {
  addProjectMember,
  createProject,
  listProjectMembers,
  listVisibleProjects,
  peopleCounts,
  removeProjectMember,
  updateProject,
} from './project-service';

export function projectRoutes(sequelize: Sequelize): Router {
  const router = Router();
  router.use(requireSignedIn);

  router.get('/', async (req, res) => {
    const projects = await listVisibleProjects(currentUser(req));
    const counts = await peopleCounts(projects.map((p) => p.id));
    res.json({ projects: projects.map((p) => presentProject(p, counts.get(p.id) ?? 0)) });
  });

  router.post('/', requireRole('admin', 'engineer'), async (req, res) => {
    const input = parseBody(createProjectRequestSchema, req.body);
    const project = await createProject(sequelize, currentUser(req), input);
    res.status(201).json(presentProject(project, 1));
  });

  router.get('/:projectId', async (req, res) => {
    const project = await findVisibleProject(currentUser(req), parseId(req.params.projectId, 'That project'));
    const counts = await peopleCounts([project.id]);
    res.json(presentProject(project, counts.get(project.id) ?? 0));
  });

  router.patch('/:projectId', requireRole('admin', 'engineer'), async (req, res) => {
    const user = currentUser(req);
    const project = await findEditableProject(user, parseId(req.params.projectId, 'That project'));
    const input = parseBody(updateProjectRequestSchema, req.body);
    const updated = await updateProject(sequelize, user, project, input);
    const counts = await peopleCounts([project.id]);
    res.json(presentProject(updated, counts.get(project.id) ?? 0));
  });

  router.get('/:projectId/members', async (req, res) => {
    const project = await findVisibleProject(currentUser(req), parseId(req.params.projectId, 'That project'));
    const members = await listProjectMembers(project.id);
    res.json({ members: members.map((m) => presentProjectMember(m.user, m.addedAt)) });
  });

  router.put('/:projectId/members/:userId', requireRole('admin'), async (req, res) => {
    const user = currentUser(req);
    const project = await findVisibleProject(user, parseId(req.params.projectId, 'That project'));
    await addProjectMember(sequelize, user.id, project.id, parseId(req.params.userId, 'That person'));
    res.status(204).end();
  });

  router.delete('/:projectId/members/:userId', requireRole('admin'), async (req, res) => {
    const user = currentUser(req);
    const project = await findVisibleProject(user, parseId(req.params.projectId, 'That project'));
    await removeProjectMember(sequelize, user.id, project.id, parseId(req.params.userId, 'That person'));
    res.status(204).end();
  });

  return router;
}
