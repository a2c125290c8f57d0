// Gradient precision along the axis: per condition, the mean profile ± SD across embryos on a common x/EL grid,
// and the positional error the gradient implies, σx(x) = σC(x) / |dC̄/dx| — the method of Gregor, Tank,
// Wieschaus & Bialek (2007) "Probing the limits to positional information", Cell 130:153. The formula is first-order
// error propagation (the delta method; Casella & Berger, Statistical Inference, 2nd ed., §5.5.4, from memory): a
// concentration error σC read through a slope dC̄/dx is a position error σC/|dC̄/dx| while σC is small against the
// curvature of C̄, so it is an approximation where the profile bends within ±σx.
import type { EmbryoResult } from '../model';
import { meanOf, sdOf } from './stats-local';
import type { ConditionInfo, ConditionProfile, Normalisation } from '../model';

/** Grid from 0 to 1 x/EL inclusive with the given step (the last point is exactly 1). */
export function gridEl(stepEl: number): Float64Array {
  const count = Math.round(1 / stepEl) + 1;
  return Float64Array.from({ length: count }, (_, i) => Math.min(1, i * stepEl));
}

/** Linear interpolation of (xEl, values) at each grid point; NaN outside the data range (no extrapolation). */
export function interpolateOnGrid(xEl: ArrayLike<number>, values: ArrayLike<number>, grid: Float64Array): Float64Array {
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < xEl.length; i++) {
    if (Number.isFinite(xEl[i]) && Number.isFinite(values[i])) { xs.push(xEl[i]); ys.push(values[i]); }
  }
  const out = new Float64Array(grid.length).fill(NaN);
  if (xs.length === 0) return out;
  let j = 0;
  for (let g = 0; g < grid.length; g++) {
    const x = grid[g];
    if (x < xs[0] - 1e-12 || x > xs[xs.length - 1] + 1e-12) continue;
    while (j < xs.length - 2 && xs[j + 1] < x) j++;
    if (xs.length === 1) { out[g] = ys[0]; continue; }
    const t = xs[j + 1] === xs[j] ? 0 : (x - xs[j]) / (xs[j + 1] - xs[j]);
    out[g] = ys[j] + Math.max(0, Math.min(1, t)) * (ys[j + 1] - ys[j]);
  }
  return out;
}

/** Scale a profile: 'none' as is, 'amplitude' ÷ fitted A, 'minmax' to [0, 1]; null when it cannot be scaled. */
export function normaliseProfile(values: ArrayLike<number>, mode: Normalisation, amplitude: number | null): Float64Array | null {
  const v = Float64Array.from(values);
  if (mode === 'none') return v;
  if (mode === 'amplitude') return amplitude !== null && amplitude !== 0 && Number.isFinite(amplitude) ? v.map((x) => x / amplitude) : null;
  const finite = [...v].filter(Number.isFinite);
  const lo = Math.min(...finite);
  const hi = Math.max(...finite);
  return finite.length > 0 && hi > lo ? v.map((x) => (x - lo) / (hi - lo)) : null;
}

/** Slope by central difference over ±halfWidthEl on a uniform grid; NaN where a side is missing. */
export function centralSlope(xEl: Float64Array, values: Float64Array, halfWidthEl: number): Float64Array {
  const step = xEl.length > 1 ? xEl[1] - xEl[0] : 1;
  const k = Math.max(1, Math.round(halfWidthEl / step));
  return xEl.map((_, i) => (i - k < 0 || i + k >= xEl.length ? NaN : (values[i + k] - values[i - k]) / (xEl[i + k] - xEl[i - k])));
}

/** Mean profile ± SD across a condition's embryos and the implied positional error; warnings name skipped files. */
export function conditionProfile(
  embryos: readonly EmbryoResult[], condition: ConditionInfo,
  options: { normalisation: Normalisation; gridStepEl: number; slopeHalfWidthEl: number },
): { profile: ConditionProfile | null; warnings: string[] } {
  const grid = gridEl(options.gridStepEl);
  const curves: Float64Array[] = [];
  const warnings: string[] = [];
  for (const e of embryos) {
    const p = e.gradientProfile;
    const scaled = p ? normaliseProfile(p.mean, options.normalisation, e.gradientFit?.amplitude ?? null) : null;
    if (!p || !scaled) { warnings.push(`${e.file}: no ${p ? options.normalisation + '-normalised ' : ''}gradient profile; left out of the mean profile`); continue; }
    curves.push(interpolateOnGrid(p.xEl, scaled, grid));
  }
  if (curves.length === 0) return { profile: null, warnings };
  const stats = pointwise(curves, grid.length);
  const slopePerEl = centralSlope(grid, stats.mean, options.slopeHalfWidthEl);
  const resolved = slopeResolved(stats, options.slopeHalfWidthEl / options.gridStepEl);
  const sigmaXEl = stats.sd.map((s, i) => (resolved[i] && Math.abs(slopePerEl[i]) > 0 ? s / Math.abs(slopePerEl[i]) : NaN));
  const lengths = embryos.map((e) => e.eggLengthUm).filter((v): v is number => v !== null && Number.isFinite(v));
  const meanEggLengthUm = lengths.length > 0 ? meanOf(lengths) : null;
  const sigmaXUm = sigmaXEl.map((s) => (meanEggLengthUm !== null ? s * meanEggLengthUm : NaN));
  return {
    profile: { condition: condition.name, dosage: condition.dosage, xEl: grid, ...stats, slopePerEl, sigmaXEl, sigmaXUm, meanEggLengthUm, embryoCount: curves.length },
    warnings,
  };
}

/**
 * Where the mean profile's change across the slope window, |C̄(x+h) − C̄(x−h)|, exceeds twice its standard error
 * √(SD²(x+h)/n + SD²(x−h)/n). Elsewhere the gradient is too flat to read a position from and σx is left undefined
 * (otherwise noise-over-noise values dominate the posterior half of the plot).
 */
function slopeResolved(stats: { mean: Float64Array; sd: Float64Array; n: Float64Array }, halfSteps: number): boolean[] {
  const k = Math.max(1, Math.round(halfSteps));
  const len = stats.mean.length;
  return Array.from({ length: len }, (_, i) => {
    if (i - k < 0 || i + k >= len) return false;
    const change = Math.abs(stats.mean[i + k] - stats.mean[i - k]);
    const se = Math.sqrt(stats.sd[i + k] ** 2 / stats.n[i + k] + stats.sd[i - k] ** 2 / stats.n[i - k]);
    return Number.isFinite(se) && change > 2 * se;
  });
}

function pointwise(curves: readonly Float64Array[], length: number): { mean: Float64Array; sd: Float64Array; n: Float64Array } {
  const mean = new Float64Array(length);
  const sd = new Float64Array(length);
  const n = new Float64Array(length);
  for (let g = 0; g < length; g++) {
    const vals = curves.map((c) => c[g]).filter(Number.isFinite);
    n[g] = vals.length;
    mean[g] = vals.length > 0 ? meanOf(vals) : NaN;
    sd[g] = sdOf(vals);
  }
  return { mean, sd, n };
}
