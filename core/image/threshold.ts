// Global threshold by Otsu's method (maximum between-class variance of a histogram).

/**
 * Otsu threshold of the finite values (histogram of `bins` equal bins from min to max).
 * Returns the threshold value; pixels strictly above it form the bright class. All-equal input returns that value.
 */
export function otsuThreshold(values: ArrayLike<number>, bins = 256): number {
  if (!Number.isInteger(bins) || bins < 2) throw new Error(`bins must be an integer ≥ 2, got ${bins}`);
  const range = new Float64Array(2);
  finiteRange(values, range);
  const lo = range[0];
  const hi = range[1];
  if (!(hi >= lo)) throw new Error('otsuThreshold needs at least one finite value');
  if (hi === lo) return lo;
  const hist = new Float64Array(bins);
  const scale = bins / (hi - lo);
  histogramInto(values, lo, scale, hist);
  return lo + (otsuBin(hist) + 1) / scale;
}

/** Smallest and largest finite value into out = [lo, hi] (Infinity, −Infinity when there is none). A pixel loop
 *  of its own (see "Pixel loops in small functions" in DEVELOPERS.md). */
function finiteRange(values: ArrayLike<number>, out: Float64Array): void {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (Number.isFinite(v)) { if (v < lo) lo = v; if (v > hi) hi = v; }
  }
  out[0] = lo;
  out[1] = hi;
}

/** Counts of the finite values in `bins` equal bins from lo (bin width 1 / scale), the top value in the last bin. */
function histogramInto(values: ArrayLike<number>, lo: number, scale: number, hist: Float64Array): void {
  const bins = hist.length;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (Number.isFinite(v)) hist[Math.min(bins - 1, Math.floor((v - lo) * scale))]++;
  }
}

/** Index of the last histogram bin of the dark class that maximises the between-class variance. */
export function otsuBin(hist: ArrayLike<number>): number {
  let total = 0;
  let sumAll = 0;
  for (let i = 0; i < hist.length; i++) { total += hist[i]; sumAll += i * hist[i]; }
  let w0 = 0;
  let sum0 = 0;
  let best = -1;
  let bestBin = 0;
  for (let i = 0; i < hist.length - 1; i++) {
    w0 += hist[i];
    sum0 += i * hist[i];
    const w1 = total - w0;
    if (w0 === 0 || w1 === 0) continue;
    const d = sum0 / w0 - (sumAll - sum0) / w1;
    const between = w0 * w1 * d * d;
    if (between > best) { best = between; bestBin = i; }
  }
  return bestBin;
}
