// Small statistics helpers used by the cohort step. Kept local so the cohort folder does not wait on core/stats;
// the formulas are the textbook ones (sample SD with n − 1, t-based intervals, ordinary least squares).
import tQuantileLib from '@stdlib/stats-base-dists-t-quantile';

/** Arithmetic mean of finite values (NaN for an empty list). */
export function meanOf(values: readonly number[]): number {
  if (values.length === 0) return NaN;
  let s = 0;
  for (const v of values) s += v;
  return s / values.length;
}

/** Sample standard deviation with n − 1 in the denominator (NaN when n < 2). */
export function sdOf(values: readonly number[]): number {
  if (values.length < 2) return NaN;
  const m = meanOf(values);
  let ss = 0;
  for (const v of values) ss += (v - m) * (v - m);
  return Math.sqrt(ss / (values.length - 1));
}

/** Quantile p of Student's t distribution with `dof` degrees of freedom (dof may be fractional). */
export function tQuantileOf(p: number, dof: number): number {
  if (!(dof > 0)) return NaN;
  return tQuantileLib(p, dof);
}

/** Ordinary least squares y = intercept + slope·x with t-based CIs at `level` (two-sided). */
export interface LineFit {
  readonly slope: number;
  readonly intercept: number;
  readonly slopeSe: number;
  readonly interceptSe: number;
  readonly slopeCi: readonly [number, number];
  readonly interceptCi: readonly [number, number];
  readonly r2: number;
  readonly n: number;
  readonly dof: number;
}

/** Fit a straight line by ordinary least squares; slope/intercept NaN when x has no spread or n < 2. */
export function fitLine(x: readonly number[], y: readonly number[], level = 0.95): LineFit {
  const n = x.length;
  const mx = meanOf(x);
  const my = meanOf(y);
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (x[i] - mx) * (x[i] - mx);
    sxy += (x[i] - mx) * (y[i] - my);
    syy += (y[i] - my) * (y[i] - my);
  }
  const slope = n >= 2 && sxx > 0 ? sxy / sxx : NaN;
  const intercept = my - slope * mx;
  let rss = 0;
  for (let i = 0; i < n; i++) rss += (y[i] - intercept - slope * x[i]) ** 2;
  const dof = n - 2;
  const s2 = dof > 0 ? rss / dof : NaN;
  const slopeSe = Math.sqrt(s2 / sxx);
  const interceptSe = Math.sqrt(s2 * (1 / n + (mx * mx) / sxx));
  const t = tQuantileOf(1 - (1 - level) / 2, dof);
  return {
    slope, intercept, slopeSe, interceptSe,
    slopeCi: [slope - t * slopeSe, slope + t * slopeSe],
    interceptCi: [intercept - t * interceptSe, intercept + t * interceptSe],
    r2: syy > 0 ? 1 - rss / syy : NaN,
    n, dof,
  };
}
