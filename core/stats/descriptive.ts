// Descriptive statistics on plain arrays or typed arrays. Inputs are never modified.
import { checkFiniteValues } from './check';

/** Arithmetic mean (same units as the values). Throws on empty or non-finite input. */
export function mean(values: ArrayLike<number>): number {
  checkFiniteValues(values, 'mean');
  let sum = 0;
  for (let i = 0; i < values.length; i++) sum += values[i];
  const first = sum / values.length;
  // One correction pass: removes most of the rounding error of the plain sum.
  let correction = 0;
  for (let i = 0; i < values.length; i++) correction += values[i] - first;
  return first + correction / values.length;
}

/** Sample standard deviation with the n−1 denominator; NaN for a single value. */
export function sd(values: ArrayLike<number>): number {
  checkFiniteValues(values, 'sd');
  if (values.length < 2) return NaN;
  const m = mean(values);
  let ss = 0;
  for (let i = 0; i < values.length; i++) ss += (values[i] - m) ** 2;
  return Math.sqrt(ss / (values.length - 1));
}

/** Standard error of the mean, sd / √n; NaN for a single value. */
export function sem(values: ArrayLike<number>): number {
  checkFiniteValues(values, 'sem');
  return sd(values) / Math.sqrt(values.length);
}

/** Sorted copy as a Float64Array (ascending). */
function sortedCopy(values: ArrayLike<number>): Float64Array {
  return Float64Array.from(values).sort();
}

/**
 * Quantile with linear interpolation between order statistics (the common "type 7" definition:
 * h = (n − 1)·p, so p = 0 is the minimum and p = 1 the maximum).
 */
export function quantile(values: ArrayLike<number>, p: number): number {
  checkFiniteValues(values, 'quantile');
  if (!(p >= 0 && p <= 1)) throw new RangeError(`quantile: p must be between 0 and 1, got ${p}`);
  const sorted = sortedCopy(values);
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** Median (the 0.5 quantile; mean of the two middle values for even n). */
export function median(values: ArrayLike<number>): number {
  checkFiniteValues(values, 'median');
  return quantile(values, 0.5);
}

/** Median absolute deviation from the median (raw, unscaled). */
export function mad(values: ArrayLike<number>): number {
  checkFiniteValues(values, 'mad');
  const m = median(values);
  const deviations = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) deviations[i] = Math.abs(values[i] - m);
  return median(deviations);
}

/** Scale factor that makes the MAD a consistent estimator of σ for normal data: 1/Φ⁻¹(3/4). */
export const MAD_TO_SIGMA = 1.482602218505602;

/** Robust estimate of σ: 1.4826 × MAD (same units as the values). */
export function robustSigma(values: ArrayLike<number>): number {
  checkFiniteValues(values, 'robustSigma');
  return MAD_TO_SIGMA * mad(values);
}
