import { Router } from 'express';
import { z } from 'zod';
import { parseBody, parseId } from '../../http/validate';
import { currentUser, requireSignedIn } from '../../http/require-user';
import { findVisibleProject } from '../projects/project-policy';
import { findRevision } from '../models/model-service';
import { IfcModelModel } from '../../db/models/ifc-model';
import { compareStoredRevisions } from './compare-service';
import { comparisonCsv } from './compare-csv';

const querySchema = z.object({
  /** The earlier revision to compare with. */
  with: z.coerce.number().int().positive(),
  format: z.enum(['json', 'csv']).default('json'),
});

/** GET /api/projects/:projectId/revisions/:revisionId/comparison?with=<earlier revision id>[&format=csv] */
export function compareRoutes(): Router {
  const router = Router({ mergeParams: true });
  router.use(requireSignedIn);
  router.get('/', async (req, res) => {
    const params = req.params as Record<string, string>;
    const project = await findVisibleProject(currentUser(req), parseId(params.projectId, 'That project'));
    const after = await findRevision(project.id, parseId(params.revisionId, 'That revision'));
    const q = parseBody(querySchema, req.query);
    const before = await findRevision(project.id, q.with);
    const comparison = await compareStoredRevisions(before, after);
    if (q.format === 'json') {
      res.json({ before: { id: before.id, number: before.number }, after: { id: after.id, number: after.number }, ...comparison });
      return;
    }
    const model = await IfcModelModel.findByPk(after.modelId, { attributes: ['name'] });
    const name = (model?.name ?? 'model').replace(/[^A-Za-z0-9_-]+/g, '-').slice(0, 60);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${name}-r${before.number}-to-r${after.number}-changes.csv"`);
    res.send(comparisonCsv(comparison, { model: model?.name ?? '', before: before.number, after: after.number, standard: after.standard, exportedAt: new Date().toISOString() }));
  });
  return router;
}
