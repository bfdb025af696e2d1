import express, { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { memberQuerySchema, forcesUploadSchema } from '@shared/api/members';
import { memberOverrideRequestSchema } from '@shared/api/overrides';
import { parseBody, parseId } from '../../http/validate';
import { currentUser, requireRole, requireSignedIn } from '../../http/require-user';
import { findEditableProject } from '../projects/project-policy';
import { findRevision } from '../models/model-service';
import { findRequestedRevision, findVisibleRevision } from '../models/visible-revision';
import { errors } from '../../http/errors';
import { listMembersJson, revisionOverview } from './member-service';
import { GLOBAL_ID, memberSheetJson, memberSheetJsonReadAhead } from './member-sheet-read';
import { applyForcesCsv } from './forces-service';
import { memberAudit, overrideMember } from './override-service';
import { presentMemberRow } from './member-presenter';

/** Members and results of one revision: /api/projects/:projectId/revisions/:revisionId/... */
export function memberRoutes(sequelize: Sequelize): Router {
  const router = Router({ mergeParams: true });
  router.use(requireSignedIn);

  const visibleRevision = async (req: express.Request) => ({ revision: await findRequestedRevision(req) });

  router.get('/members', async (req, res) => {
    const { revision } = await visibleRevision(req);
    res.type('json').send(await listMembersJson(revision, parseBody(memberQuerySchema, req.query)));
  });

  router.get('/overview', async (req, res) => {
    const { revision } = await visibleRevision(req);
    res.json(await revisionOverview(revision.id));
  });

  router.get('/members/:globalId', async (req, res) => {
    const user = currentUser(req);
    const params = req.params as Record<string, string>;
    const projectId = parseId(params.projectId, 'That project');
    const revisionId = parseId(params.revisionId, 'That revision');
    const globalId = String(params.globalId);
    // Usually read with the session; else the sheet checks access in its own query. When it
    // finds nothing, the usual lookup says what is missing.
    const json = GLOBAL_ID.test(globalId)
      ? (memberSheetJsonReadAhead(req, user, projectId, revisionId, globalId) ?? (await memberSheetJson(user, projectId, revisionId, globalId)))
      : null;
    if (json === null) {
      await findVisibleRevision(user, projectId, revisionId);
      throw errors.notFound('That member');
    }
    res.type('json').send(json);
  });

  router.get('/members/:globalId/audit', async (req, res) => {
    const { revision } = await visibleRevision(req);
    res.json({ entries: await memberAudit(revision.id, String(req.params.globalId)) });
  });

  router.patch('/members/:globalId/overrides', requireRole('admin', 'engineer'), async (req, res) => {
    const user = currentUser(req);
    const project = await findEditableProject(user, parseId(req.params.projectId, 'That project'));
    const revision = await findRevision(project.id, parseId(req.params.revisionId, 'That revision'));
    const body = parseBody(memberOverrideRequestSchema, req.body);
    const member = await overrideMember(sequelize, user, project.id, revision, String(req.params.globalId), body);
    res.json(presentMemberRow(member));
  });

  router.post('/forces', requireRole('admin', 'engineer'), express.json({ limit: '25mb' }), async (req, res) => {
    const user = currentUser(req);
    const project = await findEditableProject(user, parseId(req.params.projectId, 'That project'));
    const revision = await findRevision(project.id, parseId(req.params.revisionId, 'That revision'));
    if (revision.status !== 'done') throw errors.conflict('Forces can be applied once the revision has been imported.');
    const body = parseBody(forcesUploadSchema, req.body);
    res.json(await applyForcesCsv(sequelize, user.id, project.id, revision, body.csv));
  });

  return router;
}
