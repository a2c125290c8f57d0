// Grey-level dilation (running maximum) over a square window, separable so the cost is O(N·window).
import type { Plane } from '../model';

/** Running maximum along one stride-addressed line with half-window r (window clipped at the ends). */
function maxLine(src: Float32Array, dst: Float32Array, start: number, stride: number, n: number, r: number): void {
  for (let i = 0; i < n; i++) {
    let m = -Infinity;
    const a = Math.max(0, i - r);
    const b = Math.min(n - 1, i + r);
    for (let j = a; j <= b; j++) { const v = src[start + j * stride]; if (v > m) m = v; }
    dst[start + i * stride] = m;
  }
}

/** Maximum over the (2·radiusPx+1)² square centred on each pixel (window clipped at the image border). */
export function maxFilter(plane: Plane, radiusPx: number): Plane {
  const r = Math.max(0, Math.round(radiusPx));
  const { width, height } = plane;
  const tmp = new Float32Array(width * height);
  const out = new Float32Array(width * height);
  for (let y = 0; y < height; y++) maxLine(plane.data, tmp, y * width, 1, width, r);
  for (let x = 0; x < width; x++) maxLine(tmp, out, x, width, height, r);
  return { width, height, data: out };
}
