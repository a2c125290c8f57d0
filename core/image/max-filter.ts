// Grey-level dilation (running maximum) over a square window, separable so the cost is O(N·window).
import type { Plane } from '../model';

/**
 * Running maximum along one stride-addressed line with half-window r (window clipped at the ends), by the van Herk /
 * Gil–Werman method: block-wise prefix and suffix maxima give each window's maximum in O(1).
 */
function maxLine(src: Float32Array, dst: Float32Array, start: number, stride: number, n: number, r: number, g: Float32Array, h: Float32Array): void {
  const w = 2 * r + 1;
  for (let i = 0; i < n; i++) {
    const v = src[start + i * stride];
    g[i] = i % w === 0 ? v : Math.max(g[i - 1], v);
  }
  for (let i = n - 1; i >= 0; i--) {
    const v = src[start + i * stride];
    h[i] = i === n - 1 || (i + 1) % w === 0 ? v : Math.max(h[i + 1], v);
  }
  for (let i = 0; i < n; i++) {
    const a = Math.max(0, i - r);
    const b = Math.min(n - 1, i + r);
    // Window [a, b] spans at most two blocks: suffix max from a within its block, prefix max up to b within its block.
    dst[start + i * stride] = Math.floor(a / w) === Math.floor(b / w) ? blockMax(src, start, stride, a, b) : Math.max(h[a], g[b]);
  }
}

/** Maximum of src over [a, b] directly (only for windows clipped inside one block, i.e. near the line ends). */
function blockMax(src: Float32Array, start: number, stride: number, a: number, b: number): number {
  let m = -Infinity;
  for (let j = a; j <= b; j++) { const v = src[start + j * stride]; if (v > m) m = v; }
  return m;
}

/** The van Herk running maximum down every column at once, walking rows in memory order (cache-friendly). */
function maxColumns(src: Float32Array, dst: Float32Array, width: number, height: number, r: number): void {
  const w = 2 * r + 1;
  const g = new Float32Array(src.length);
  const h = new Float32Array(src.length);
  for (let y = 0; y < height; y++) {
    const o = y * width;
    if (y % w === 0) g.set(src.subarray(o, o + width), o);
    else for (let x = 0; x < width; x++) g[o + x] = Math.max(g[o - width + x], src[o + x]);
  }
  for (let y = height - 1; y >= 0; y--) {
    const o = y * width;
    if (y === height - 1 || (y + 1) % w === 0) h.set(src.subarray(o, o + width), o);
    else for (let x = 0; x < width; x++) h[o + x] = Math.max(h[o + width + x], src[o + x]);
  }
  for (let y = 0; y < height; y++) {
    const a = Math.max(0, y - r);
    const b = Math.min(height - 1, y + r);
    const o = y * width;
    if (Math.floor(a / w) === Math.floor(b / w)) {
      for (let x = 0; x < width; x++) dst[o + x] = blockMax(src, x, width, a, b);
    } else {
      for (let x = 0; x < width; x++) dst[o + x] = Math.max(h[a * width + x], g[b * width + x]);
    }
  }
}

/** Maximum over the (2·radiusPx+1)² square centred on each pixel (window clipped at the image border). */
export function maxFilter(plane: Plane, radiusPx: number): Plane {
  const r = Math.max(0, Math.round(radiusPx));
  const { width, height } = plane;
  const tmp = new Float32Array(width * height);
  const out = new Float32Array(width * height);
  const g = new Float32Array(Math.max(width, height));
  const h = new Float32Array(Math.max(width, height));
  for (let y = 0; y < height; y++) maxLine(plane.data, tmp, y * width, 1, width, r, g, h);
  maxColumns(tmp, out, width, height, r);
  return { width, height, data: out };
}
