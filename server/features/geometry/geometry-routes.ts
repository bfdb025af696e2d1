import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import { pipeline } from 'node:stream/promises';
import express, { Router } from 'express';
import { parseId } from '../../http/validate';
import { currentUser, requireSignedIn } from '../../http/require-user';
import { AppError } from '../../http/errors';
import { findVisibleProject } from '../projects/project-policy';
import { findRevision } from '../models/model-service';
import type { FileStore } from '../../storage/file-store';
import { geometryKey } from './geometry-key';

/** Stable error id when a revision has no display geometry (not imported yet, or it failed). */
export const GEOMETRY_UNAVAILABLE = 'geometry.unavailable';
/** The results are stored and the geometry is still being built: ask again shortly. */
export const GEOMETRY_PENDING = 'geometry.pending';

/**
 * GET /api/projects/:projectId/revisions/:revisionId/geometry — the revision's display
 * geometry file (shared/geometry/display-geometry-format.ts) for any project member,
 * viewers included. The file never changes once written, so it carries a strong ETag
 * (SHA-256 of the content) and may be cached for a year.
 */
export function geometryRoutes(store: FileStore): Router {
  const router = Router({ mergeParams: true });
  router.use(requireSignedIn);
  // Content hashes by storage key: a key's content is fixed once the import has written it.
  const etags = new Map<string, string>();

  router.get('/', async (req: express.Request, res: express.Response) => {
    const project = await findVisibleProject(currentUser(req), parseId(req.params.projectId, 'That project'));
    const revision = await findRevision(project.id, parseId(req.params.revisionId, 'That revision'));
    const key = geometryKey(revision.id);
    const unavailable = () => new AppError(404, GEOMETRY_UNAVAILABLE, revision.status === 'done' ? 'This revision has no 3D view.' : 'The 3D view is prepared when the import has finished.');
    if ((revision.summary as { geometry?: string } | null)?.geometry === 'pending') {
      throw new AppError(404, GEOMETRY_PENDING, 'The 3D view is being prepared; the results are ready already.');
    }
    if (revision.status !== 'done' || !(await store.exists(key))) throw unavailable();

    const cached = etags.get(key);
    if (cached && ifNoneMatch(req, cached)) {
      res.setHeader('ETag', cached);
      res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
      res.status(304).end();
      return;
    }
    let local: { path: string; release(): Promise<void> };
    try {
      local = await store.fetchToLocal(key);
    } catch {
      throw unavailable();
    }
    try {
      let etag = cached;
      if (!etag) {
        etag = `"${await sha256(local.path)}"`;
        if (etags.size > 2000) etags.delete(etags.keys().next().value as string);
        etags.set(key, etag);
      }
      res.setHeader('ETag', etag);
      res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
      if (ifNoneMatch(req, etag)) {
        res.status(304).end();
        return;
      }
      res.setHeader('Content-Type', 'application/octet-stream');
      res.setHeader('Content-Length', String((await stat(local.path)).size));
      // The client may go away mid-way; nothing to report then.
      await pipeline(createReadStream(local.path), res).catch(() => undefined);
    } finally {
      await local.release().catch(() => undefined);
    }
  });

  return router;
}

function ifNoneMatch(req: express.Request, etag: string): boolean {
  const header = req.headers['if-none-match'];
  if (!header) return false;
  return header.split(',').some((t) => t.trim() === etag || t.trim() === '*');
}

function sha256(filePath: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const hash = createHash('sha256');
    createReadStream(filePath)
      .on('data', (chunk) => hash.update(chunk))
      .on('error', reject)
      .on('end', () => resolve(hash.digest('base64url')));
  });
}
