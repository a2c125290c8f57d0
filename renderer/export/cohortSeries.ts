// A simple cohort summary of one batch: mean min–max-scaled profile across embryos and the λ values.
import type { EmbryoResult } from '../../core/model';

/** Mean ± SD (population) across embryos per bin of min–max-scaled gradient profiles; embryos with a different bin count are left out. */
export function meanScaledProfile(results: readonly EmbryoResult[]): { xEl: Float64Array; mean: Float64Array; sd: Float64Array; count: number } | null {
  const profiles = results.map((r) => r.gradientProfile).filter((p): p is NonNullable<typeof p> => p !== null);
  const first = profiles[0];
  if (first === undefined) return null;
  const same = profiles.filter((p) => p.xEl.length === first.xEl.length);
  const scaled = same.map((p) => {
    const v = Array.from(p.mean).filter(Number.isFinite);
    const lo = Math.min(...v), hi = Math.max(...v);
    return Array.from(p.mean, (m) => (hi > lo ? (m - lo) / (hi - lo) : Number.NaN));
  });
  const n = first.xEl.length;
  const mean = new Float64Array(n), sd = new Float64Array(n);
  for (let b = 0; b < n; b += 1) {
    const vals = scaled.map((s) => s[b]).filter(Number.isFinite);
    const m = vals.reduce((a, x) => a + x, 0) / vals.length;
    mean[b] = vals.length > 0 ? m : Number.NaN;
    sd[b] = vals.length > 0 ? Math.sqrt(vals.reduce((a, x) => a + (x - m) ** 2, 0) / vals.length) : Number.NaN;
  }
  return { xEl: Float64Array.from(first.xEl), mean, sd, count: same.length };
}

/** λ (x/EL) of every embryo with a fit. */
export function lambdaValuesEl(results: readonly EmbryoResult[]): number[] {
  return results.map((r) => r.gradientFit?.lambdaEl ?? Number.NaN).filter(Number.isFinite);
}
