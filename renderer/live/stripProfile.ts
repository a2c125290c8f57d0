// Bins a straightened strip into a profile along x/EL (used for live updates while editing).
import type { Plane, Profile } from '../../core/model';

/**
 * Profile of a straightened strip (column i at x/EL = i/(width−1)): `binCount` equal bins over [0, 1], each the
 * mean and SD (population) of its finite pixels minus `background`, using only pixels where `select` is 1 (all
 * when omitted). Bins without pixels are NaN with n = 0.
 */
export function profileFromStrip(strip: Plane, eggLengthUm: number, binCount: number, background: number, channel: string, select?: Uint8Array): Profile {
  if (!Number.isInteger(binCount) || binCount < 1) throw new Error('binCount must be a positive integer');
  const sum = new Float64Array(binCount);
  const sumSq = new Float64Array(binCount);
  const n = new Float64Array(binCount);
  const last = strip.width - 1;
  for (let i = 0; i < strip.width; i += 1) {
    const b = Math.min(binCount - 1, Math.floor((i / last) * binCount));
    for (let j = 0; j < strip.height; j += 1) {
      const k = j * strip.width + i;
      const v = strip.data[k];
      if (!Number.isFinite(v) || (select !== undefined && select[k] === 0)) continue;
      const w = v - background;
      sum[b] += w;
      sumSq[b] += w * w;
      n[b] += 1;
    }
  }
  const xEl = new Float64Array(binCount).map((_, b) => (b + 0.5) / binCount);
  const mean = new Float64Array(binCount).map((_, b) => (n[b] > 0 ? sum[b] / n[b] : Number.NaN));
  const sd = new Float64Array(binCount).map((_, b) => (n[b] > 0 ? Math.sqrt(Math.max(0, sumSq[b] / n[b] - mean[b] ** 2)) : Number.NaN));
  return { channel, xEl, xUm: xEl.map((x) => x * eggLengthUm), mean, sd, n };
}
