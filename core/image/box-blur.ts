// Fast approximate Gaussian smoothing: three box filters in a row (running sums, cost independent of sigma).
import type { Plane } from '../model';

/**
 * Odd box widths of `passes` successive box filters whose combined variance equals sigmaPx² as closely as odd
 * integer widths allow (widths wl for the first m passes, wl + 2 for the rest).
 */
export function boxWidthsForSigma(sigmaPx: number, passes = 3): number[] {
  if (!(sigmaPx > 0) || !Number.isFinite(sigmaPx)) throw new Error(`sigmaPx must be a positive number, got ${sigmaPx}`);
  let wl = Math.floor(Math.sqrt((12 * sigmaPx * sigmaPx) / passes + 1));
  if (wl % 2 === 0) wl--;
  const wu = wl + 2;
  const m = Math.round((12 * sigmaPx * sigmaPx - passes * wl * wl - 4 * passes * wl - 3 * passes) / (-4 * wl - 4));
  return Array.from({ length: passes }, (_, i) => (i < m ? wl : wu));
}

/** Box mean of half-width r along one stride-addressed line, replicating the end pixels; pad has length n + 2r. */
function boxLine(src: Float32Array, dst: Float32Array, start: number, stride: number, n: number, r: number, pad: Float64Array): void {
  for (let i = 0; i < r; i++) { pad[i] = src[start]; pad[n + r + i] = src[start + (n - 1) * stride]; }
  for (let i = 0; i < n; i++) pad[r + i] = src[start + i * stride];
  const w = 2 * r + 1;
  let s = 0;
  for (let j = 0; j < w; j++) s += pad[j];
  for (let i = 0; i < n; i++) {
    dst[start + i * stride] = s / w;
    s += pad[i + w] - pad[i];
  }
}

/**
 * Box mean of half-width r down every column at once, walking rows in memory order (a column-by-column walk
 * misses the cache on wide images). Rows beyond the top and bottom replicate the edge rows.
 */
function boxColumns(src: Float32Array, dst: Float32Array, width: number, height: number, r: number, sums: Float64Array): void {
  const w = 2 * r + 1;
  const row = (y: number): number => (y < 0 ? 0 : y >= height ? height - 1 : y) * width;
  sums.fill(0);
  for (let y = -r; y <= r; y++) { const o = row(y); for (let x = 0; x < width; x++) sums[x] += src[o + x]; }
  for (let y = 0; y < height; y++) {
    const out = y * width;
    const add = row(y + r + 1);
    const sub = row(y - r);
    for (let x = 0; x < width; x++) {
      dst[out + x] = sums[x] / w;
      sums[x] += src[add + x] - src[sub + x];
    }
  }
}

/** Approximately Gaussian-smoothed copy (three box passes in x and in y; same size; edges replicated). */
export function fastGaussianSmooth(plane: Plane, sigmaPx: number): Plane {
  const { width, height } = plane;
  const widths = boxWidthsForSigma(sigmaPx);
  let cur = Float32Array.from(plane.data);
  let next = new Float32Array(cur.length);
  const pad = new Float64Array(Math.max(width, height) + Math.max(...widths) + 2);
  const sums = new Float64Array(width);
  for (const w of widths) {
    const r = (w - 1) >> 1;
    if (r === 0) continue;
    for (let y = 0; y < height; y++) boxLine(cur, next, y * width, 1, width, r, pad);
    [cur, next] = [next, cur];
    boxColumns(cur, next, width, height, r, sums);
    [cur, next] = [next, cur];
  }
  return { width, height, data: cur };
}
