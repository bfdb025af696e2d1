import { readFile } from 'node:fs/promises';
import yauzl from 'yauzl';
import type { Entry, ZipFile } from 'yauzl';
import { ImportFailure } from './import-failure';

function openZip(path: string): Promise<ZipFile> {
  return new Promise((resolve, reject) =>
    yauzl.open(path, { lazyEntries: true, validateEntrySizes: true }, (err, zip) => (err || !zip ? reject(err ?? new Error('no zip')) : resolve(zip))),
  );
}

/** The first .ifc entry of the archive, inflated within a byte limit (a zip bomb stops at the limit). */
async function inflateIfcEntry(path: string, limitBytes: number): Promise<Uint8Array> {
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
    return new Uint8Array(Buffer.concat(chunks, total));
  } catch (err) {
    if (err instanceof ImportFailure) throw err;
    throw new ImportFailure('upload.bad-archive', `The .ifczip archive is damaged (${(err as Error).message}).`);
  } finally {
    zip.close();
  }
}

/** The IFC bytes of an uploaded file, from a plain .ifc or the first .ifc inside a .ifczip. */
export async function readUploadBytes(path: string, kind: 'ifc' | 'ifczip', inflateLimitBytes: number): Promise<Uint8Array> {
  if (kind === 'ifczip') return inflateIfcEntry(path, inflateLimitBytes);
  const buf = await readFile(path);
  return new Uint8Array(buf.buffer, buf.byteOffset, buf.byteLength);
}
