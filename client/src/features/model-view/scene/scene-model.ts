import * as THREE from 'three';
import type { DisplayGeometry, DisplayGeometryEntry } from '@shared/geometry/display-geometry-format';

/**
 * The revision's display geometry as a few merged buffers, so that 20,000 members draw in a
 * handful of calls. All meshes share one position attribute (the file's own float32 array,
 * not copied); each has its own index buffer, rebuilt when visibility changes. Colours are
 * one per vertex. Picking does not use three's brute-force raycast: a ray is tested against
 * each entry's box first and against its triangles only where the box is hit.
 */
export class SceneModel {
  readonly entries: DisplayGeometryEntry[];
  readonly byGlobalId = new Map<string, number>();
  readonly position: THREE.BufferAttribute;
  /** Per-entry boxes (min xyz, max xyz), recentred metres, Y up. */
  readonly boxes: Float32Array;
  readonly bounds: THREE.Box3;
  readonly colour: THREE.BufferAttribute;
  private readonly indices: DisplayGeometry['indices'];

  constructor(geometry: DisplayGeometry) {
    this.entries = geometry.header.entries;
    this.indices = geometry.indices;
    this.entries.forEach((e, i) => this.byGlobalId.set(e.globalId, i));
    this.position = new THREE.BufferAttribute(geometry.positions, 3);
    this.colour = new THREE.BufferAttribute(new Uint8Array(geometry.positions.length), 3, true);
    const p = geometry.positions;
    this.boxes = new Float32Array(this.entries.length * 6);
    this.entries.forEach((e, i) => {
      let x0 = Infinity, y0 = Infinity, z0 = Infinity, x1 = -Infinity, y1 = -Infinity, z1 = -Infinity;
      for (let v = e.vertexStart * 3, end = (e.vertexStart + e.vertexCount) * 3; v < end; v += 3) {
        const x = p[v], y = p[v + 1], z = p[v + 2];
        if (x < x0) x0 = x;
        if (y < y0) y0 = y;
        if (z < z0) z0 = z;
        if (x > x1) x1 = x;
        if (y > y1) y1 = y;
        if (z > z1) z1 = z;
      }
      this.boxes.set([x0, y0, z0, x1, y1, z1], i * 6);
    });
    const { min, max } = geometry.header.bbox;
    this.bounds = new THREE.Box3(new THREE.Vector3(...min), new THREE.Vector3(...max));
  }

  private axisCache: Float32Array | null = null;

  /**
   * Each slender element's axis (principal direction of its vertices, from end to end), six
   * floats per entry; NaN for plates, bolts and other stocky pieces. Thin members are drawn
   * along these as lines a few pixels wide, so a 16 mm rod stays visible from afar.
   */
  get axes(): Float32Array {
    if (this.axisCache) return this.axisCache;
    const out = new Float32Array(this.entries.length * 6).fill(NaN);
    const p = this.position.array as Float32Array;
    this.entries.forEach((e, i) => {
      if (e.context || e.vertexCount < 4) return;
      const s = e.vertexStart * 3, end = (e.vertexStart + e.vertexCount) * 3, n = e.vertexCount;
      let mx = 0, my = 0, mz = 0;
      for (let v = s; v < end; v += 3) { mx += p[v]; my += p[v + 1]; mz += p[v + 2]; }
      mx /= n; my /= n; mz /= n;
      let xx = 0, xy = 0, xz = 0, yy = 0, yz = 0, zz = 0;
      for (let v = s; v < end; v += 3) {
        const x = p[v] - mx, y = p[v + 1] - my, z = p[v + 2] - mz;
        xx += x * x; xy += x * y; xz += x * z; yy += y * y; yz += y * z; zz += z * z;
      }
      // Power iteration for the principal direction, started from the box diagonal.
      const b = this.boxes.subarray(i * 6, i * 6 + 6);
      let dx = b[3] - b[0] + 1e-6, dy = b[4] - b[1] + 1e-7, dz = b[5] - b[2] + 1e-8;
      for (let k = 0; k < 12; k++) {
        const nx = xx * dx + xy * dy + xz * dz, ny = xy * dx + yy * dy + yz * dz, nz = xz * dx + yz * dy + zz * dz;
        const len = Math.hypot(nx, ny, nz) || 1;
        dx = nx / len; dy = ny / len; dz = nz / len;
      }
      let t0 = Infinity, t1 = -Infinity, r = 0;
      for (let v = s; v < end; v += 3) {
        const x = p[v] - mx, y = p[v + 1] - my, z = p[v + 2] - mz;
        const t = x * dx + y * dy + z * dz;
        if (t < t0) t0 = t;
        if (t > t1) t1 = t;
        r = Math.max(r, Math.hypot(x - t * dx, y - t * dy, z - t * dz));
      }
      if (t1 - t0 < 6 * r) return;
      out.set([mx + t0 * dx, my + t0 * dy, mz + t0 * dz, mx + t1 * dx, my + t1 * dy, mz + t1 * dz], i * 6);
    });
    return (this.axisCache = out);
  }

  /** The file's entry-local triangle indices. */
  get indexSource(): DisplayGeometry['indices'] {
    return this.indices;
  }

  /** Index buffer of the given entries (ascending entry order keeps it cache friendly). */
  indexFor(entryIds: Iterable<number>): THREE.BufferAttribute {
    let total = 0;
    const list: number[] = [];
    for (const i of entryIds) {
      list.push(i);
      total += this.entries[i].indexCount;
    }
    const vertexTotal = this.position.count;
    const out = vertexTotal > 0xffff ? new Uint32Array(total) : new Uint16Array(total);
    let o = 0;
    for (const i of list) {
      const e = this.entries[i];
      const src = this.indices;
      for (let k = e.indexStart, end = e.indexStart + e.indexCount; k < end; k++) out[o++] = src[k] + e.vertexStart;
    }
    return new THREE.BufferAttribute(out, 1);
  }

