import express, { Router } from 'express';
import { requireSignedIn } from '../../http/require-user';
import { acceptsGzip, ifNoneMatch } from '../../http/conditional';
import { findRequestedRevision } from '../models/visible-revision';
import { memberColumnsOf } from './member-columns-service';

/**
 * GET /api/projects/:projectId/revisions/:revisionId/member-columns — every member of the
 * revision in one compact answer (shared/api/member-columns.ts) for the 3D view, for any
 * project member. The body changes whenever results do, so it is revalidated on every use
 * (no-cache + strong ETag → 304), and sent gzipped when the client takes it.
 */
export function memberColumnsRoutes(): Router {
  const router = Router({ mergeParams: true });
  router.use(requireSignedIn);

  router.get('/', async (req: express.Request, res: express.Response) => {
    const revision = await findRequestedRevision(req);
    const body = await memberColumnsOf(revision);
    res.setHeader('ETag', body.etag);
    res.setHeader('Cache-Control', 'private, no-cache');
    res.setHeader('Vary', 'Accept-Encoding');
    if (ifNoneMatch(req, body.etag)) {
      res.status(304).end();
      return;
    }
    res.type('application/json');
    const gzipped = acceptsGzip(req);
    if (gzipped) res.setHeader('Content-Encoding', 'gzip');
    res.setHeader('Content-Length', String(gzipped ? body.gzip.length : body.json.length));
    res.end(gzipped ? body.gzip : body.json);
  });

  return router;
}
