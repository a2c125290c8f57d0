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

/**
 * The background is assumed to be the darkest large population: its level is the mode of the histogram of the
 * darker half of the pixels; its noise SD comes from the darker flank only (where no embryo pixels mix in):
 * for a normal peak holding a fraction p of the values below its mode, μ − σ sits at the quantile 0.3173·p.
 */
export function estimateBackgroundLevel(values: ArrayLike<number>): BackgroundLevel {
  const s = sortedSample(values);
  if (s.length === 0) return { level: 0, noiseSd: 1 };
  const lo = sortedQuantile(s, 0.001);
  const hi = sortedQuantile(s, 0.5);
  const range = s[s.length - 1] - s[0];
  const floor = Math.max(1e-6 * range, 1e-12);
  if (!(hi > lo)) return { level: hi, noiseSd: floor };
  const bins = 256;
  const hist = new Float64Array(bins);
  const scale = bins / (hi - lo);
  const end = Math.ceil(s.length * 0.5);
  for (let i = 0; i < end; i++) if (s[i] >= lo) hist[Math.min(bins - 1, Math.floor((s[i] - lo) * scale))]++;
  let best = 0;
  for (let b = 1; b < bins; b++) if (hist[b] > hist[best]) best = b;
  const level = lo + (best + 0.5) / scale;
  let below = 0;
  while (below < s.length && s[below] < level) below++;
  const sdQuantile = sortedQuantile(s, (0.3173 * below) / s.length);
  return { level, noiseSd: Math.max(level - sdQuantile, floor) };
}
