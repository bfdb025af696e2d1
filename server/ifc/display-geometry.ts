/**
 * Display geometry for the 3D view, built once per revision at import time.
 *
 * Streams web-ifc's meshes of the steel classes (members, beams, columns, plates and their
 * subtypes, mechanical fasteners) and, marked as context, of a few building classes (slabs,
 * walls, footings, roofs…), keyed by GlobalId. Positions stay in web-ifc's frame — metres,
 * Y up — minus the centre of the bounding box, which is kept as `offset` in the header
 * so a position maps back to the IFC world frame (world = stored + offset). Far-from-origin
 * models (site coordinates) therefore keep their precision in float32.
 *
 * Vertices are merged within each element (web-ifc repeats them per face for its normals;
 * the client shades faces flat), and every web-ifc object is deleted as soon as it has been
 * copied, so memory grows only with the output. File format: shared/geometry/display-geometry-format.ts.
 */
import * as W from 'web-ifc';
import type { IfcAPI } from 'web-ifc';
import { type DisplayGeometryEntry, writeDisplayGeometry } from '../../shared/geometry/display-geometry-format.ts';
import { getIfcApi } from './ifc-api.ts';
import { openModel } from './open-model.ts';
import { str } from './step-values.ts';

/** Steel classes (with subtypes) drawn and coloured by result. */
export const STEEL_CLASSES = ['IfcMember', 'IfcBeam', 'IfcColumn', 'IfcPlate', 'IfcMechanicalFastener', 'IfcFastener'] as const;
/** Building classes (with subtypes) drawn faintly as context. */
export const CONTEXT_CLASSES = ['IfcSlab', 'IfcWall', 'IfcFooting', 'IfcRoof', 'IfcPile', 'IfcStair', 'IfcRamp', 'IfcRailing', 'IfcCovering'] as const;

export interface DisplayGeometryOptions {
  /** Include the context classes (default true). */
  context?: boolean;
  /** Elements per web-ifc streaming call; between calls the time budget is checked. */
  chunkSize?: number;
  /** Stop adding elements once this much time has passed (the file is then partial). */
  timeBudgetMs?: number;
  /**
   * Cut openings (holes, notches) into the elements only up to this many IfcRelVoidsElement
   * (default 1500). Openings are boolean operations in web-ifc and cost about 4 ms each;
   * beyond the limit elements are drawn uncut, which reads the same at model scale (the
   * member sheet draws the holes). The header says which.
   */
  openingsLimit?: number;
}

export interface DisplayGeometryResult {
  bytes: Uint8Array;
  stats: {
    elements: number;
    withGeometry: number;
    contextElements: number;
    /** Openings were cut into the elements (false: more than `openingsLimit`). */
    openingsCut: boolean;
    vertices: number;
    triangles: number;
    /** Elements asked for but not streamed because the time budget ran out. */
    skipped: number;
    /** Elements whose mesh could not be read (web-ifc threw). */
    failed: number;
    buildMs: number;
  };
}

/** Float32 / Uint32 arrays that grow by doubling. */
class Grow<T extends Float32Array | Uint32Array> {
  length = 0;
  constructor(
    public data: T,
    private readonly make: (n: number) => T,
  ) {}
  reserve(extra: number): void {
    const need = this.length + extra;
    if (need <= this.data.length) return;
    let cap = Math.max(16, this.data.length);
    while (cap < need) cap *= 2;
    const next = this.make(cap);
    next.set(this.data.subarray(0, this.length) as never);
    this.data = next;
  }
  view(): T {
    return this.data.subarray(0, this.length) as T;
  }
}
const growF32 = (n = 1 << 16) => new Grow(new Float32Array(n), (c) => new Float32Array(c));
const growU32 = (n = 1 << 16) => new Grow(new Uint32Array(n), (c) => new Uint32Array(c));

interface Target {
  expressID: number;
  context: boolean;
}

