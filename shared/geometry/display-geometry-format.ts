/**
 * Display geometry file, version 1: what the 3D view draws, prepared once per revision
 * at import time. Pure code (no I/O), used by the server to write and by the client
 * to read. See docs/decisions/0006-display-geometry.md.
 *
 * Layout, all little-endian, every section starts on a 4-byte boundary:
 *
 *   offset 0   4 bytes   magic "GLDG"
 *   offset 4   uint32    format version (1)
 *   offset 8   uint32    H = byte length of the header JSON (UTF-8)
 *   offset 12  H bytes   header JSON (DisplayGeometryHeader), then 0–3 spaces of padding
 *   …          float32 × 3·vertexCount   positions x,y,z in metres, Y up, recentred:
 *                                        IFC world position = position + header.offset
 *   …          uint16|uint32 × indexCount triangle indices, local to their entry
 *                                        (0 = the entry's first vertex); header.indexType
 *                                        says which; padded to 4 bytes at the end
 *
 * Each entry (one IFC element, keyed by GlobalId) owns a contiguous range of vertices
 * and of indices. Vertices are shared within an entry (no normals are stored: the
 * client shades faces flat from the positions).
 */

export const DISPLAY_GEOMETRY_MAGIC = 'GLDG';
export const DISPLAY_GEOMETRY_VERSION = 1;

export interface DisplayGeometryEntry {
  globalId: string;
  /** IFC class in IFC spelling, e.g. IfcMember, IfcPlate, IfcMechanicalFastener, IfcSlab. */
  ifcClass: string;
  /** True for elements shown only as context (slabs, walls, footings…), never checked. */
  context: boolean;
  /** First vertex (a vertex is 3 floats). */
  vertexStart: number;
  vertexCount: number;
  /** First index in the index section. */
  indexStart: number;
  indexCount: number;
}

export interface Box3Like {
  min: [number, number, number];
  max: [number, number, number];
}

export interface DisplayGeometryHeader {
  version: number;
  units: 'm';
  up: 'Y';
  /** Openings (holes, notches) are cut into the elements; false for big models drawn uncut. */
  openingsCut?: boolean;
  /** Subtracted from every position when written (metres, web-ifc's Y-up world frame). */
  offset: [number, number, number];
  /** Bounds of the stored (recentred) positions. */
  bbox: Box3Like;
  vertexCount: number;
  indexCount: number;
  indexType: 'uint16' | 'uint32';
  entries: DisplayGeometryEntry[];
}

export interface DisplayGeometry {
  header: DisplayGeometryHeader;
  positions: Float32Array;
  indices: Uint16Array | Uint32Array;
}

const pad4 = (n: number) => (n + 3) & ~3;

/** Serialises display geometry; entries must point inside positions and indices. */
export function writeDisplayGeometry(g: DisplayGeometry): Uint8Array {
  const header: DisplayGeometryHeader = { ...g.header, version: DISPLAY_GEOMETRY_VERSION, vertexCount: g.positions.length / 3, indexCount: g.indices.length };
  const indexType = header.indexType;
  if ((indexType === 'uint16') !== (g.indices instanceof Uint16Array)) throw new Error('indexType does not match the index array');
  let json = JSON.stringify(header);
  const jsonBytes0 = new TextEncoder().encode(json);
  const padded = pad4(12 + jsonBytes0.length) - 12;
  if (padded > jsonBytes0.length) json += ' '.repeat(padded - jsonBytes0.length);
  const jsonBytes = new TextEncoder().encode(json);
  const posOffset = 12 + jsonBytes.length;
  const idxOffset = posOffset + g.positions.byteLength;
  const total = pad4(idxOffset + g.indices.byteLength);
  const out = new Uint8Array(total);
  const view = new DataView(out.buffer);
  out.set(new TextEncoder().encode(DISPLAY_GEOMETRY_MAGIC), 0);
  view.setUint32(4, DISPLAY_GEOMETRY_VERSION, true);
  view.setUint32(8, jsonBytes.length, true);
  out.set(jsonBytes, 12);
  out.set(new Uint8Array(g.positions.buffer, g.positions.byteOffset, g.positions.byteLength), posOffset);
  out.set(new Uint8Array(g.indices.buffer, g.indices.byteOffset, g.indices.byteLength), idxOffset);
  return out;
}

export class DisplayGeometryFormatError extends Error {}

/** Reads a display geometry file; typed arrays view the given buffer when it is aligned. */
export function parseDisplayGeometry(input: ArrayBuffer | Uint8Array): DisplayGeometry {
  let bytes = input instanceof Uint8Array ? input : new Uint8Array(input);
  if (bytes.byteOffset % 4 !== 0) bytes = bytes.slice();
  if (bytes.length < 12) throw new DisplayGeometryFormatError('display geometry: file too short');
  const magic = String.fromCharCode(bytes[0], bytes[1], bytes[2], bytes[3]);
  if (magic !== DISPLAY_GEOMETRY_MAGIC) throw new DisplayGeometryFormatError('display geometry: not a display geometry file');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const version = view.getUint32(4, true);
  if (version !== DISPLAY_GEOMETRY_VERSION) throw new DisplayGeometryFormatError(`display geometry: version ${version} is not supported`);
  const jsonLength = view.getUint32(8, true);
  if (12 + jsonLength > bytes.length) throw new DisplayGeometryFormatError('display geometry: header cut short');
  const header = JSON.parse(new TextDecoder().decode(bytes.subarray(12, 12 + jsonLength))) as DisplayGeometryHeader;
  const posOffset = 12 + jsonLength;
  const posBytes = header.vertexCount * 12;
  const idxOffset = posOffset + posBytes;
  const idxSize = header.indexType === 'uint16' ? 2 : 4;
  if (idxOffset + header.indexCount * idxSize > bytes.length) throw new DisplayGeometryFormatError('display geometry: data cut short');
  const positions = new Float32Array(bytes.buffer, bytes.byteOffset + posOffset, header.vertexCount * 3);
  const indices =
    header.indexType === 'uint16'
      ? new Uint16Array(bytes.buffer, bytes.byteOffset + idxOffset, header.indexCount)
      : new Uint32Array(bytes.buffer, bytes.byteOffset + idxOffset, header.indexCount);
  return { header, positions, indices };
}
