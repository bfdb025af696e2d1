/**
 * Checks the bytes before handing them to web-ifc and turns its failure modes (-1, thrown
 * TypeErrors, silence) into IfcReadError. Returns an open model; the caller closes it.
 */
import type { IfcAPI } from 'web-ifc';
import { IfcReadError } from './ifc-errors.ts';
import type { IfcSchema } from './types.ts';

export interface OpenedModel {
  modelID: number;
  schema: IfcSchema;
  schemaIdentifier: string;
  /** The file does not end with END-ISO-10303-21; what survived was read. */
  truncated: boolean;
}

const decoder = new TextDecoder('latin1');

export function schemaFromHeader(identifier: string): IfcSchema | null {
  const s = identifier.toUpperCase().trim();
  if (s === 'IFC2X3' || s.startsWith('IFC2X3_')) return 'IFC2X3';
  if (s === 'IFC4' || s.startsWith('IFC4_') || s === 'IFC4ADD1' || s === 'IFC4ADD2') return 'IFC4';
  // web-ifc reads IFC4X1, IFC4X2 and the IFC4X3 release candidates/addenda with its IFC4X3 classes.
  if (/^IFC4X[123]/.test(s)) return 'IFC4X3';
  return null;
}

export function inspectHeader(bytes: Uint8Array): { schemaIdentifier: string; schema: IfcSchema; truncated: boolean; hasData: boolean } {
  if (bytes.length === 0) throw new IfcReadError('ifc.empty');
  const head = decoder.decode(bytes.subarray(0, Math.min(bytes.length, 65536)));
  const start = head.replace(/^\uFEFF/, '').trimStart();
  if (!start.startsWith('ISO-10303-21;')) throw new IfcReadError('ifc.not-ifc');
  const schemaMatch = /FILE_SCHEMA\s*\(\s*\(\s*'([^']*)'/i.exec(head);
  const headerEnded = /ENDSEC\s*;/i.test(head);
  if (!schemaMatch) throw new IfcReadError(headerEnded ? 'ifc.parse-failed' : 'ifc.truncated', 'no FILE_SCHEMA in the header');
  const schema = schemaFromHeader(schemaMatch[1]);
  if (!schema) throw new IfcReadError('ifc.unknown-schema', `the file says ${schemaMatch[1] || 'nothing'}`);
  const tail = decoder.decode(bytes.subarray(Math.max(0, bytes.length - 2048)));
  const truncated = !/END-ISO-10303-21\s*;/i.test(tail);
  const hasData = /\bDATA\s*;/i.test(head) || bytes.length > 65536;
  return { schemaIdentifier: schemaMatch[1], schema, truncated, hasData };
}

/** The header checks every read makes before web-ifc sees the file. */
export function checkHeader(bytes: Uint8Array): ReturnType<typeof inspectHeader> {
  const h = inspectHeader(bytes);
  if (!h.hasData) throw new IfcReadError(h.truncated ? 'ifc.truncated' : 'ifc.empty', 'the file has a header but no DATA section');
  return h;
}

/** web-ifc's failure to open a file whose header passed, as the error every read gives. */
function openFailure(h: { truncated: boolean }, message?: string, cause?: unknown): IfcReadError {
  return new IfcReadError(h.truncated ? 'ifc.truncated' : 'ifc.parse-failed', message, cause === undefined ? undefined : { cause });
}

export function openModel(api: IfcAPI, bytes: Uint8Array): OpenedModel {
  const h = checkHeader(bytes);
  let modelID: number;
  try {
    modelID = api.OpenModel(bytes, { COORDINATE_TO_ORIGIN: false });
  } catch (e) {
    throw openFailure(h, e instanceof Error ? e.message : String(e), e);
  }
  if (modelID === -1 || modelID === undefined) throw openFailure(h);
  return { modelID, schema: h.schema, schemaIdentifier: h.schemaIdentifier, truncated: h.truncated };
}
