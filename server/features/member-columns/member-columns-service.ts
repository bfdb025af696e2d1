import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';
import { encodeMemberColumns } from '@shared/api/member-columns';
import type { RevisionModel } from '../../db/models/revision';
import { cachedMemberRows } from '../members/member-table-cache';

const gzipAsync = promisify(gzip);

/** A revision's member columns ready to send: JSON, the same gzipped, and a strong ETag of the JSON. */
export interface EncodedColumns {
  json: Buffer;
  gzip: Buffer;
  etag: string;
}

interface Held {
  version: number;
  body: Promise<EncodedColumns>;
}

/** Revisions kept; about 0.3 MB each at 20,000 members (JSON plus gzip). */
const KEEP = 12;
const held = new Map<number, Held>();

/**
 * Every member of the revision as columns (shared/api/member-columns.ts), built once per
 * `resultsVersion` — the counter that moves inside every transaction that changes results
 * (import stored, forces applied, an override), so several app processes sharing one database
 * never serve stale colours. The version is read before the rows, so rows are never older than
 * their label.
 */
export function memberColumnsOf(revision: Pick<RevisionModel, 'id' | 'resultsVersion'>): Promise<EncodedColumns> {
  const have = held.get(revision.id);
  if (have && have.version === revision.resultsVersion) {
    held.delete(revision.id);
    held.set(revision.id, have);
    return have.body;
  }
  const entry: Held = { version: revision.resultsVersion, body: build(revision.id, revision.resultsVersion) };
  // A failed build must not stay cached.
  entry.body.catch(() => held.get(revision.id) === entry && held.delete(revision.id));
  held.delete(revision.id);
  held.set(revision.id, entry);
  while (held.size > KEEP) held.delete(held.keys().next().value as number);
  return entry.body;
}

/** Built from the member table's copy in memory (member-table-cache.ts): the rows are read from MariaDB once for both. */
async function build(revisionId: number, resultsVersion: number): Promise<EncodedColumns> {
  const rows = await cachedMemberRows(revisionId, resultsVersion);
  const json = Buffer.from(JSON.stringify(encodeMemberColumns(rows)));
  const etag = `"${createHash('sha256').update(json).digest('base64url')}"`;
  return { json, gzip: await gzipAsync(json, { level: 6 }), etag };
}

/** Forgets every copy (tests). */
export function clearMemberColumnsCache(): void {
  held.clear();
}