  /** A geometry over the shared positions and the given entries' triangles. */
  geometryFor(entryIds: Iterable<number>, withColour: boolean): THREE.BufferGeometry {
    const g = new THREE.BufferGeometry();
    g.setAttribute('position', this.position);
    if (withColour) g.setAttribute('color', this.colour);
    g.setIndex(this.indexFor(entryIds));
    g.boundingBox = this.bounds.clone();
    g.boundingSphere = this.bounds.getBoundingSphere(new THREE.Sphere());
    return g;
  }

  /** Feature edges (creases over 25°) of the given entries, as line segments. */
  edgesFor(entryIds: Iterable<number>): THREE.BufferGeometry {
    const ids = [...entryIds];
    if (!ids.length) return new THREE.BufferGeometry();
    const tmp = this.geometryFor(ids, false);
    const edges = new THREE.EdgesGeometry(tmp, 25);
    tmp.setIndex(null);
    tmp.dispose();
    return edges;
  }

  /** Paints each entry's vertices with its colour (sRGB hex → linear bytes, as three expects). */
  paint(colourOf: (entryIndex: number) => THREE.Color): void {
    const c = this.colour.array as Uint8Array;
    this.entries.forEach((e, i) => {
      const col = colourOf(i);
      const r = Math.round(col.r * 255), g = Math.round(col.g * 255), b = Math.round(col.b * 255);
      for (let v = e.vertexStart * 3, end = (e.vertexStart + e.vertexCount) * 3; v < end; v += 3) {
        c[v] = r;
        c[v + 1] = g;
        c[v + 2] = b;
      }
    });
    this.colour.needsUpdate = true;
  }

  boxOf(entryIds: Iterable<number>): THREE.Box3 {
    const box = new THREE.Box3();
    for (const i of entryIds) {
      const b = this.boxes.subarray(i * 6, i * 6 + 6);
      box.expandByPoint(new THREE.Vector3(b[0], b[1], b[2]));
      box.expandByPoint(new THREE.Vector3(b[3], b[4], b[5]));
    }
    return box;
  }

  /**
   * The nearest entry hit by the ray among `candidates` (a predicate on entry index),
   * ignoring what a clipping plane removes. Returns the entry index and distance.
   */
  pick(ray: THREE.Ray, candidates: (i: number) => boolean, clip: THREE.Plane | null, slack = 0): { entry: number; distance: number } | null {
    const solid = this.pickSolid(ray, candidates, clip);
    if (solid || slack <= 0) return solid;
    // Nothing solid under the pointer: take the nearest thin member's axis within `slack`
    // (world units per unit of distance from the eye, i.e. a few pixels).
    const axes = this.axes;
    const a = new THREE.Vector3(), b = new THREE.Vector3(), onRay = new THREE.Vector3(), onSeg = new THREE.Vector3();
    let best: { entry: number; distance: number; miss: number } | null = null;
    for (let i = 0; i < this.entries.length; i++) {
      if (Number.isNaN(axes[i * 6]) || !candidates(i)) continue;
      a.fromArray(axes, i * 6);
      b.fromArray(axes, i * 6 + 3);
      const d2 = ray.distanceSqToSegment(a, b, onRay, onSeg);
      const along = onRay.distanceTo(ray.origin);
      if (clip && clip.distanceToPoint(onSeg) < 0) continue;
      const miss = Math.sqrt(d2) / Math.max(along, 1e-6);
      if (miss <= slack && (!best || miss < best.miss)) best = { entry: i, distance: along, miss };
    }
    return best && { entry: best.entry, distance: best.distance };
  }

  private pickSolid(ray: THREE.Ray, candidates: (i: number) => boolean, clip: THREE.Plane | null): { entry: number; distance: number } | null {
    const hits: { i: number; t: number }[] = [];
    const box = new THREE.Box3();
    const at = new THREE.Vector3();
    for (let i = 0; i < this.entries.length; i++) {
      if (!candidates(i)) continue;
      const b = this.boxes;
      box.min.set(b[i * 6], b[i * 6 + 1], b[i * 6 + 2]);
      box.max.set(b[i * 6 + 3], b[i * 6 + 4], b[i * 6 + 5]);
      const hit = ray.intersectBox(box, at);
      if (hit) hits.push({ i, t: hit.distanceTo(ray.origin) });
    }
    hits.sort((a, b) => a.t - b.t);
    let best: { entry: number; distance: number } | null = null;
    const a = new THREE.Vector3(), b = new THREE.Vector3(), c = new THREE.Vector3(), point = new THREE.Vector3();
    const p = this.position.array as Float32Array;
    for (const h of hits) {
      if (best && h.t > best.distance) break;
      const e = this.entries[h.i];
      for (let k = e.indexStart, end = e.indexStart + e.indexCount; k < end; k += 3) {
        const i0 = (this.indices[k] + e.vertexStart) * 3;
        const i1 = (this.indices[k + 1] + e.vertexStart) * 3;
        const i2 = (this.indices[k + 2] + e.vertexStart) * 3;
        a.set(p[i0], p[i0 + 1], p[i0 + 2]);
        b.set(p[i1], p[i1 + 1], p[i1 + 2]);
        c.set(p[i2], p[i2 + 1], p[i2 + 2]);
        if (!ray.intersectTriangle(a, b, c, false, point)) continue;
        if (clip && clip.distanceToPoint(point) < 0) continue;
        const d = point.distanceTo(ray.origin);
        if (!best || d < best.distance) best = { entry: h.i, distance: d };
      }
    }
    return best;
  }
}
