// Exact Euclidean distance transform: a two-scan column pass, then the Felzenszwalb–Huttenlocher lower envelope per row.
import type { Mask } from '../model';

/** 1-D squared distance transform of f (f = 0 at features, +Infinity elsewhere) into d. */
function edt1d(f: Float64Array, n: number, d: Float64Array, v: Int32Array, z: Float64Array): void {
  let k = 0;
  let first = -1;
  for (let q = 0; q < n; q++) if (f[q] !== Infinity) { first = q; break; }
  if (first < 0) { d.fill(Infinity, 0, n); return; }
  v[0] = first;
  z[0] = -Infinity;
  z[1] = Infinity;
  for (let q = first + 1; q < n; q++) {
    if (f[q] === Infinity) continue;
    let s = (f[q] + q * q - (f[v[k]] + v[k] * v[k])) / (2 * q - 2 * v[k]);
    while (s <= z[k]) {
      k--;
      s = (f[q] + q * q - (f[v[k]] + v[k] * v[k])) / (2 * q - 2 * v[k]);
    }
    k++;
    v[k] = q;
    z[k] = s;
    z[k + 1] = Infinity;
  }
  k = 0;
  for (let q = 0; q < n; q++) {
    while (z[k + 1] < q) k++;
    const dq = q - v[k];
    d[q] = dq * dq + f[v[k]];
  }
}

/**
 * Squared Euclidean distance (px²) from each pixel centre to the nearest pixel where `isFeature` is 1.
 * Infinity everywhere when there is no feature pixel. Pixels outside the image are not features.
 */
export function squaredDistanceToFeatures(features: Mask): Float64Array {
  const { width, height } = features;
  const out = columnDistances(features);
  const n = width;
  const f = new Float64Array(n);
  const d = new Float64Array(n);
  const v = new Int32Array(n);
  const z = new Float64Array(n + 1);
  for (let y = 0; y < height; y++) {
    const o = y * width;
    for (let x = 0; x < width; x++) f[x] = out[o + x];
    edt1d(f, width, d, v, z);
    for (let x = 0; x < width; x++) out[o + x] = d[x];
  }
  return out;
}

/**
 * Squared distance (px²) to the nearest feature in the same column (Infinity when the column has none). For a
 * binary input this 1-D pass is two scans; walking rows in memory order keeps it cache-friendly on wide images.
 */
function columnDistances(features: Mask): Float64Array {
  const { width, height, data } = features;
  const out = new Float64Array(width * height);
  const last = new Float64Array(width).fill(-Infinity);
  for (let y = 0; y < height; y++) {
    const o = y * width;
    for (let x = 0; x < width; x++) {
      if (data[o + x]) last[x] = y;
      const dy = y - last[x];
      out[o + x] = dy * dy;
    }
  }
  last.fill(Infinity);
  for (let y = height - 1; y >= 0; y--) {
    const o = y * width;
    for (let x = 0; x < width; x++) {
      if (data[o + x]) last[x] = y;
      const dy = last[x] - y;
      const sq = dy * dy;
      if (sq < out[o + x]) out[o + x] = sq;
    }
  }
  return out;
}

/** Bounding box of the foreground [x0, x1) × [y0, y1); null for an empty mask. */
function foregroundBox(mask: Mask): { x0: number; y0: number; x1: number; y1: number } | null {
  const { width, height, data } = mask;
  let x0 = width; let y0 = height; let x1 = -1; let y1 = -1;
  for (let y = 0; y < height; y++) {
    const o = y * width;
    for (let x = 0; x < width; x++) {
      if (!data[o + x]) continue;
      if (x < x0) x0 = x;
      if (x > x1) x1 = x;
      if (y < y0) y0 = y;
      y1 = y;
    }
  }
  return x1 < 0 ? null : { x0, y0, x1: x1 + 1, y1: y1 + 1 };
}

/**
 * Distance (px) from each foreground pixel centre to the nearest background pixel centre; 0 on background.
 * The region beyond the image border counts as background, so a mask touching the border still has finite depth.
 * Only the foreground's bounding box plus a one-pixel background ring is transformed: every background pixel
 * beyond that ring is farther from any foreground pixel than its clamped image on the ring.
 */
export function distanceInside(mask: Mask): Float32Array {
  const { width, height } = mask;
  const out = new Float32Array(width * height);
  const box = foregroundBox(mask);
  if (box === null) return out;
  const pw = box.x1 - box.x0 + 2;
  const ph = box.y1 - box.y0 + 2;
  const padded = new Uint8Array(pw * ph).fill(1);
  for (let y = box.y0; y < box.y1; y++) {
    const o = y * width;
    const po = (y - box.y0 + 1) * pw + 1 - box.x0;
    for (let x = box.x0; x < box.x1; x++) padded[po + x] = mask.data[o + x] ? 0 : 1;
  }
  const sq = squaredDistanceToFeatures({ width: pw, height: ph, data: padded });
  for (let y = box.y0; y < box.y1; y++) {
    const o = y * width;
    const po = (y - box.y0 + 1) * pw + 1 - box.x0;
    for (let x = box.x0; x < box.x1; x++) if (mask.data[o + x]) out[o + x] = Math.sqrt(sq[po + x]);
  }
  return out;
}

/** Distance (px) from each pixel centre to the nearest foreground pixel centre (0 on the foreground). */
export function distanceOutside(mask: Mask): Float32Array {
  const sq = squaredDistanceToFeatures(mask);
  const out = new Float32Array(sq.length);
  for (let i = 0; i < sq.length; i++) out[i] = Math.sqrt(sq[i]);
  return out;
}
