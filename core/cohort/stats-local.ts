// Thin NaN-tolerant wrappers over core/stats: the cohort tables must show an empty cell (not stop) when a
// condition has one embryo, or a regression has no spread in ln f.
import { linearRegression, mean, sd, tQuantile, type LinearRegression } from '../stats';

/** Arithmetic mean (NaN for an empty list). */
export function meanOf(values: readonly number[]): number {
  return values.length === 0 ? NaN : mean(values);
}

/** Sample standard deviation with n − 1 (NaN when n < 2). */
export function sdOf(values: readonly number[]): number {
  return values.length < 2 ? NaN : sd(values);
}

/** Quantile p of Student's t distribution (dof may be fractional; NaN when dof is not positive). */
export function tQuantileOf(p: number, dof: number): number {
  return dof > 0 && Number.isFinite(dof) ? tQuantile(p, dof) : NaN;
}

/** Ordinary least squares y = intercept + slope·x with t-based CIs at `level` (two-sided). */
export type LineFit = Omit<LinearRegression, 'residualSd' | 'level'>;

/** Fit a straight line; every field NaN (n kept) when n < 2 or x has no spread. */
export function fitLine(x: readonly number[], y: readonly number[], level = 0.95): LineFit {
  if (x.length < 2 || new Set(x).size < 2) {
    return { slope: NaN, intercept: NaN, slopeSe: NaN, interceptSe: NaN, slopeCi: [NaN, NaN], interceptCi: [NaN, NaN], r2: NaN, n: x.length, dof: x.length - 2 };
  }
  const f = linearRegression(x, y, level);
  return { slope: f.slope, intercept: f.intercept, slopeSe: f.slopeSe, interceptSe: f.interceptSe, slopeCi: f.slopeCi, interceptCi: f.interceptCi, r2: f.r2, n: f.n, dof: f.dof };
}
