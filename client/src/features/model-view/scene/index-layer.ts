import * as THREE from 'three';
import type { SceneModel } from './scene-model';

/**
 * One drawable layer over the shared positions: a geometry whose index buffer has room for
 * every entry the layer may ever show, rewritten in place (draw range + update range) when
 * the visible entries change, so no GPU buffers are created or leaked on each filter change.
 */
export class IndexLayer {
  readonly geometry = new THREE.BufferGeometry();
  private readonly index: THREE.BufferAttribute;

  constructor(
    private readonly model: SceneModel,
    capacityEntries: Iterable<number>,
    withColour: boolean,
  ) {
    let capacity = 0;
    for (const i of capacityEntries) capacity += model.entries[i].indexCount;
    const wide = model.position.count > 0xffff;
    this.index = new THREE.BufferAttribute(wide ? new Uint32Array(Math.max(3, capacity)) : new Uint16Array(Math.max(3, capacity)), 1);
    this.index.setUsage(THREE.DynamicDrawUsage);
    this.geometry.setAttribute('position', model.position);
    if (withColour) this.geometry.setAttribute('color', model.colour);
    this.geometry.setIndex(this.index);
    this.geometry.boundingBox = model.bounds.clone();
    this.geometry.boundingSphere = model.bounds.getBoundingSphere(new THREE.Sphere());
    this.geometry.setDrawRange(0, 0);
  }

  /** Shows exactly these entries (at most the capacity given at construction). */
  show(entryIds: Iterable<number>): void {
    const out = this.index.array as Uint16Array | Uint32Array;
    const src = this.model.indexSource;
    let o = 0;
    for (const i of entryIds) {
      const e = this.model.entries[i];
      if (o + e.indexCount > out.length) break;
      for (let k = e.indexStart, end = e.indexStart + e.indexCount; k < end; k++) out[o++] = src[k] + e.vertexStart;
    }
    this.geometry.setDrawRange(0, o);
    this.index.clearUpdateRanges();
    this.index.addUpdateRange(0, Math.max(o, 1));
    this.index.needsUpdate = true;
  }

  dispose(): void {
    // The shared position and colour attributes stay with the model; only the index goes.
    this.geometry.deleteAttribute('position');
    this.geometry.deleteAttribute('color');
    this.geometry.dispose();
  }
}
