// Student t quantiles and t-based confidence intervals for a mean.
import tQuantileLib from '@stdlib/stats-base-dists-t-quantile';
import { checkFiniteValues, checkLevel } from './check';
import { mean, sem } from './descriptive';

/** Quantile of Student's t distribution: the t with P(T ≤ t) = p for `dof` degrees of freedom (dof > 0, may be fractional). */
export function tQuantile(p: number, dof: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`tQuantile: p must be between 0 and 1 (exclusive), got ${p}`);
  if (!(dof > 0)) throw new RangeError(`tQuantile: degrees of freedom must be positive, got ${dof}`);
  return tQuantileLib(p, dof);
}

/** A two-sided confidence interval for a mean (same units as the values). */
export interface MeanInterval {
  readonly mean: number;
  readonly low: number;
  readonly high: number;
  /** t × SEM; the interval is mean ± halfWidth. */
  readonly halfWidth: number;
  readonly sem: number;
  readonly n: number;
  readonly dof: number;
  readonly level: number;
}

/**
 * Two-sided t confidence interval for the mean of `values` at `level` (default 0.95).
 * With a single value the mean is returned and low, high, halfWidth and sem are NaN.
 */
export function tConfidenceInterval(values: ArrayLike<number>, level = 0.95): MeanInterval {
  checkFiniteValues(values, 'tConfidenceInterval');
  checkLevel(level, 'tConfidenceInterval');
  const n = values.length;
  const m = mean(values);
  const dof = n - 1;
  if (dof < 1) return { mean: m, low: NaN, high: NaN, halfWidth: NaN, sem: NaN, n, dof, level };
  const s = sem(values);
  const halfWidth = tQuantile(0.5 + level / 2, dof) * s;
  return { mean: m, low: m - halfWidth, high: m + halfWidth, halfWidth, sem: s, n, dof, level };
}
