// Confidence interval of a standard deviation from the chi-square distribution of (n − 1)·s²/σ² (normal data).
import chisqQuantile from '@stdlib/stats-base-dists-chisquare-quantile';

/** Two-sided interval [s·√((n−1)/χ²_{1−α/2}), s·√((n−1)/χ²_{α/2})] for σ; NaNs when n < 2 or s is not finite. */
export function sdConfidenceInterval(sd: number, n: number, level = 0.95): readonly [number, number] {
  if (!(n >= 2) || !Number.isFinite(sd) || !(level > 0 && level < 1)) return [NaN, NaN];
  const dof = n - 1;
  const alpha = 1 - level;
  return [sd * Math.sqrt(dof / chisqQuantile(1 - alpha / 2, dof)), sd * Math.sqrt(dof / chisqQuantile(alpha / 2, dof))];
}
