// Exact Euclidean distance transform: a two-scan column pass, then the Felzenszwalb–Huttenlocher lower envelope per row.
import type { Mask } from '../model';

/** Column distance meaning "no feature in this column" (any value ≥ the image height would do). */
const NONE = 0x3fffffff;

/**
 * Distance (px, not squared) to the nearest feature in the same column, NONE when the column has none. Integer
 * scans down and up the columns, whole rows at a time in memory order (cache-friendly on wide images).
 */
function columnDistances(features: Mask): Int32Array {
  const { width, height, data } = features;
  const out = new Int32Array(width * height);
  const last = new Int32Array(width).fill(-NONE);
  for (let y = 0; y < height; y++) {
    const o = y * width;
    for (let x = 0; x < width; x++) {
      if (data[o + x] !== 0) last[x] = y;
      out[o + x] = y - last[x];
    }
  }
  last.fill(2 * NONE);
  for (let y = height - 1; y >= 0; y--) {
    const o = y * width;
    for (let x = 0; x < width; x++) {
      if (data[o + x] !== 0) last[x] = y;
      const dy = last[x] - y;
      if (dy < out[o + x]) out[o + x] = dy;
    }
  }
  return out;
}

/** Scratch lines of the row pass, allocated once per call. */
interface RowScratch { readonly v: Int32Array; readonly fv: Float64Array; readonly z: Float64Array; readonly d: Float64Array }

/** Scratch lines for rows of n pixels. */
function rowScratch(n: number): RowScratch {
  return { v: new Int32Array(n), fv: new Float64Array(n), z: new Float64Array(n + 1), d: new Float64Array(n) };
}

/**
 * Squared distances along one row into line.d, from the column distances g[o..o+n) (f = g², +Infinity for NONE),
 * by the lower envelope of parabolas (from memory: Felzenszwalb–Huttenlocher 2012), with the same arithmetic as
 * over an explicit f line. The envelope keeps each parabola's f beside its position, so the second scan never goes
 * back to g and no row is copied. Returns false when the row has no finite f (line.d is then not written).
 */
function envelopeRow(g: Int32Array, o: number, n: number, line: RowScratch): boolean {
  const { v, fv, z, d } = line;
  let k = -1;
  for (let q = 0; q < n; q++) {
    const gq = g[o + q];
    if (gq >= NONE) continue;
    const fq = gq * gq;
    if (k < 0) { k = 0; v[0] = q; fv[0] = fq; z[0] = -Infinity; z[1] = Infinity; continue; }
    let s = (fq + q * q - (fv[k] + v[k] * v[k])) / (2 * q - 2 * v[k]);
    while (s <= z[k]) {
      k--;
      s = (fq + q * q - (fv[k] + v[k] * v[k])) / (2 * q - 2 * v[k]);
    }
    k++;
    v[k] = q;
    fv[k] = fq;
    z[k] = s;
    z[k + 1] = Infinity;
  }
  if (k < 0) return false;
  k = 0;
  for (let q = 0; q < n; q++) {
    while (z[k + 1] < q) k++;
    const dq = q - v[k];
    d[q] = dq * dq + fv[k];
  }
  return true;
}

/**
 * Squared Euclidean distance (px²) from each pixel centre to the nearest pixel where `isFeature` is 1.
 * Infinity everywhere when there is no feature pixel. Pixels outside the image are not features.
 * The values are sums of two squared integers, so they are exact.
 */
export function squaredDistanceToFeatures(features: Mask): Float64Array {
  const { width, height } = features;
  const g = columnDistances(features);
  const out = new Float64Array(width * height);
  const line = rowScratch(width);
  for (let o = 0; o < out.length; o += width) {
    if (envelopeRow(g, o, width, line)) out.set(line.d, o);
    else out.fill(Infinity, o, o + width);
  }
  return out;
}

/**
 * Bounding box of the foreground [x0, x1) × [y0, y1); null for an empty mask. Each row is searched from the left
 * for its first and from the right for its last foreground pixel, so rows through the object are not read in full.
 */
export function foregroundBox(mask: Mask): { x0: number; y0: number; x1: number; y1: number } | null {
  const { width, height, data } = mask;
  let x0 = width; let y0 = height; let x1 = -1; let y1 = -1;
  // Runs of zeros (the empty rows above and below the object, the background beside it) are skipped four bytes at a
  // time through a 32-bit view of the whole words the mask's bytes hold.
  const start = (4 - (data.byteOffset & 3)) & 3;
  const words = data.length > start ? new Uint32Array(data.buffer, data.byteOffset + start, (data.length - start) >> 2) : new Uint32Array(0);
  for (let y = 0; y < height; y++) {
    const o = y * width;
    const a = firstNonZero(data, words, start, o, o + width) - o;
    if (a === width) continue;
    let b = width - 1;
    while (data[o + b] === 0) b--;
    if (a < x0) x0 = a;
    if (b > x1) x1 = b;
    if (y < y0) y0 = y;
    y1 = y;
  }
  return x1 < 0 ? null : { x0, y0, x1: x1 + 1, y1: y1 + 1 };
}

