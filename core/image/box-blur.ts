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

/**
 * Box mean of half-width r along the row of n pixels at src[o], into dst[d..d+n), replicating the end pixels. The window sum runs
 * in float64 in the same order as over an explicitly padded line (so results are bit-identical to it); the loop is
 * split into the parts where the leaving or entering pixel is a replicated end, so no per-pixel clamping is needed.
 */
function boxRow(src: Float32Array, o: number, dst: Float32Array, d: number, n: number, r: number): void {
  const w = 2 * r + 1;
  const first = src[o];
  const last = src[o + n - 1];
  let s = 0;
  for (let j = -r; j <= r; j++) s += j < 0 ? first : j < n ? src[o + j] : last;
  // Pixel i leaves the window (index i − r) from lo on, the entering index i + r + 1 passes the end from hi on.
  const lo = Math.min(r, n);
  const hi = Math.max(0, n - r - 1);
  let i = 0;
  for (const e = Math.min(lo, hi); i < e; i++) { dst[d + i] = s / w; s += src[o + i + r + 1] - first; }
  if (lo <= hi) {
    // Interior, unrolled by four (less loop overhead; the same operations in the same order).
    const a = o + r + 1;
    const b = o - r;
    for (; i + 4 <= hi; i += 4) {
      dst[d + i] = s / w;
      s += src[a + i] - src[b + i];
      dst[d + i + 1] = s / w;
      s += src[a + i + 1] - src[b + i + 1];
      dst[d + i + 2] = s / w;
      s += src[a + i + 2] - src[b + i + 2];
      dst[d + i + 3] = s / w;
      s += src[a + i + 3] - src[b + i + 3];
    }
    for (; i < hi; i++) { dst[d + i] = s / w; s += src[a + i] - src[b + i]; }
  } else for (; i < lo; i++) { dst[d + i] = s / w; s += last - first; }
  for (; i < n; i++) { dst[d + i] = s / w; s += last - src[o + i - r]; }
}

/**
 * One box pass in x and then in y (half-width r, edges replicated), from src into dst. The y pass sums down every
 * column at once, walking rows in memory order; each x-smoothed row is made just before the y pass first needs it,
 * in a ring of 2r + 2 rows (all the y window needs), so it is still in the cache when it enters the running column
 * sums and, 2r + 1 rows later, when it leaves them. Sums run in float64 in the same order as two separate full
 * passes, so results are identical. src and dst may be the same array: row k of src is smoothed into the ring before
 * row k of dst is written.
 */
function boxPass(src: Float32Array, ring: Float32Array, dst: Float32Array, width: number, height: number, r: number, sums: Float64Array): void {
  const w = 2 * r + 1;
  const last = height - 1;
  const slots = Math.min(2 * r + 2, height);
  let ready = 0;
  sums.fill(0);
  for (let y = -r; y <= r; y++) {
    const k = y < 0 ? 0 : y > last ? last : y;
    for (; ready <= k; ready++) boxRow(src, ready * width, ring, (ready % slots) * width, width, r);
    const o = (k % slots) * width;
    for (let x = 0; x < width; x++) sums[x] += ring[o + x];
  }
  for (let y = 0; y < height; y++) {
    const k = y + r + 1 > last ? last : y + r + 1;
    for (; ready <= k; ready++) boxRow(src, ready * width, ring, (ready % slots) * width, width, r);
    const out = y * width;
    const add = (k % slots) * width;
    const sub = ((y - r < 0 ? 0 : y - r) % slots) * width;
    slideColumns(ring, add, sub, dst, out, sums, width, w);
  }
}

/**
 * For every column x: dst[out + x] = sums[x] / w, then sums[x] += ring[add + x] − ring[sub + x]. Unrolled by four
 * (the columns are independent), which roughly halves the per-element loop overhead in V8; each column still gets
 * exactly the same operations in the same order.
 */
function slideColumns(ring: Float32Array, add: number, sub: number, dst: Float32Array, out: number, sums: Float64Array, width: number, w: number): void {
  let x = 0;
  for (; x + 4 <= width; x += 4) {
    const s0 = sums[x];
    const s1 = sums[x + 1];
    const s2 = sums[x + 2];
    const s3 = sums[x + 3];
    dst[out + x] = s0 / w;
    dst[out + x + 1] = s1 / w;
    dst[out + x + 2] = s2 / w;
    dst[out + x + 3] = s3 / w;
    sums[x] = s0 + (ring[add + x] - ring[sub + x]);
    sums[x + 1] = s1 + (ring[add + x + 1] - ring[sub + x + 1]);
    sums[x + 2] = s2 + (ring[add + x + 2] - ring[sub + x + 2]);
    sums[x + 3] = s3 + (ring[add + x + 3] - ring[sub + x + 3]);
  }
  for (; x < width; x++) {
    dst[out + x] = sums[x] / w;
    sums[x] += ring[add + x] - ring[sub + x];
  }
}

/**
 * Approximately Gaussian-smoothed copy (three box passes in x and in y; same size; edges replicated). The first
 * pass reads the input directly (no copy of it); later passes work in place in the output. `out` (optional, at
 * least width × height long, not the input's own array) receives the result instead of a new array, so a caller
 * smoothing several planes in turn can reuse one buffer; the returned plane's data is then a view of it.
 */
export function fastGaussianSmooth(plane: Plane, sigmaPx: number, out?: Float32Array): Plane {
  const { width, height } = plane;
  const widths = boxWidthsForSigma(sigmaPx);
  let cur = plane.data;
  const dst = out ? out.subarray(0, width * height) : new Float32Array(width * height);
  const ring = new Float32Array(Math.min(2 * ((Math.max(...widths) - 1) >> 1) + 2, height) * width);
  const sums = new Float64Array(width);
  for (const w of widths) {
    const r = (w - 1) >> 1;
    if (r === 0) continue;
    boxPass(cur, ring, dst, width, height, r, sums);
    cur = dst;
  }
  if (cur !== dst) dst.set(cur);
  return { width, height, data: dst };
}
