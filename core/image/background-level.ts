// Robust background level and noise of an image from the low-intensity peak of its histogram.

/** Background level (histogram mode in the darker half) and noise SD (from the peak's darker flank), same units. */
export interface BackgroundLevel {
  readonly level: number;
  readonly noiseSd: number;
}

/** Sorted copy of at most ~maxCount finite values taken at a regular stride (enough for quantiles). */
export function sortedSample(values: ArrayLike<number>, maxCount = 65_536): Float32Array {
  const stride = Math.max(1, Math.floor(values.length / maxCount));
  const out = new Float32Array(Math.ceil(values.length / stride));
  let n = 0;
  for (let i = 0; i < values.length; i += stride) if (Number.isFinite(values[i])) out[n++] = values[i];
  return out.subarray(0, n).sort();
}

/** Quantile p (0..1) of ascending sorted values, linear interpolation between order statistics. */
export function sortedQuantile(sorted: ArrayLike<number>, p: number): number {
  if (sorted.length === 0) return NaN;
  const h = (sorted.length - 1) * Math.min(1, Math.max(0, p));
  const lo = Math.floor(h);
  const hi = Math.min(sorted.length - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** Values as a typed array, so the passes below see one or two array types only (copies other array-likes). */
function typed(values: ArrayLike<number>): Float32Array | Float64Array {
  return values instanceof Float32Array || values instanceof Float64Array ? values : Float64Array.from(values);
}

/**
 * Histogram of the values within [lo, hi] (values outside are ignored) and the count below lo. Only called once the
 * values are known to hold no infinity (min and max are finite), so NaN is the only value to skip; for lo ≤ v ≤ hi
 * the bin position (v − lo)·scale lies in [0, bins], where truncation (| 0) equals Math.floor.
 */
function histogram(values: Float32Array | Float64Array, lo: number, hi: number, bins: number): { counts: Float64Array; below: number; total: number } {
  // Two interleaved sub-histograms: neighbouring pixels often fall in the same bin, and alternating between two
  // count arrays halves the chain of dependent increments. Integer counts, so the sum is exact.
  const even = new Int32Array(bins);
  const odd = new Int32Array(bins);
  const scale = bins / (hi - lo);
  const last = bins - 1;
  let below = 0;
  let nan = 0;
  const n = values.length;
  for (let i = 0; i < n; i += 2) {
    const v = values[i];
    if (v >= lo) {
      if (v <= hi) { const b = ((v - lo) * scale) | 0; even[b < last ? b : last]++; }
    } else if (v < lo) below++;
    else nan++;
    if (i + 1 === n) break;
    const u = values[i + 1];
    if (u >= lo) {
      if (u <= hi) { const b = ((u - lo) * scale) | 0; odd[b < last ? b : last]++; }
    } else if (u < lo) below++;
    else nan++;
  }
  const counts = new Float64Array(bins);
  for (let b = 0; b < bins; b++) counts[b] = even[b] + odd[b];
  return { counts, below, total: n - nan };
}

/** Value at cumulative fraction p of a histogram over [lo, hi] (count `below` lies under lo), linear within a bin. */
function histogramQuantile(h: { counts: Float64Array; below: number; total: number }, lo: number, hi: number, p: number): number {
  const target = p * h.total;
  let acc = h.below;
  const width = (hi - lo) / h.counts.length;
  for (let b = 0; b < h.counts.length; b++) {
    if (acc + h.counts[b] >= target && h.counts[b] > 0) return lo + (b + (target - acc) / h.counts[b]) * width;
    acc += h.counts[b];
  }
  return hi;
}

/**
 * The background is assumed to be the darkest large population: its level is the mode of the histogram of the
 * darker half of the pixels; its noise SD comes from the darker flank only (where no embryo pixels mix in):
 * for a normal peak holding a fraction p of the values below its mode, μ − σ sits at the quantile 0.3173·p.
 * Histograms (no sorting) keep this O(N): a coarse one over the full range locates the darker half, a fine one
 * over that half resolves the peak.
 */
export function estimateBackgroundLevel(values: ArrayLike<number>): BackgroundLevel {
  const data = typed(values);
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < data.length; i++) { const v = data[i]; if (v < min) min = v; if (v > max) max = v; }
  if (!(max >= min) || !Number.isFinite(max - min)) return { level: Number.isFinite(min) ? min : 0, noiseSd: 1 };
  const floor = Math.max(1e-6 * (max - min), 1e-12);
  if (max === min) return { level: min, noiseSd: floor };
  const coarse = histogram(data, min, max, 4096);
  const lo = histogramQuantile(coarse, min, max, 0.001);
  const hi = Math.max(histogramQuantile(coarse, min, max, 0.5), lo + floor);
  const fine = histogram(data, lo, hi + (hi - lo) / 4096, 1024);
  let best = 0;
  for (let b = 1; b < fine.counts.length; b++) if (fine.counts[b] > fine.counts[best]) best = b;
  const width = (hi + (hi - lo) / 4096 - lo) / 1024;
  const level = lo + (best + 0.5) * width;
  let belowLevel = fine.below;
  for (let b = 0; b < best; b++) belowLevel += fine.counts[b];
  belowLevel += fine.counts[best] / 2;
  const sdQuantile = histogramQuantile(fine, lo, hi + (hi - lo) / 4096, (0.3173 * belowLevel) / fine.total);
  return { level, noiseSd: Math.max(level - sdQuantile, floor) };
}