/**
 * The elements to draw, steel first, then context, each in file order (stable output for
 * the same file). Only ids: no line is read here. Reading the targets' lines before the
 * first StreamMeshes (GetRawLineData or GetLine, for their GlobalIds) made that first call
 * 40–60 × slower in web-ifc 0.0.78 — 19.6 s instead of 0.4 s for 1,000 elements of the
 * 5,000-member benchmark model — so names are read after streaming (nameEntries).
 */
function targets(api: IfcAPI, modelID: number, withContext: boolean): Target[] {
  const found = new Map<number, Target>();
  const groups: [readonly string[], boolean][] = [[STEEL_CLASSES, false]];
  if (withContext) groups.push([CONTEXT_CLASSES, true]);
  for (const [classes, context] of groups) {
    for (const name of classes) {
      const code = (W as unknown as Record<string, number>)[name.toUpperCase()];
      if (typeof code !== 'number') continue;
      let ids: number[] = [];
      try {
        ids = [...api.GetLineIDsWithType(modelID, code, true)];
      } catch {
        ids = [];
      }
      for (const id of ids) if (!found.has(id)) found.set(id, { expressID: id, context });
    }
  }
  return [...found.values()].sort((a, b) => Number(a.context) - Number(b.context) || a.expressID - b.expressID);
}

type DrawnElement = Omit<DisplayGeometryEntry, 'globalId' | 'ifcClass'> & { expressID: number };

/**
 * GlobalId and class of each drawn element, from its raw line (four times cheaper than
 * GetLine; GlobalId is the first attribute of every IfcRoot). An element without one is left
 * out of the entries; its few vertices stay in the buffers, drawn by nothing.
 */
function nameEntries(api: IfcAPI, modelID: number, drawn: DrawnElement[]): DisplayGeometryEntry[] {
  const names = new Map<number, string>();
  const entries: DisplayGeometryEntry[] = [];
  for (const { expressID, ...rest } of drawn) {
    let line: { type: number; arguments: unknown[] } | null = null;
    try {
      line = api.GetRawLineData(modelID, expressID);
    } catch {
      continue;
    }
    const globalId = line ? str(line.arguments?.[0]) : null;
    if (!line || !globalId) continue;
    let ifcClass = names.get(line.type);
    if (ifcClass === undefined) {
      ifcClass = api.GetNameFromTypeCode(line.type) || 'IfcProduct';
      names.set(line.type, ifcClass);
    }
    entries.push({ globalId, ifcClass, ...rest });
  }
  return entries;
}

/**
 * Merges equal vertices of one element (exact float32 equality) and drops triangles that
 * collapse. `pos` holds the element's vertices, `idx` its element-local triangles.
 */
function weld(pos: Float32Array, idx: Uint32Array, outPos: Grow<Float32Array>, outIdx: Grow<Uint32Array>): { vertexCount: number; indexCount: number } {
  const n = pos.length / 3;
  const bits = new Uint32Array(pos.buffer, pos.byteOffset, pos.length);
  let size = 16;
  while (size < n * 2) size *= 2;
  const mask = size - 1;
  const table = new Int32Array(size).fill(-1);
  const remap = new Uint32Array(n);
  const base = outPos.length / 3;
  outPos.reserve(n * 3);
  const outBits = new Uint32Array(outPos.data.buffer, outPos.data.byteOffset, outPos.data.length);
  let unique = 0;
  for (let v = 0; v < n; v++) {
    const a = bits[v * 3];
    const b = bits[v * 3 + 1];
    const c = bits[v * 3 + 2];
    let h = (Math.imul(a, 73856093) ^ Math.imul(b, 19349663) ^ Math.imul(c, 83492791)) & mask;
    for (;;) {
      const slot = table[h];
      if (slot === -1) {
        table[h] = unique;
        remap[v] = unique;
        const o = outPos.length;
        outPos.data[o] = pos[v * 3];
        outPos.data[o + 1] = pos[v * 3 + 1];
        outPos.data[o + 2] = pos[v * 3 + 2];
        outPos.length += 3;
        unique++;
        break;
      }
      const so = (base + slot) * 3;
      if (outBits[so] === a && outBits[so + 1] === b && outBits[so + 2] === c) {
        remap[v] = slot;
        break;
      }
      h = (h + 1) & mask;
    }
  }
  outIdx.reserve(idx.length);
  let kept = 0;
  for (let t = 0; t + 2 < idx.length; t += 3) {
    const i0 = remap[idx[t]];
    const i1 = remap[idx[t + 1]];
    const i2 = remap[idx[t + 2]];
    if (i0 === i1 || i1 === i2 || i0 === i2) continue;
    const o = outIdx.length;
    outIdx.data[o] = i0;
    outIdx.data[o + 1] = i1;
    outIdx.data[o + 2] = i2;
    outIdx.length += 3;
    kept += 3;
  }
  return { vertexCount: unique, indexCount: kept };
}

