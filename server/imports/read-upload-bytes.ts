import { open, readFile } from 'node:fs/promises';
import yauzl from 'yauzl';
import type { Entry, ZipFile } from 'yauzl';
import { ImportFailure } from './import-failure';

function openZip(path: string): Promise<ZipFile> {
  return new Promise((resolve, reject) =>
    yauzl.open(path, { lazyEntries: true, validateEntrySizes: true }, (err, zip) => (err || !zip ? reject(err ?? new Error('no zip')) : resolve(zip))),
  );
}

/** The first .ifc entry of the archive, inflated within a byte limit (a zip bomb stops at the limit). */
async function inflateIfcEntry(path: string, limitBytes: number, shared: boolean): Promise<Uint8Array> {
  let zip: ZipFile;
  try {
    zip = await openZip(path);
  } catch (err) {
    throw new ImportFailure('upload.bad-archive', `The .ifczip archive could not be opened (${(err as Error).message}).`);
  }
  try {
    const entry = await new Promise<Entry | null>((resolve, reject) => {
      zip.on('entry', (e: Entry) => (/\.ifc$/i.test(e.fileName) && !e.fileName.endsWith('/') ? resolve(e) : zip.readEntry()));
      zip.on('end', () => resolve(null));
      zip.on('error', reject);
      zip.readEntry();
    });
    if (!entry) throw new ImportFailure('upload.archive-without-ifc', 'The .ifczip archive holds no .ifc file.');
    if (entry.uncompressedSize > limitBytes) {
      throw new ImportFailure('upload.archive-too-large', `The archive inflates to ${Math.round(entry.uncompressedSize / 1048576)} MB, more than the ${Math.round(limitBytes / 1048576)} MB allowed.`);
    }
    const stream = await new Promise<NodeJS.ReadableStream>((resolve, reject) =>
      zip.openReadStream(entry, (err, s) => (err || !s ? reject(err ?? new Error('no stream')) : resolve(s))),
    );
    const chunks: Buffer[] = [];
    let total = 0;
    for await (const chunk of stream as AsyncIterable<Buffer>) {
      total += chunk.length;
      // The declared size can lie; count what really comes out.
      if (total > limitBytes) throw new ImportFailure('upload.archive-too-large', `The archive inflates beyond the ${Math.round(limitBytes / 1048576)} MB allowed.`);
      chunks.push(chunk);
    }
    if (!shared) return new Uint8Array(Buffer.concat(chunks, total));
    const out = new Uint8Array(new SharedArrayBuffer(total));
    let at = 0;
    for (const c of chunks) {
      out.set(c, at);
      at += c.length;
    }
    return out;
  } catch (err) {
    if (err instanceof ImportFailure) throw err;
    throw new ImportFailure('upload.bad-archive', `The .ifczip archive is damaged (${(err as Error).message}).`);
  } finally {
    zip.close();
  }
}

/**
 * A file's bytes in memory that threads can share: a thread started with them reads the same
 * memory instead of a copy (a structured clone of 150 MB costs the sender 0.1–0.5 s).
 */
async function readFileShared(path: string): Promise<Uint8Array> {
  const file = await open(path, 'r');
  try {
    const { size } = await file.stat();
    const out = new Uint8Array(new SharedArrayBuffer(size));
    let at = 0;
    while (at < size) {
      const { bytesRead } = await file.read(out, at, size - at, at);
      if (bytesRead === 0) break;
      at += bytesRead;
    }
    // A file that shrank while it was read keeps only what was there.
    return at === size ? out : out.subarray(0, at);
  } finally {
    await file.close();
  }
}

/**
 * The IFC bytes of an uploaded file, from a plain .ifc or the first .ifc inside a .ifczip.
 * `shared`: in a SharedArrayBuffer, for a reader that hands them to another thread (read-model.ts, reader-thread.ts).
 */
export async function readUploadBytes(path: string, kind: 'ifc' | 'ifczip', inflateLimitBytes: number, options: { shared?: boolean } = {}): Promise<Uint8Array> {
  const shared = options.shared ?? false;
  if (kind === 'ifczip') return inflateIfcEntry(path, inflateLimitBytes, shared);
  if (shared) return readFileShared(path);
  const buf = await readFile(path);
  return new Uint8Array(buf.buffer, buf.byteOffset, buf.byteLength);
}
