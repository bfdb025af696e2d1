import type express from 'express';

/** True when the request's If-None-Match lists this ETag (or `*`). */
export function ifNoneMatch(req: express.Request, etag: string): boolean {
  const header = req.headers['if-none-match'];
  if (!header) return false;
  return header.split(',').some((t) => t.trim() === etag || t.trim() === '*');
}

/** True when the client takes a gzip body (Accept-Encoding, q-values honoured). */
export function acceptsGzip(req: express.Request): boolean {
  return req.acceptsEncodings('gzip', 'identity') === 'gzip';
}