/** Builds the display geometry file of an IFC model (bytes of the .ifc). */
export async function buildDisplayGeometry(bytes: Uint8Array, options: DisplayGeometryOptions = {}): Promise<DisplayGeometryResult> {
  const started = performance.now();
  const chunkSize = options.chunkSize ?? 1000;
  const budget = options.timeBudgetMs ?? Infinity;
  const api = await getIfcApi();
  const opened = openModel(api, bytes);
  try {
    const list = targets(api, opened.modelID, options.context ?? true);
    // This model instance is ours alone: forgetting the void relations only changes what we draw.
    let voids: number[] = [];
    try {
      voids = [...api.GetLineIDsWithType(opened.modelID, W.IFCRELVOIDSELEMENT)];
    } catch {
      voids = [];
    }
    const openingsCut = voids.length <= (options.openingsLimit ?? 1500);
    if (!openingsCut) {
      for (const id of voids) {
        // A line deleted before web-ifc has parsed it can still cut the first elements streamed
        // (seen with web-ifc 0.0.78: the first two members of the benchmark model kept one and
        // two holes); parsing it first makes the deletion hold.
        api.GetRawLineData(opened.modelID, id);
        api.DeleteLine(opened.modelID, id);
      }
    }
    const byId = new Map(list.map((t) => [t.expressID, t]));
    const positions = growF32();
    const indices = growU32();
    const drawn: DrawnElement[] = [];
    // Per-element scratch, reused.
    let scratchPos = new Float32Array(1024);
    let scratchIdx = new Uint32Array(1024);
    // World coordinates are stored relative to the first vertex seen (double precision),
    // then recentred on the bounding box once everything is in.
    let origin: [number, number, number] | null = null;
    let failed = 0;

    const onMesh = (mesh: W.FlatMesh) => {
      const target = byId.get(mesh.expressID);
      try {
        if (!target) return;
        let nPos = 0;
        let nIdx = 0;
        const geoms = mesh.geometries;
        for (let g = 0; g < geoms.size(); g++) {
          const placed = geoms.get(g);
          const geometry = api.GetGeometry(opened.modelID, placed.geometryExpressID);
          try {
            const verts = api.GetVertexArray(geometry.GetVertexData(), geometry.GetVertexDataSize());
            const idx = api.GetIndexArray(geometry.GetIndexData(), geometry.GetIndexDataSize());
            const count = verts.length / 6;
            if (nPos + count * 3 > scratchPos.length) {
              const next = new Float32Array(Math.max(scratchPos.length * 2, nPos + count * 3));
              next.set(scratchPos.subarray(0, nPos));
              scratchPos = next;
            }
            if (nIdx + idx.length > scratchIdx.length) {
              const next = new Uint32Array(Math.max(scratchIdx.length * 2, nIdx + idx.length));
              next.set(scratchIdx.subarray(0, nIdx));
              scratchIdx = next;
            }
            const m = placed.flatTransformation;
            const first = nPos / 3;
            for (let v = 0; v < count; v++) {
              const x = verts[v * 6];
              const y = verts[v * 6 + 1];
              const z = verts[v * 6 + 2];
              const wx = m[0] * x + m[4] * y + m[8] * z + m[12];
              const wy = m[1] * x + m[5] * y + m[9] * z + m[13];
              const wz = m[2] * x + m[6] * y + m[10] * z + m[14];
              if (!origin) origin = [wx, wy, wz];
              scratchPos[nPos++] = wx - origin[0];
              scratchPos[nPos++] = wy - origin[1];
              scratchPos[nPos++] = wz - origin[2];
            }
            for (let i = 0; i < idx.length; i++) scratchIdx[nIdx++] = idx[i] + first;
          } finally {
            geometry.delete();
          }
        }
        if (nIdx === 0) return;
        const vertexStart = positions.length / 3;
        const indexStart = indices.length;
        const welded = weld(scratchPos.subarray(0, nPos), scratchIdx.subarray(0, nIdx), positions, indices);
        if (welded.indexCount === 0) {
          positions.length = vertexStart * 3;
          return;
        }
        drawn.push({ expressID: target.expressID, context: target.context, vertexStart, vertexCount: welded.vertexCount, indexStart, indexCount: welded.indexCount });
      } catch {
        failed++;
      } finally {
        // web-ifc 0.0.78 hands the callback a plain value; later versions give a handle to delete.
        (mesh as { delete?: () => void }).delete?.();
      }
    };

    let skipped = 0;
    for (let i = 0; i < list.length; i += chunkSize) {
      if (performance.now() - started > budget) {
        skipped = list.length - i;
        break;
      }
      const chunk = list.slice(i, i + chunkSize).map((t) => t.expressID);
      try {
        api.StreamMeshes(opened.modelID, chunk, onMesh);
      } catch {
        // One bad element spoils its chunk: retry the chunk element by element.
        for (const id of chunk) {
          try {
            api.StreamMeshes(opened.modelID, [id], onMesh);
          } catch {
            failed++;
          }
        }
      }
    }

    const entries = nameEntries(api, opened.modelID, drawn);

    // Recentre on the bounding box.
    const pos = positions.view();
    const min: [number, number, number] = [Infinity, Infinity, Infinity];
    const max: [number, number, number] = [-Infinity, -Infinity, -Infinity];
    for (let i = 0; i < pos.length; i += 3) {
      for (let k = 0; k < 3; k++) {
        const v = pos[i + k];
        if (v < min[k]) min[k] = v;
        if (v > max[k]) max[k] = v;
      }
    }
    const o: [number, number, number] = origin ?? [0, 0, 0];
    let offset: [number, number, number] = [0, 0, 0];
    let bbox = { min: [0, 0, 0] as [number, number, number], max: [0, 0, 0] as [number, number, number] };
    if (pos.length) {
      const centre = [0, 1, 2].map((k) => (min[k] + max[k]) / 2);
      for (let i = 0; i < pos.length; i += 3) {
        pos[i] -= centre[0];
        pos[i + 1] -= centre[1];
        pos[i + 2] -= centre[2];
      }
      offset = [o[0] + centre[0], o[1] + centre[1], o[2] + centre[2]];
      bbox = { min: [0, 1, 2].map((k) => min[k] - centre[k]) as [number, number, number], max: [0, 1, 2].map((k) => max[k] - centre[k]) as [number, number, number] };
    }

    const idx32 = indices.view();
    const wide = entries.some((e) => e.vertexCount > 0xffff);
    const out = writeDisplayGeometry({
      header: { version: 1, units: 'm', up: 'Y', openingsCut, offset, bbox, vertexCount: pos.length / 3, indexCount: idx32.length, indexType: wide ? 'uint32' : 'uint16', entries },
      positions: pos,
      indices: wide ? idx32 : Uint16Array.from(idx32),
    });
    return {
      bytes: out,
      stats: {
        elements: list.length,
        withGeometry: entries.length,
        contextElements: entries.filter((e) => e.context).length,
        openingsCut,
        vertices: pos.length / 3,
        triangles: idx32.length / 3,
        skipped,
        failed,
        buildMs: Math.round(performance.now() - started),
      },
    };
  } finally {
    try {
      api.CloseModel(opened.modelID);
    } catch {
      // A half-opened model can fail to close; nothing else to release.
    }
  }
}
