import type { Page } from 'playwright-core';

/** What colours the 3D view's canvas shows, read back from its pixels. */
export interface PixelCensus {
  width: number;
  height: number;
  /** Pixels per named colour (a result band, a kind of change…) that are a shade of that colour. */
  counts: Record<string, number>;
  /** A CSS-pixel point (relative to the canvas) inside a solid patch of each colour seen. */
  points: Record<string, { x: number; y: number }>;
}

/**
 * Reads the WebGL canvas back (drawn into a 2D canvas) and sorts its pixels by band: a pixel
 * belongs to a band when its linear-light colour is that band's colour times a shading factor
 * (the view's lights scale colours by about 0.7–1.3) within a small tolerance.
 */
export async function censusOfCanvas(page: Page, bands: { band: string; colour: string }[]): Promise<PixelCensus> {
  return page.evaluate((bandList) => {
    const canvas = document.querySelector('[data-testid="model-view-canvas"] canvas') as HTMLCanvasElement;
    const copy = document.createElement('canvas');
    copy.width = canvas.width;
    copy.height = canvas.height;
    const ctx = copy.getContext('2d')!;
    ctx.drawImage(canvas, 0, 0);
    const { data, width, height } = ctx.getImageData(0, 0, copy.width, copy.height);
    const lin = (v: number) => {
      const c = v / 255;
      return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
    };
    const refs = bandList.map(({ band, colour }) => {
      const n = parseInt(colour.slice(1), 16);
      return { band, rgb: [lin((n >> 16) & 255), lin((n >> 8) & 255), lin(n & 255)] };
    });
    const classOf = new Int8Array(width * height).fill(-1);
    for (let p = 0; p < width * height; p++) {
      const px = [lin(data[p * 4]), lin(data[p * 4 + 1]), lin(data[p * 4 + 2])];
      let best = -1;
      let bestErr = Infinity;
      refs.forEach((r, k) => {
        // Best shading factor in the least-squares sense, then the error left.
        const f = (px[0] * r.rgb[0] + px[1] * r.rgb[1] + px[2] * r.rgb[2]) / (r.rgb[0] ** 2 + r.rgb[1] ** 2 + r.rgb[2] ** 2);
        if (f < 0.6 || f > 1.4) return;
        const err = Math.hypot(px[0] - f * r.rgb[0], px[1] - f * r.rgb[1], px[2] - f * r.rgb[2]) / Math.max(0.02, Math.hypot(...px));
        if (err < bestErr) {
          bestErr = err;
          best = k;
        }
      });
      if (best >= 0 && bestErr < 0.05) classOf[p] = best;
    }
    const counts: Record<string, number> = {};
    const points: Record<string, { x: number; y: number }> = {};
    const scale = canvas.clientWidth / width;
    for (let y = 3; y < height - 3; y++) {
      for (let x = 3; x < width - 3; x++) {
        const k = classOf[y * width + x];
        if (k < 0) continue;
        const band = refs[k].band;
        counts[band] = (counts[band] ?? 0) + 1;
        if (points[band]) continue;
        let solid = true;
        for (let dy = -3; dy <= 3 && solid; dy++) for (let dx = -3; dx <= 3 && solid; dx++) if (classOf[(y + dy) * width + x + dx] !== k) solid = false;
        if (solid) points[band] = { x: x * scale, y: y * scale };
      }
    }
    return { width, height, counts, points };
  }, bands);
}
