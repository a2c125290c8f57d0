// Separable Gaussian smoothing. Borders replicate the edge pixel so flat images stay flat.
import type { Plane } from '../model';

/** Normalised 1-D Gaussian kernel of standard deviation sigmaPx, radius ceil(3·sigma) (length 2r+1). */
export function gaussianKernel(sigmaPx: number): Float64Array {
  if (!(sigmaPx > 0) || !Number.isFinite(sigmaPx)) throw new Error(`sigmaPx must be a positive number, got ${sigmaPx}`);
  const r = Math.max(1, Math.ceil(3 * sigmaPx));
  const k = new Float64Array(2 * r + 1);
  let total = 0;
  for (let i = -r; i <= r; i++) {
    k[i + r] = Math.exp((-i * i) / (2 * sigmaPx * sigmaPx));
    total += k[i + r];
  }
  for (let i = 0; i < k.length; i++) k[i] /= total;
  return k;
}

/** Convolve one line (stride-addressed) with kernel k; `pad` (length n + 2r) holds the line with replicated ends. */
function convolveLine(src: Float32Array, dst: Float32Array, start: number, stride: number, n: number, k: Float64Array, pad: Float64Array): void {
  const r = (k.length - 1) >> 1;
  for (let i = 0; i < r; i++) { pad[i] = src[start]; pad[n + r + i] = src[start + (n - 1) * stride]; }
  for (let i = 0; i < n; i++) pad[r + i] = src[start + i * stride];
  const len = k.length;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < len; j++) s += k[j] * pad[i + j];
    dst[start + i * stride] = s;
  }
}

/** Gaussian-smoothed copy of a plane (sigma in pixels, same for x and y; sigma 0 returns a copy). */
export function gaussianSmooth(plane: Plane, sigmaPx: number): Plane {
  const { width, height } = plane;
  if (sigmaPx === 0) return { width, height, data: Float32Array.from(plane.data) };
  const k = gaussianKernel(sigmaPx);
  const tmp = new Float32Array(width * height);
  const out = new Float32Array(width * height);
  const pad = new Float64Array(Math.max(width, height) + k.length);
  for (let y = 0; y < height; y++) convolveLine(plane.data, tmp, y * width, 1, width, k, pad);
  for (let x = 0; x < width; x++) convolveLine(tmp, out, x, width, height, k, pad);
  return { width, height, data: out };
}
