// Exact Euclidean distance transform (Felzenszwalb & Huttenlocher lower-envelope algorithm, two 1-D passes).
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
  const { width, height, data } = features;
  const n = Math.max(width, height);
  const f = new Float64Array(n);
  const d = new Float64Array(n);
  const v = new Int32Array(n);
  const z = new Float64Array(n + 1);
  const out = new Float64Array(width * height);
  for (let x = 0; x < width; x++) {
    for (let y = 0; y < height; y++) f[y] = data[y * width + x] ? 0 : Infinity;
    edt1d(f, height, d, v, z);
    for (let y = 0; y < height; y++) out[y * width + x] = d[y];
  }
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) f[x] = out[y * width + x];
    edt1d(f, width, d, v, z);
    for (let x = 0; x < width; x++) out[y * width + x] = d[x];
  }
  return out;
}

/**
 * Distance (px) from each foreground pixel centre to the nearest background pixel centre; 0 on background.
 * The region beyond the image border counts as background, so a mask touching the border still has finite depth.
 */
export function distanceInside(mask: Mask): Float32Array {
  const { width, height } = mask;
  const pw = width + 2;
  const padded = new Uint8Array(pw * (height + 2)).fill(1);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) padded[(y + 1) * pw + x + 1] = mask.data[y * width + x] ? 0 : 1;
  }
  const sq = squaredDistanceToFeatures({ width: pw, height: height + 2, data: padded });
  const out = new Float32Array(width * height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) out[y * width + x] = Math.sqrt(sq[(y + 1) * pw + x + 1]);
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
