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

/** The sampled pixels grouped by bin: order[start[b]] … order[start[b + 1] − 1] are the pixels of bin b, ascending. */
export interface BinGroups {
  readonly order: Int32Array;
  /** binCount + 1 offsets into order. */
  readonly start: Int32Array;
  /** Working space of order's length: one bin's values at a time are gathered here (groupedProfile; its contents
   *  are scratch, so a BinGroups serves one profile at a time). */
  readonly gathered: Float32Array;
}

/** Group the pixels with bins[k] ≥ 0 by bin (a counting sort that keeps ascending k within each bin). */
export function groupByBin(bins: Int32Array, binCount: number): BinGroups {
  const start = new Int32Array(binCount + 1);
  for (let k = 0; k < bins.length; k++) if (bins[k] >= 0) start[bins[k] + 1]++;
  for (let b = 0; b < binCount; b++) start[b + 1] += start[b];
  const order = new Int32Array(start[binCount]);
  const next = start.slice(0, binCount);
  for (let k = 0; k < bins.length; k++) if (bins[k] >= 0) order[next[bins[k]]++] = k;
  return { order, start, gathered: new Float32Array(order.length) };
}

/**
 * Per bin, the sum of values[k] − shift, its mean, and the sum of squared deviations from that mean, in ascending k
 * within the bin (one bin's pixels after another: the sums stay in registers). Empty bins get NaN means. Each bin's
 * values are gathered into `gathered` once (the pixels lie scattered over the image), and both sums read them there.
 */
function groupedMoments(values: Float32Array, order: Int32Array, start: Int32Array, binCount: number, mean: Float64Array, ss: Float64Array,
  gathered: Float32Array): void {
  for (let b = 0; b < binCount; b++) {
    const from = start[b];
    const to = start[b + 1];
    let sum = 0;
    for (let j = from; j < to; j++) { const v = values[order[j]]; gathered[j] = v; sum += v; }
    const m = to > from ? sum / (to - from) : NaN;
    let s2 = 0;
    for (let j = from; j < to; j++) { const d = gathered[j] - m; s2 += d * d; }
    mean[b] = m;
    ss[b] = s2;
  }
}

/**
 * Profile of `values` over bins: bin centres in x/EL and µm (µm NaN when eggLengthUm is null), mean, sample SD (n − 1;
 * 0 for one pixel), n. Empty bins have mean and SD NaN and n 0.
 */
export function binProfile(values: Float32Array, bins: Int32Array, binCount: number, channel: string, eggLengthUm: number | null): Profile {
  return groupedProfile(values, groupByBin(bins, binCount), channel, eggLengthUm);
}

/**
 * binProfile with the pixels already grouped by bin (groupByBin), so the bins of a series of images sampled at the
 * same pixels (a movie's time points) are grouped once. Every sum runs over a bin's pixels in ascending order, as
 * one pass over the pixels in order adding each to its bin does, so the numbers are those of that pass.
 */
export function groupedProfile(values: Float32Array, groups: BinGroups, channel: string, eggLengthUm: number | null): Profile {
  const binCount = groups.start.length - 1;
  const mean = new Float64Array(binCount);
  const ss = new Float64Array(binCount);
  groupedMoments(values, groups.order, groups.start, binCount, mean, ss, groups.gathered);
  const n = new Float64Array(binCount);
  const sd = new Float64Array(binCount);
  const xEl = new Float64Array(binCount);
  const xUm = new Float64Array(binCount);
  for (let b = 0; b < binCount; b++) {
    n[b] = groups.start[b + 1] - groups.start[b];
    sd[b] = n[b] > 1 ? Math.sqrt(ss[b] / (n[b] - 1)) : n[b] === 1 ? 0 : NaN;
    xEl[b] = (b + 0.5) / binCount;
    xUm[b] = eggLengthUm !== null ? xEl[b] * eggLengthUm : NaN;
  }
  return { channel, xEl, xUm, mean, sd, n };
}
