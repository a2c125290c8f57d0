// Binning of sampled pixels along the AP axis into a profile (per bin mean, SD, n).
import type { ApAxis, Profile } from '../model';
import { axisFrame } from '../geometry';

/** Which pixels of a sample count: all, those left of A→P (offAxis > 0), or right of it (offAxis < 0). */
export type SideFilter = 'all' | 'left' | 'right';

/**
 * Bin index (0..binCount−1) of each pixel along the axis, or −1 when excluded: x/EL outside [0, 1], the wrong side,
 * or |offAxis| > maxOffAxisPx. Bin i covers [i/binCount, (i+1)/binCount); x/EL = 1 falls in the last bin.
 */
export function binIndices(xs: Float32Array, ys: Float32Array, axis: ApAxis, binCount: number, side: SideFilter, maxOffAxisPx = Infinity): Int32Array {
  const f = axisFrame(axis);
  const out = new Int32Array(xs.length);
  const ax = axis.anterior.x;
  const ay = axis.anterior.y;
  const inv = 1 / f.lengthPx;
  for (let k = 0; k < xs.length; k++) {
    const dx = xs[k] - ax;
    const dy = ys[k] - ay;
    const t = (dx * f.ux + dy * f.uy) * inv;
    const off = dx * f.nx + dy * f.ny;
    const sideOk = side === 'all' || (side === 'left' ? off > 0 : off < 0);
    out[k] = t >= 0 && t <= 1 && sideOk && Math.abs(off) <= maxOffAxisPx ? Math.min(binCount - 1, Math.floor(t * binCount)) : -1;
  }
  return out;
}

/**
 * Profile of `values` over bins: bin centres in x/EL and µm (µm NaN when eggLengthUm is null), mean, sample SD (n − 1;
 * 0 for one pixel), n. Empty bins have mean and SD NaN and n 0.
 */
export function binProfile(values: Float32Array, bins: Int32Array, binCount: number, channel: string, eggLengthUm: number | null): Profile {
  const sum = new Float64Array(binCount);
  const n = new Float64Array(binCount);
  for (let k = 0; k < bins.length; k++) if (bins[k] >= 0) { sum[bins[k]] += values[k]; n[bins[k]]++; }
  const mean = new Float64Array(binCount);
  for (let b = 0; b < binCount; b++) mean[b] = n[b] > 0 ? sum[b] / n[b] : NaN;
  const ss = new Float64Array(binCount);
  for (let k = 0; k < bins.length; k++) if (bins[k] >= 0) { const d = values[k] - mean[bins[k]]; ss[bins[k]] += d * d; }
  const sd = new Float64Array(binCount);
  const xEl = new Float64Array(binCount);
  const xUm = new Float64Array(binCount);
  for (let b = 0; b < binCount; b++) {
    sd[b] = n[b] > 1 ? Math.sqrt(ss[b] / (n[b] - 1)) : n[b] === 1 ? 0 : NaN;
    xEl[b] = (b + 0.5) / binCount;
    xUm[b] = eggLengthUm !== null ? xEl[b] * eggLengthUm : NaN;
  }
  return { channel, xEl, xUm, mean, sd, n };
}
