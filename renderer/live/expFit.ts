// Exponential gradient fit A·exp(−x/λ)+B for live updates (Levenberg–Marquardt, SE from the Jacobian).
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import type { ExponentialFit, Profile } from '../../core/model';
import { tQuantile } from '../../core/stats';

/** Inverse of a symmetric 3×3 matrix given row-major, or null when singular. */
export function invert3(m: readonly number[]): number[] | null {
  const [a, b, c, d, e, f, g, h, i] = m;
  const A = e * i - f * h, B = -(d * i - f * g), C = d * h - e * g;
  const det = a * A + b * B + c * C;
  if (!Number.isFinite(det) || Math.abs(det) < 1e-300) return null;
  return [A, -(b * i - c * h), b * f - c * e, B, a * i - c * g, -(a * f - c * d), C, -(a * h - b * g), a * e - b * d].map((v) => v / det + 0); // + 0 turns −0 into 0
}

/** Starting values [A, λ, B] from the data: B = last value, A = first − B, λ = a third of the x span. */
function startValues(x: number[], y: number[]): number[] {
  const b = Math.min(...y.slice(-3));
  const a = Math.max(y[0] - b, 1e-6) * Math.exp(x[0] / Math.max((x[x.length - 1] - x[0]) / 3, 1e-9));
  return [a, Math.max((x[x.length - 1] - x[0]) / 3, 1e-6), b];
}

/**
 * Fit A·exp(−x/λ)+B to the profile bins whose x/EL lies in rangeEl (ends included), x in µm from the anterior
 * pole. Returns the fit, or a one-line reason when it cannot be made.
 */
export function fitProfileExponential(profile: Profile, rangeEl: readonly [number, number], eggLengthUm: number): ExponentialFit | string {
  const x: number[] = [], y: number[] = [], xe: number[] = [];
  for (let k = 0; k < profile.xEl.length; k += 1) {
    if (profile.xEl[k] >= rangeEl[0] && profile.xEl[k] <= rangeEl[1] && Number.isFinite(profile.mean[k])) {
      x.push(profile.xUm[k]); y.push(profile.mean[k]); xe.push(profile.xEl[k]);
    }
  }
  if (x.length < 5) return `fit range ${rangeEl[0]}–${rangeEl[1]} EL holds ${x.length} bins; at least 5 are needed`;
  const model = ([A, L, B]: number[]) => (t: number) => A * Math.exp(-t / L) + B;
  const scale = Math.max(...y.map(Math.abs), 1e-12);
  const ys = y.map((v) => v / scale);
  const s0 = startValues(x, ys);
  const r = levenbergMarquardt({ x, y: ys }, model, {
    initialValues: s0, maxIterations: 300, errorTolerance: 1e-12, gradientDifference: 1e-6, centralDifference: true,
    minValues: [-1e6, 1e-6 * eggLengthUm, -1e6], maxValues: [1e6, 100 * eggLengthUm, 1e6],
  });
  const [As, L, Bs] = r.parameterValues;
  if (![As, L, Bs].every(Number.isFinite) || L <= 0) return 'the exponential fit did not converge';
  return summariseFit({ A: As * scale, L, B: Bs * scale }, x, y, xe, rangeEl, eggLengthUm, r.iterations);
}

/** Standard errors, 95% CI of λ, R² and residuals for fitted parameters. */
function summariseFit(p: { A: number; L: number; B: number }, x: number[], y: number[], xe: number[], rangeEl: readonly [number, number], eggLengthUm: number, iterations: number): ExponentialFit | string {
  const jtj = new Array(9).fill(0);
  const residuals = new Float64Array(x.length);
  let rss = 0;
  const my = y.reduce((s, v) => s + v, 0) / y.length;
  const tss = y.reduce((s, v) => s + (v - my) ** 2, 0);
  x.forEach((t, k) => {
    const e = Math.exp(-t / p.L);
    const j = [e, (p.A * t * e) / (p.L * p.L), 1];
    for (let r = 0; r < 3; r += 1) for (let c = 0; c < 3; c += 1) jtj[r * 3 + c] += j[r] * j[c];
    residuals[k] = y[k] - (p.A * e + p.B);
    rss += residuals[k] ** 2;
  });
  const dof = x.length - 3;
  const cov = invert3(jtj);
  if (cov === null) return 'the exponential fit is degenerate (flat profile in the fit range?)';
  const s2 = rss / dof;
  const se = [0, 4, 8].map((d) => Math.sqrt(Math.max(0, cov[d] * s2)));
  const tq = tQuantile(0.975, dof);
  return {
    amplitude: p.A, amplitudeSe: se[0], lambdaUm: p.L, lambdaSeUm: se[1],
    lambdaCiLowUm: p.L - tq * se[1], lambdaCiHighUm: p.L + tq * se[1],
    lambdaEl: p.L / eggLengthUm, lambdaSeEl: se[1] / eggLengthUm, background: p.B, backgroundSe: se[2],
    r2: tss > 0 ? 1 - rss / tss : Number.NaN, rss, dof, iterations, fitRangeEl: [rangeEl[0], rangeEl[1]],
    xEl: Float64Array.from(xe), residuals,
  };
}
