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

/** Histogram counts with the count below lo and the number of non-NaN values (the total for quantiles). */
interface Histogram {
  readonly counts: Float64Array;
  readonly below: number;
  readonly total: number;
}

/**
 * Histogram of the values within [lo, hi] (values outside are ignored) and the count below lo. Only called once the
 * values are known to hold no infinity (min and max are finite). Counts go to slots [bins..., below lo, above hi,
 * NaN] of one of four sub-histograms in turn: neighbouring pixels often fall in the same bin, and separate counters
 * break the chain of dependent increments (integer counts, so the sums are exact). The slot is found without
 * branches (0/1 flags and masks), as half the values of a typical image lie beyond hi in no predictable order. For
 * lo ≤ v ≤ hi the bin position (v − lo)·scale lies in [0, bins], where truncation (| 0) equals Math.floor; it is
 * clamped to the last bin.
 */
function histogram(values: Float32Array | Float64Array, lo: number, hi: number, bins: number): Histogram {
  const stride = bins + 3;
  const c = new Int32Array(4 * stride);
  countInRange(values, lo, hi, bins, c);
  const n = values.length;
  const sum = (k: number): number => c[k] + c[stride + k] + c[2 * stride + k] + c[3 * stride + k];
  const counts = new Float64Array(bins);
  for (let b = 0; b < bins; b++) counts[b] = sum(b);
  return { counts, below: sum(bins), total: n - sum(bins + 2) };
}

/** The counting loop of histogram (a function of its own, as countFullRange), into c (4 × (bins + 3) slots). */
function countInRange(values: Float32Array | Float64Array, lo: number, hi: number, bins: number, c: Int32Array): void {
  const stride = bins + 3;
  const scale = bins / (hi - lo);
  const last = bins - 1;
  const n = values.length;
  for (let i = 0; i < n; i++) {
    const v = values[i];
    const keep = -(+(v >= lo) & +(v <= hi));
    const over = (((v - lo) * scale) | 0) - last;
    const bin = last + (over & (over >> 31));
    c[(i & 3) * stride + ((bin & keep) | ((last + 2 - +(v < lo) + +(v !== v)) & ~keep))]++;
  }
}

/**
 * histogram(values, min, max, bins) for values without NaN whose minimum and maximum are min and max: every value
 * lies in range, so no tests are needed at all.
 */
function fullRangeHistogram(values: Float32Array | Float64Array, min: number, max: number, bins: number): Histogram {
  const c0 = new Int32Array(bins);
  const c1 = new Int32Array(bins);
  const c2 = new Int32Array(bins);
  const c3 = new Int32Array(bins);
  countFullRange(values, min, bins / (max - min), c0, c1, c2, c3);
  const counts = new Float64Array(bins);
  for (let b = 0; b < bins; b++) counts[b] = c0[b] + c1[b] + c2[b] + c3[b];
  return { counts, below: 0, total: values.length };
}

/**
 * The counting loop of fullRangeHistogram, a function of its own so V8's on-stack-replaced code for it is not thrown
 * away at the loop's end on every call (see "Pixel loops in small functions" in DEVELOPERS.md).
 */
function countFullRange(values: Float32Array | Float64Array, min: number, scale: number, c0: Int32Array, c1: Int32Array, c2: Int32Array, c3: Int32Array): void {
  const last = c0.length - 1;
  const n = values.length;
  let i = 0;
  for (; i + 3 < n; i += 4) {
    const b0 = (((values[i] - min) * scale) | 0) - last;
    const b1 = (((values[i + 1] - min) * scale) | 0) - last;
    const b2 = (((values[i + 2] - min) * scale) | 0) - last;
    const b3 = (((values[i + 3] - min) * scale) | 0) - last;
    c0[last + (b0 & (b0 >> 31))]++;
    c1[last + (b1 & (b1 >> 31))]++;
    c2[last + (b2 & (b2 >> 31))]++;
    c3[last + (b3 & (b3 >> 31))]++;
  }
  for (; i < n; i++) { const b = (((values[i] - min) * scale) | 0) - last; c0[last + (b & (b >> 31))]++; }
}

/**
 * Minimum, maximum (±Infinity when there is no non-NaN value) and NaN count, with the same result as one scan that
 * keeps the first value strictly below (above) the current one: four lanes, and for a zero extreme the first zero
 * of the scan (so its sign is the one a single scan keeps).
 */
function extremes(data: Float32Array | Float64Array): { min: number; max: number; nan: number } {
  let a0 = Infinity; let a1 = Infinity; let a2 = Infinity; let a3 = Infinity;
  let b0 = -Infinity; let b1 = -Infinity; let b2 = -Infinity; let b3 = -Infinity;
  let nan = 0;
  const n = data.length;
  let i = 0;
  for (; i + 3 < n; i += 4) {
    const v0 = data[i]; const v1 = data[i + 1]; const v2 = data[i + 2]; const v3 = data[i + 3];
    if (v0 < a0) a0 = v0; if (v0 > b0) b0 = v0;
    if (v1 < a1) a1 = v1; if (v1 > b1) b1 = v1;
    if (v2 < a2) a2 = v2; if (v2 > b2) b2 = v2;
    if (v3 < a3) a3 = v3; if (v3 > b3) b3 = v3;
    nan += +(v0 !== v0) + +(v1 !== v1) + +(v2 !== v2) + +(v3 !== v3);
  }
  for (; i < n; i++) { const v = data[i]; if (v < a0) a0 = v; if (v > b0) b0 = v; nan += +(v !== v); }
  let min = Math.min(a0, a1, a2, a3);
  let max = Math.max(b0, b1, b2, b3);
  if (min === 0 || max === 0) {
    let k = 0;
    while (data[k] !== 0) k++;
    if (min === 0) min = data[k];
    if (max === 0) max = data[k];
  }
  return { min, max, nan };
}

/** Value at cumulative fraction p of a histogram over [lo, hi] (count `below` lies under lo), linear within a bin. */
function histogramQuantile(h: Histogram, lo: number, hi: number, p: number): number {
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
  const { min, max, nan } = extremes(data);
  if (!(max >= min) || !Number.isFinite(max - min)) return { level: Number.isFinite(min) ? min : 0, noiseSd: 1 };
  const floor = Math.max(1e-6 * (max - min), 1e-12);
  if (max === min) return { level: min, noiseSd: floor };
  const coarse = nan === 0 ? fullRangeHistogram(data, min, max, 4096) : histogram(data, min, max, 4096);
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
