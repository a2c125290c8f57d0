// Welch's two-sample t interval for a difference of means (unequal variances, Welch–Satterthwaite dof).
import { meanOf, sdOf, tQuantileOf } from './stats-local';

/** Difference mean(b) − mean(a) with its standard error, Welch dof and two-sided CI at `level`. */
export interface MeanDifference {
  readonly difference: number;
  readonly se: number;
  readonly dof: number;
  readonly ciLow: number;
  readonly ciHigh: number;
}

/** Welch interval for mean(b) − mean(a); NaN spread when either sample has n < 2. */
export function welchDifference(a: readonly number[], b: readonly number[], level = 0.95): MeanDifference {
  const va = sdOf(a) ** 2 / a.length;
  const vb = sdOf(b) ** 2 / b.length;
  const difference = meanOf(b) - meanOf(a);
  const se = Math.sqrt(va + vb);
  // With no spread at all the Welch–Satterthwaite ratio is 0/0; the interval is then the point itself.
  const dof = se === 0 ? a.length + b.length - 2 : (va + vb) ** 2 / (va * va / (a.length - 1) + vb * vb / (b.length - 1));
  const t = tQuantileOf(1 - (1 - level) / 2, dof);
  return { difference, se, dof, ciLow: difference - t * se, ciHigh: difference + t * se };
}
