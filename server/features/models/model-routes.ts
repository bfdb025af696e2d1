import { Router } from 'express';
import { rm } from 'node:fs/promises';
import type { Sequelize } from 'sequelize';
import { uploadFieldsSchema } from '@shared/api/models';
import type { AppConfig } from '../../config/config';
import type { FileStore } from '../../storage/file-store';
import { parseBody, parseId } from '../../http/validate';
import { currentUser, requireRole, requireSignedIn } from '../../http/require-user';
import { findEditableProject, findVisibleProject } from '../projects/project-policy';
import type { HashedFileInfo } from '../uploads/hashing-disk-storage';
import { uploadMiddleware } from '../uploads/upload-middleware';
import { acceptUpload } from '../uploads/upload-service';
import { uploadErrors } from '../uploads/sniff-upload';
import { findModel, findRevision, listModels, listRevisions, presentRevisions } from './model-service';

/** Models, revisions and uploads of one project: /api/projects/:projectId/... */
export function modelRoutes(sequelize: Sequelize, config: AppConfig, store: FileStore, onQueued: () => void): Router {
  const router = Router({ mergeParams: true });
  router.use(requireSignedIn);
  const projectIdOf = (params: Record<string, unknown>) => parseId(params.projectId, 'That project');

  router.get('/models', async (req, res) => {
    const project = await findVisibleProject(currentUser(req), projectIdOf(req.params));
    res.json({ models: await listModels(project.id) });
  });

  router.get('/models/:modelId/revisions', async (req, res) => {
    const project = await findVisibleProject(currentUser(req), projectIdOf(req.params));
    const model = await findModel(project.id, parseId(req.params.modelId, 'That model'));
    res.json({ revisions: await listRevisions(model.id) });
  });

  router.get('/revisions/:revisionId', async (req, res) => {
    const project = await findVisibleProject(currentUser(req), projectIdOf(req.params));
    const revision = await findRevision(project.id, parseId(req.params.revisionId, 'That revision'));
    res.json((await presentRevisions([revision]))[0]);
  });

  // Authorise before multer reads a byte of the body.
  router.post(
    '/uploads',
    requireRole('admin', 'engineer'),
    async (req, _res, next) => {
      await findEditableProject(currentUser(req), projectIdOf(req.params));
      next();
    },
    uploadMiddleware(config),
    async (req, res) => {
      const project = await findEditableProject(currentUser(req), projectIdOf(req.params));
      if (!req.file) throw uploadErrors.missing();
      let fields;
      try {
        fields = parseBody(uploadFieldsSchema, { modelName: req.body?.modelName || undefined });
      } catch (err) {
        await rm(req.file.path, { force: true });
        throw err;
      }
      const outcome = await acceptUpload(
        sequelize,
        store,
        currentUser(req),
        project,
        { path: req.file.path, originalName: req.file.originalname, size: req.file.size, sha256: (req.file as Express.Multer.File & HashedFileInfo).sha256 },
        fields.modelName,
      );
      if (!outcome.duplicateOf) onQueued();
      const [revision] = await presentRevisions([outcome.revision]);
      res.status(outcome.duplicateOf ? 200 : 201).json({ revision, duplicateOf: outcome.duplicateOf });
    },
  );

  return router;
}
