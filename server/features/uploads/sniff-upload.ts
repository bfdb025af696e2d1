import { open } from 'node:fs/promises';
import { AppError } from '../../http/errors';

export type UploadKind = 'ifc' | 'ifczip';

/** Upload problems: 4xx with stable ids; the temporary file is removed by the caller. */
export const uploadErrors = {
  wrongType: () => new AppError(415, 'upload.wrong-type', 'Upload an IFC model: a .ifc or .ifczip file.'),
  missing: () => new AppError(400, 'upload.missing-file', 'Choose a file to upload (form field "file").'),
  tooLarge: (limitMb: number) => new AppError(413, 'upload.too-large', `The file is larger than the ${limitMb} MB limit.`),
  empty: () => new AppError(422, 'upload.empty', 'The file is empty.'),
  notIfc: () => new AppError(422, 'upload.not-ifc', 'The file does not start like an IFC (STEP) file: "ISO-10303-21;" was not found.'),
  notZip: () => new AppError(422, 'upload.not-zip', 'The .ifczip file is not a zip archive.'),
};

/** Decides the kind from the extension; anything else is refused before it is read. */
export function kindFromName(name: string): UploadKind | null {
  const lower = name.toLowerCase();
  if (lower.endsWith('.ifc')) return 'ifc';
  if (lower.endsWith('.ifczip')) return 'ifczip';
  return null;
}

/** Checks the first bytes so foreign files fail now, with a plain message, not later in a job. */
export async function sniffUpload(filePath: string, kind: UploadKind): Promise<void> {
  const handle = await open(filePath, 'r');
  try {
    const buf = Buffer.alloc(64);
    const { bytesRead } = await handle.read(buf, 0, 64, 0);
    if (bytesRead === 0) throw uploadErrors.empty();
    const head = buf.subarray(0, bytesRead);
    if (kind === 'ifczip') {
      if (!(head[0] === 0x50 && head[1] === 0x4b && head[2] === 0x03 && head[3] === 0x04)) throw uploadErrors.notZip();
      return;
    }
    const text = head.toString('latin1').replace(/^\uFEFF|^\xEF\xBB\xBF/, '').trimStart();
    if (!text.toUpperCase().startsWith('ISO-10303-21')) throw uploadErrors.notIfc();
  } finally {
    await handle.close();
  }
}

/** A display name safe to store and show: no path parts, no control characters, no bidi or invisible format characters. */
export function cleanFileName(original: string): string {
  const base = original.split(/[\\/]/).pop() ?? 'model.ifc';
  const cleaned = base
    .replace(/[\u200b-\u200f\u202a-\u202e\u2060-\u2069\ufeff]/g, '')
    .replace(/[\u0000-\u001f\u007f<>:"|?*]/g, '_')
    .trim()
    .slice(-200);
  return cleaned || 'model.ifc';
}
