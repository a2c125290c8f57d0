// The decay length where a boundary sits: λ_local = (C̄(x) − B)/|dC̄/dx| on the reference condition's mean profile
// (raw intensities), B the mean fitted background. For an exact exponential it equals the global λ everywhere; where
// the profile bends (a second source, saturation, a plateau) it differs, and the boundary's shift follows the local
// value. Its prediction Δx = λ_local·ln f is shown beside the global one; the standard error is a jackknife over the
// reference embryos (leave one out; Efron & Tibshirani, An Introduction to the Bootstrap, ch. 11).
import type { EmbryoResult } from '../model';
import type { ConditionInfo } from '../model';
import { conditionProfile } from './profiles';
import { meanOf } from './stats-local';

/** λ_local (x/EL) and its jackknife SE at each requested position; NaNs where they cannot be read. */
export function localLambdaWithSe(
  reference: readonly EmbryoResult[], condition: ConditionInfo, positionsEl: readonly number[],
  options: { gridStepEl: number; slopeHalfWidthEl: number },
): { lambdaEl: number; seEl: number }[] {
  const full = localLambdaEl(reference, condition, positionsEl, options);
  const n = reference.length;
  if (n < 3) return full.map((v) => ({ lambdaEl: v, seEl: NaN }));
  const leaveOut = reference.map((_, k) => localLambdaEl(reference.filter((__, i) => i !== k), condition, positionsEl, options));
  return full.map((v, q) => {
    const values = leaveOut.map((r) => r[q]);
    if (!values.every(Number.isFinite)) return { lambdaEl: v, seEl: NaN };
    const m = meanOf(values);
    return { lambdaEl: v, seEl: Math.sqrt(((n - 1) / n) * values.reduce((s, x) => s + (x - m) ** 2, 0)) };
  });
}

/** λ_local (x/EL) at each requested position on the reference's mean profile; NaN where it cannot be read. */
export function localLambdaEl(
  reference: readonly EmbryoResult[], condition: ConditionInfo, positionsEl: readonly number[],
  options: { gridStepEl: number; slopeHalfWidthEl: number },
): number[] {
  const p = conditionProfile(reference, condition, { normalisation: 'none', ...options }).profile;
  const backgrounds = reference.flatMap((e) => (e.gradientFit && Number.isFinite(e.gradientFit.background) ? [e.gradientFit.background] : []));
  if (!p || backgrounds.length === 0) return positionsEl.map(() => NaN);
  const b = meanOf(backgrounds);
  return positionsEl.map((x) => {
    const c = interpolate(p.xEl, p.mean, x), s = interpolate(p.xEl, p.slopePerEl, x);
    return Number.isFinite(c) && Number.isFinite(s) && s !== 0 ? (c - b) / Math.abs(s) : NaN;
  });
}

/** Linear interpolation on an ascending grid; NaN outside it or next to a NaN. */
function interpolate(grid: Float64Array, values: Float64Array, x: number): number {
  if (!Number.isFinite(x) || x < grid[0] || x > grid[grid.length - 1]) return NaN;
  let i = 0;
  while (i < grid.length - 2 && grid[i + 1] < x) i++;
  const t = (x - grid[i]) / (grid[i + 1] - grid[i]);
  return values[i] + t * (values[i + 1] - values[i]);
}
