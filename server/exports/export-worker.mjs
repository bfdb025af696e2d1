// Entry file of the export worker threads (see export-pool.ts). Workers do not inherit
// the TypeScript loader, so register tsx here, then load the writers.
import { register } from 'tsx/esm/api';

register();
const loaded = import('./export-formats.ts');

export default async function exportWorker({ format, bundle, modelBytes }) {
  const { writeExport } = await loaded;
  const body = await writeExport(format, bundle, { modelBytes: modelBytes ? async () => modelBytes : undefined });
  return new Uint8Array(body.buffer, body.byteOffset, body.byteLength);
}
