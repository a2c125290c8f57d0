// Gradient precision along the axis: per condition, the mean profile ± SD across embryos on a common x/EL grid,
// and the positional error the gradient implies, σx(x) = σC(x) / |dC̄/dx| — the method of Gregor, Tank,
// Wieschaus & Bialek (2007) "Probing the limits to positional information", Cell 130:153. The formula is first-order
// error propagation (the delta method; Casella & Berger, Statistical Inference, 2nd ed., §5.5.4, from memory): a
// concentration error σC read through a slope dC̄/dx is a position error σC/|dC̄/dx| while σC is small against the
// curvature of C̄, so it is an approximation where the profile bends within ±σx.
import type { EmbryoResult } from '../model';
import { sdConfidenceInterval } from '../stats';
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

/** Scale a profile: 'none' as is, 'amplitude' ÷ fitted A, 'minmax' to [0, 1]; null when it cannot be scaled.
 *  ('scale-offset' needs the mean profile and is done by conditionProfile; here it leaves the values as they are.) */
export function normaliseProfile(values: ArrayLike<number>, mode: Normalisation, amplitude: number | null): Float64Array | null {
  const v = Float64Array.from(values);
  if (mode === 'none' || mode === 'scale-offset') return v;
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

/** One embryo's profile on the grid and the variance of its bin means from pixel noise (SD²/n), both scaled. */
interface GridCurve { readonly file: string; values: Float64Array; noiseVar: Float64Array }

/** Profiles of the embryos on the grid with the chosen normalisation ('scale-offset' is applied afterwards). */
function gridCurves(embryos: readonly EmbryoResult[], grid: Float64Array, mode: Normalisation, warnings: string[]): GridCurve[] {
  const out: GridCurve[] = [];
  for (const e of embryos) {
    const p = e.gradientProfile;
    const scaleMode = mode === 'scale-offset' ? 'none' : mode;
    const scaled = p ? normaliseProfile(p.mean, scaleMode, e.gradientFit?.amplitude ?? null) : null;
    if (!p || !scaled) { warnings.push(`${e.file}: no ${p ? mode + '-normalised ' : ''}gradient profile; left out of the mean profile`); continue; }
    // The factor the normalisation divided by, to scale the noise variance the same way.
    const factor = scaledFactor(p.mean, scaled);
    const noise = Float64Array.from(p.sd, (sd, i) => (p.n[i] > 0 ? (sd * sd) / p.n[i] / (factor * factor) : NaN));
    out.push({ file: e.file, values: interpolateOnGrid(p.xEl, scaled, grid), noiseVar: interpolateOnGrid(p.xEl, noise, grid) });
  }
  return out;
}

/** The divisor d of a linear normalisation y = (x − c)/d, from two distinct finite points (1 when none). */
function scaledFactor(raw: ArrayLike<number>, scaled: ArrayLike<number>): number {
  let i0 = -1;
  for (let i = 0; i < raw.length; i++) {
    if (!Number.isFinite(raw[i]) || !Number.isFinite(scaled[i])) continue;
    if (i0 < 0) { i0 = i; continue; }
    if (raw[i] !== raw[i0] && scaled[i] !== scaled[i0]) return (raw[i] - raw[i0]) / (scaled[i] - scaled[i0]);
  }
  return 1;
}

/**
 * Aligns each curve to the mean by a fitted scale and offset (least squares c ≈ a·C̄ + b over the common points, then
 * (c − b)/a), twice, so that amplitude and background differences between embryos leave σC; curves whose scale is not
 * positive are dropped with a warning.
 */
function alignScaleOffset(curves: GridCurve[], length: number, warnings: string[]): GridCurve[] {
  let kept = curves;
  for (let round = 0; round < 2; round++) {
    const mean = pointwise(kept.map((c) => c.values), length).mean;
    const next: GridCurve[] = [];
    for (const c of kept) {
      let n = 0, sm = 0, sc = 0, smm = 0, smc = 0;
      for (let g = 0; g < length; g++) {
        if (!Number.isFinite(c.values[g]) || !Number.isFinite(mean[g])) continue;
        n++; sm += mean[g]; sc += c.values[g]; smm += mean[g] * mean[g]; smc += mean[g] * c.values[g];
      }
      const a = (n * smc - sm * sc) / (n * smm - sm * sm);
      const b = (sc - a * sm) / n;
      if (!(a > 0) || !Number.isFinite(b)) { warnings.push(`${c.file}: its profile does not scale onto the mean profile; left out of the mean profile`); continue; }
      next.push({ file: c.file, values: c.values.map((v) => (v - b) / a), noiseVar: c.noiseVar.map((v) => v / (a * a)) });
    }
    kept = next;
    if (kept.length === 0) break;
  }
  return kept;
}

/**
 * Mean profile ± SD across a condition's embryos and the implied positional error; warnings name skipped files. The
 * SD across embryos has the average measurement noise of a bin mean (pixel SD²/n, which understates it where pixels
 * are correlated) subtracted in variance; σx gets a chi-square interval from the number of embryos (the slope's own
 * uncertainty is not in it).
 */
export function conditionProfile(
  embryos: readonly EmbryoResult[], condition: ConditionInfo,
  options: { normalisation: Normalisation; gridStepEl: number; slopeHalfWidthEl: number; level?: number },
): { profile: ConditionProfile | null; warnings: string[] } {
  const grid = gridEl(options.gridStepEl);
  const warnings: string[] = [];
  let curves = gridCurves(embryos, grid, options.normalisation, warnings);
  if (options.normalisation === 'scale-offset' && curves.length > 1) curves = alignScaleOffset(curves, grid.length, warnings);
  if (curves.length === 0) return { profile: null, warnings };
  const stats = pointwise(curves.map((c) => c.values), grid.length);
  const noise = pointwise(curves.map((c) => c.noiseVar), grid.length).mean;
  const sdNoise = noise.map(Math.sqrt);
  const sdBetween = stats.sd.map((s, i) => (Number.isFinite(noise[i]) ? Math.sqrt(Math.max(0, s * s - noise[i])) : s));
  const slopePerEl = centralSlope(grid, stats.mean, options.slopeHalfWidthEl);
  const resolved = slopeResolved(stats, options.slopeHalfWidthEl / options.gridStepEl);
  const perSlope = (v: Float64Array): Float64Array => v.map((s, i) => (resolved[i] && Math.abs(slopePerEl[i]) > 0 ? s / Math.abs(slopePerEl[i]) : NaN));
  const sigmaXEl = perSlope(sdBetween);
  const ci = Array.from(sdBetween, (s, i) => sdConfidenceInterval(s, stats.n[i], options.level ?? 0.95));
  const sigmaXCiLowEl = perSlope(Float64Array.from(ci, (c) => c[0]));
  const sigmaXCiHighEl = perSlope(Float64Array.from(ci, (c) => c[1]));
  const lengths = embryos.map((e) => e.eggLengthUm).filter((v): v is number => v !== null && Number.isFinite(v));
  const meanEggLengthUm = lengths.length > 0 ? meanOf(lengths) : null;
  const sigmaXUm = sigmaXEl.map((s) => (meanEggLengthUm !== null ? s * meanEggLengthUm : NaN));
  return {
    profile: {
      condition: condition.name, dosage: condition.dosage, normalisation: options.normalisation, xEl: grid, ...stats, sdNoise, sdBetween,
      slopePerEl, sigmaXEl, sigmaXCiLowEl, sigmaXCiHighEl, sigmaXUm, meanEggLengthUm, embryoCount: curves.length,
    },
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
