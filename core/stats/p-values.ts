// Tail probabilities of Student's t and the F distribution, and Holm's step-down adjustment of p-values.
import fCdf from '@stdlib/stats-base-dists-f-cdf';
import tCdf from '@stdlib/stats-base-dists-t-cdf';

/** Two-sided p-value of a t statistic with `dof` degrees of freedom (NaN when dof ≤ 0 or t is not finite). */
export function tTwoSidedP(t: number, dof: number): number {
  if (!(dof > 0) || !Number.isFinite(t)) return NaN;
  return Math.min(1, 2 * tCdf(-Math.abs(t), dof));
}

/** Upper-tail p-value P(F ≥ f) of the F distribution with (d1, d2) degrees of freedom (NaN when undefined). */
export function fUpperP(f: number, d1: number, d2: number): number {
  if (!(d1 > 0 && d2 > 0) || !Number.isFinite(f)) return NaN;
  return f <= 0 ? 1 : 1 - fCdf(f, d1, d2);
}

/**
 * Holm's (1979) step-down adjusted p-values, in the input order: sort ascending, multiply the i-th smallest
 * (0-based) by m − i, carry the running maximum, cap at 1. NaN entries stay NaN and do not count in m.
 */
export function holmAdjust(p: readonly number[]): number[] {
  const order = p.map((v, i) => i).filter((i) => Number.isFinite(p[i])).sort((a, b) => p[a] - p[b]);
  const m = order.length;
  const out = p.map(() => NaN);
  let running = 0;
  order.forEach((idx, rank) => {
    running = Math.max(running, Math.min(1, (m - rank) * p[idx]));
    out[idx] = running;
  });
  return out;
}
