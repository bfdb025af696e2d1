import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { memberQuerySchema } from '@shared/api/members';
import type { FileStore } from '../../storage/file-store';
import { parseBody, parseId } from '../../http/validate';
import { currentUser, requireRole, requireSignedIn } from '../../http/require-user';
import { errors } from '../../http/errors';
import { findVisibleProject } from '../projects/project-policy';
import { findRevision } from '../models/model-service';
import { EXPORT_FORMATS, FORMAT_INFO } from '../../exports/export-format-info';
import { writeExportInWorker } from '../../exports/export-pool';
import { effectiveQuery, exportFileName } from './export-query';
import { loadExportBundle, revisionIfcBytes } from './export-service';
import { recordExport } from './export-audit';

const formatSchema = z.enum(EXPORT_FORMATS);

/**
 * Exports of checked members: /api/projects/:projectId/revisions/:revisionId/exports/:format.
 * Engineers and admins only (exports feed redesign); the member-table filters apply.
 */
export function exportRoutes(_sequelize: Sequelize, store: FileStore): Router {
  const router = Router({ mergeParams: true });
  router.use(requireSignedIn);

  router.get('/:format', requireRole('admin', 'engineer'), async (req, res) => {
    const parsed = formatSchema.safeParse(req.params.format);
    if (!parsed.success) throw errors.notFound('That export format');
    const format = parsed.data;
    const user = currentUser(req);
    const project = await findVisibleProject(user, parseId(req.params.projectId, 'That project'));
    const revision = await findRevision(project.id, parseId(req.params.revisionId, 'That revision'));
    const query = effectiveQuery(format, parseBody(memberQuerySchema, req.query));
    const bundle = await loadExportBundle(project, revision, query);
    const modelBytes = format === 'ifc' ? await revisionIfcBytes(store, revision) : undefined;
    const body = await writeExportInWorker(format, bundle, modelBytes);
    const info = FORMAT_INFO[format];
    const fileName = exportFileName(bundle.modelName, revision.number, query, info.extension);
    await recordExport(user, project.id, revision, { format, fileName, filterDescription: bundle.filterDescription, members: bundle.members.length, bytes: body.length });
    res.setHeader('Content-Type', info.contentType);
    res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader('X-Gaugeline-Members', String(bundle.members.length));
    res.send(body);
  });

  return router;
}