/**
 * Index of the first non-zero byte of data[from..to), or `to` when there is none. `words` views data's bytes from
 * `start` on as 32-bit words (word k holds bytes start + 4k … start + 4k + 3): whole zero words are passed at once.
 */
function firstNonZero(data: Uint8Array, words: Uint32Array, start: number, from: number, to: number): number {
  let i = from;
  while (i < to && (i < start || ((i - start) & 3) !== 0)) { if (data[i] !== 0) return i; i++; }
  if (i >= to) return to;
  let k = (i - start) >> 2;
  const kEnd = (to - start) >> 2;
  while (k < kEnd && words[k] === 0) k++;
  i = start + 4 * k;
  while (i < to && data[i] === 0) i++;
  return i;
}

/**
 * Distance (px) from each foreground pixel centre to the nearest background pixel centre; 0 on background.
 * The region beyond the image border counts as background, so a mask touching the border still has finite depth.
 * Only the foreground's bounding box plus a one-pixel background ring is transformed: every background pixel
 * beyond that ring is farther from any foreground pixel than its clamped image on the ring. The square root is
 * taken straight from each row of the row pass, for foreground pixels only.
 */
export function distanceInside(mask: Mask): Float32Array {
  const { width, height } = mask;
  const out = new Float32Array(width * height);
  const box = foregroundBox(mask);
  if (box === null) return out;
  const pw = box.x1 - box.x0 + 2;
  const ph = box.y1 - box.y0 + 2;
  const padded = new Uint8Array(pw * ph).fill(1);
  // The pixel loops are functions of their own (see "Pixel loops in small functions" in DEVELOPERS.md).
  backgroundInBox(mask.data, width, box.x0, box.y0, box.x1, box.y1, padded, pw);
  const g = columnDistances({ width: pw, height: ph, data: padded });
  const line = rowScratch(pw);
  rootsInBox(g, line, width, box.x0, box.y0, box.x1, box.y1, pw, out);
  return out;
}

/** padded[(y − y0 + 1)·pw + 1 + x − x0] = 1 where data[y·width + x] is background (0), else 0, over the box. */
function backgroundInBox(data: Uint8Array, width: number, x0: number, y0: number, x1: number, y1: number, padded: Uint8Array, pw: number): void {
  for (let y = y0; y < y1; y++) {
    const o = y * width;
    const po = (y - y0 + 1) * pw + 1 - x0;
    for (let x = x0; x < x1; x++) padded[po + x] = +(data[o + x] === 0);
  }
}

/** The row pass over the box's rows of the padded column distances g, each row's square roots into out. */
function rootsInBox(g: Int32Array, line: RowScratch, width: number, x0: number, y0: number, x1: number, y1: number, pw: number, out: Float32Array): void {
  const d = line.d;
  for (let y = y0; y < y1; y++) {
    // The ring holds background on every row, so each row of the box has finite distances.
    envelopeRow(g, (y - y0 + 1) * pw, pw, line);
    const o = y * width;
    const po = 1 - x0;
    // Background pixels are features of the padded mask (d = 0), so they get sqrt(0) = 0 without a branch.
    for (let x = x0; x < x1; x++) out[o + x] = Math.sqrt(d[po + x]);
  }
}

/**
 * Distance (px) from each pixel centre to the nearest foreground pixel centre (0 on the foreground). The square
 * root is taken row by row straight from the row pass, without a full-size array of squared distances.
 */
export function distanceOutside(mask: Mask): Float32Array {
  const { width } = mask;
  const g = columnDistances(mask);
  const out = new Float32Array(g.length);
  const line = rowScratch(width);
  for (let o = 0; o < out.length; o += width) {
    if (!envelopeRow(g, o, width, line)) { out.fill(Infinity, o, o + width); continue; }
    const d = line.d;
    for (let x = 0; x < width; x++) out[o + x] = Math.sqrt(d[x]);
  }
  return out;
}

/**
 * 1 where the squared distance to the nearest feature is at most maxSquaredPx (a disk dilation of the features),
 * thresholded row by row without a full-size array of squared distances.
 */
export function withinSquaredDistance(features: Mask, maxSquaredPx: number): Uint8Array {
  const { width } = features;
  const g = columnDistances(features);
  const out = new Uint8Array(g.length);
  const line = rowScratch(width);
  for (let o = 0; o < out.length; o += width) {
    if (!envelopeRow(g, o, width, line)) continue;
    const d = line.d;
    for (let x = 0; x < width; x++) out[o + x] = +(d[x] <= maxSquaredPx);
  }
  return out;
}
