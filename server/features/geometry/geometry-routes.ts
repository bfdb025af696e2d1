import { createHash, randomBytes } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { createGzip } from 'node:zlib';
import express, { Router } from 'express';
import { parseId } from '../../http/validate';
import { currentUser, requireSignedIn } from '../../http/require-user';
import { AppError } from '../../http/errors';
import { findVisibleProject } from '../projects/project-policy';
import { findRevision } from '../models/model-service';
import type { FileStore } from '../../storage/file-store';
import { acceptsGzip, ifNoneMatch } from '../../http/conditional';
import { geometryGzipKey, geometryKey } from './geometry-key';

/** Stable error id when a revision has no display geometry (not imported yet, or it failed). */
export const GEOMETRY_UNAVAILABLE = 'geometry.unavailable';
/** The results are stored and the geometry is still being built: ask again shortly. */
export const GEOMETRY_PENDING = 'geometry.pending';

const CACHE_CONTROL = 'private, max-age=31536000, immutable';

/**
 * GET /api/projects/:projectId/revisions/:revisionId/geometry — the revision's display
 * geometry file (shared/geometry/display-geometry-format.ts) for any project member,
 * viewers included. The file never changes once written, so it carries a strong ETag
 * (SHA-256 of the bytes sent) and may be cached for a year; gzipped when the client takes it.
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

    // Clients that take gzip get the copy gzipped at import time (a third of the size for the demo
    // shed, an eighth for the 20,000-member benchmark); revisions imported before there was one
    // get it made for the next request.
    const gzip = acceptsGzip(req);
    const zipped = gzip && (await store.exists(geometryGzipKey(revision.id)));
    if (gzip && !zipped) compressLater(store, revision.id);
    const sendKey = zipped ? geometryGzipKey(revision.id) : key;
    res.setHeader('Vary', 'Accept-Encoding');

    const cached = etags.get(sendKey);
    if (cached && ifNoneMatch(req, cached)) {
      res.setHeader('ETag', cached);
      res.setHeader('Cache-Control', CACHE_CONTROL);
      res.status(304).end();
      return;
    }
    let local: { path: string; release(): Promise<void> };
    try {
      local = await store.fetchToLocal(sendKey);
    } catch {
      throw unavailable();
    }
    try {
      // A strong ETag per representation: the hash of the bytes sent (plain or gzipped).
      let etag = cached;
      if (!etag) {
        etag = `"${await sha256(local.path)}"`;
        if (etags.size > 2000) etags.delete(etags.keys().next().value as string);
        etags.set(sendKey, etag);
      }
      res.setHeader('ETag', etag);
      res.setHeader('Cache-Control', CACHE_CONTROL);
      if (ifNoneMatch(req, etag)) {
        res.status(304).end();
        return;
      }
      res.setHeader('Content-Type', 'application/octet-stream');
      if (zipped) res.setHeader('Content-Encoding', 'gzip');
      res.setHeader('Content-Length', String((await stat(local.path)).size));
      // The client may go away mid-way; nothing to report then.
      await pipeline(createReadStream(local.path, { highWaterMark: 1 << 20 }), res).catch(() => undefined);
    } finally {
      await local.release().catch(() => undefined);
    }
  });

  return router;
}

/** Revisions whose gzipped copy is being made in this process. */
const compressing = new Set<number>();

/**
 * Makes the gzipped copy of a revision's geometry in the background (zlib runs off the event
 * loop). A failure leaves no copy, and a later request tries again.
 */
function compressLater(store: FileStore, revisionId: number): void {
  if (compressing.has(revisionId)) return;
  compressing.add(revisionId);
  const tmp = path.join(tmpdir(), `gaugeline-geometry-${revisionId}-${randomBytes(4).toString('hex')}.gz`);
  void (async () => {
    const local = await store.fetchToLocal(geometryKey(revisionId));
    try {
      await pipeline(createReadStream(local.path), createGzip(), createWriteStream(tmp));
      await store.put(geometryGzipKey(revisionId), tmp);
    } finally {
      await local.release();
    }
  })()
    .catch(() => undefined)
    .finally(() => {
      compressing.delete(revisionId);
      void rm(tmp, { force: true }).catch(() => undefined);
    });
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
