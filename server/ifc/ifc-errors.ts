/**
 * The few ways reading an IFC file can fail, each with a stable id the API and UI can key on.
 * web-ifc signals failure by returning -1, throwing odd errors or only logging, so the reader
 * turns all of those into one of these before anything leaves server/ifc.
 */
export type IfcErrorId =
  | 'ifc.empty'
  | 'ifc.not-ifc'
  | 'ifc.unknown-schema'
  | 'ifc.truncated'
  | 'ifc.parse-failed'
  | 'ifc.no-project';

const MESSAGES: Record<IfcErrorId, string> = {
  'ifc.empty': 'The file is empty.',
  'ifc.not-ifc': 'This does not look like an IFC file (it should start with "ISO-10303-21;").',
  'ifc.unknown-schema': 'The file uses an IFC schema this tool does not read. Supported: IFC2X3, IFC4 and IFC4X3.',
  'ifc.truncated': 'The file seems to be cut off before its end, and nothing usable could be read from it.',
  'ifc.parse-failed': 'The IFC file could not be read.',
  'ifc.no-project': 'The file has no IfcProject, so its units and structure are unknown.',
};

export class IfcReadError extends Error {
  readonly id: IfcErrorId;
  readonly detail?: string;

  constructor(id: IfcErrorId, detail?: string, options?: { cause?: unknown }) {
    super(detail ? `${MESSAGES[id]} (${detail})` : MESSAGES[id], options);
    this.name = 'IfcReadError';
    this.id = id;
    this.detail = detail;
  }

  toJSON(): { id: IfcErrorId; message: string } {
    return { id: this.id, message: this.message };
  }
}

export function isIfcReadError(e: unknown): e is IfcReadError {
  return e instanceof IfcReadError;
}
