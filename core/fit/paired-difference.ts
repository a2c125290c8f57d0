// The paired difference of two decay lengths fitted on the two sides of one embryo, λ_dorsal − λ_ventral.
// The sides share the axis, the egg length, the staining, the blur and the background estimate, so their errors
// at the same position along the axis are not independent: treating the two fits as independent would misstate
// the difference's SE (too wide when the errors are positively correlated, too narrow when negatively). Each fit's
// estimate is linear in its errors to first order, θ̂ − θ ≈ B·J̃ᵀε̃ (B = (J̃ᵀJ̃)⁻¹ of the whitened problem), so
//   Cov(θ̂_d, θ̂_v) = B_d·J̃_dᵀ·C·J̃_v·B_v,  C_ab = Cov(ε̃_d,a, ε̃_v,b).
// C is modelled as c·K_ab, with K = 1 at the same position and 0 elsewhere (errors independent between bins), or
// K = ρ̄^lag (first-order autoregressive errors, ρ̄ the mean of the two sides' ρ). c is matched to the residuals at
// shared positions in expectation through the residual makers, E[u_dᵀPu_v] = c·Σ_pairs (M_d·K·M_v)_ij, as the
// one-sided serial estimator matches ρ (serial-covariance.ts). The wider of the two SEs is used, as for λ itself.
import type { DecayLengthDifference } from '../model';
import { tQuantile } from '../stats';
import { inverseNormalMatrix } from './covariance';
import { effectiveDof, whitenedDecayJacobian, type WeightedExponentialFit } from './exponential';
import { ar1Covariance, residualMaker, traceWithAr1 } from './serial-covariance';

/** One side's fit and the weights it used at its points (fit.xEl order; null = unweighted), as the fit returns them. */
export type SideFit = WeightedExponentialFit;

/** Largest magnitude of the estimated correlation between the sides' errors (as ρ is clamped to ±0.95). */
const MAX_CORRELATION = 0.95;

/** What one side's fit contributes, in x/EL units: its whitened problem at the solution and its variances of k = 1/λ. */
interface SideDesign {
  readonly n: number;
  readonly xEl: Float64Array;
  readonly k: number;
  /** Whitened residuals and residual maker (n × n). */
  readonly u: Float64Array;
  readonly m: Float64Array;
  /** Row of B·J̃ᵀ for k: k̂ − k ≈ Σ_a g_a·ε̃_a. */
  readonly g: Float64Array;
  readonly model: { readonly varK: number; readonly sigma2: number };
  readonly serial: { readonly varK: number; readonly sigma2: number; readonly rho: number } | null;
  readonly dof: number;
}

/** The fit's whitened problem (A0, k, B at the mean x, as the fit parametrises it), rebuilt from its result. */
function sideDesign({ fit, weights }: SideFit): SideDesign | null {
  const x = fit.xEl;
  const n = x.length;
  if (n <= 4 || (weights !== null && weights.length !== n)) return null;
  const k = 1 / fit.lambdaEl;
  const xRef = x.reduce((s, v) => s + v, 0) / n;
  const a0 = fit.amplitude * Math.exp(-k * xRef);
  const j = whitenedDecayJacobian(x, weights, xRef, a0, k);
  const u = Float64Array.from({ length: n }, (_, i) => (weights ? Math.sqrt(weights[i]) : 1) * fit.residuals[i]);
  const bread = inverseNormalMatrix(j, n, 3);
  if (!bread) return null;
  const m = residualMaker(j, bread, n, 3);
  const g = Float64Array.from({ length: n }, (_, a) => bread[1][0] * j[3 * a] + bread[1][1] * j[3 * a + 1] + bread[1][2] * j[3 * a + 2]);
  const rss = u.reduce((s, v) => s + v * v, 0);
  const sigma2 = rss / (n - 3);
  const ar1 = ar1Covariance(j, u, n, 3);
  const serial = ar1 ? { varK: ar1.covariance[1][1], sigma2: rss / traceWithAr1(m, n, ar1.rho), rho: ar1.rho } : null;
  return { n, xEl: x, k, u, m, g, model: { varK: sigma2 * bread[1][1], sigma2 }, serial, dof: ar1 ? effectiveDof(n, ar1.rho, 3) : n - 3 };
}

/** Index pairs (i in d, j in v) of points at the same position (x/EL equal to 1e-9), both lists ascending. */
function sharedPositions(d: Float64Array, v: Float64Array): [number, number][] {
  const out: [number, number][] = [];
  for (let i = 0, j = 0; i < d.length && j < v.length;) {
    if (Math.abs(d[i] - v[j]) <= 1e-9) out.push([i++, j++]);
    else if (d[i] < v[j]) i++;
    else j++;
  }
  return out;
}

/** Smallest spacing between neighbouring points of either side (the bin width), x/EL. */
function pointSpacing(d: Float64Array, v: Float64Array): number {
  let step = Infinity;
  for (const x of [d, v]) for (let i = 1; i < x.length; i++) if (x[i] - x[i - 1] > 1e-9) step = Math.min(step, x[i] - x[i - 1]);
  return step;
}

/**
 * Cov(k̂_d, k̂_v) when the sides' errors have cross-covariance c·kernel(lag) (lag in point spacings), c matched to the
 * residuals at shared positions; and the implied error correlation c/(σ_d·σ_v), clamped to ±0.95.
 */
function crossCovarianceK(d: SideDesign, v: SideDesign, sigma2d: number, sigma2v: number, kernel: (lag: number) => number): { cov: number; correlation: number } {
  const pairs = sharedPositions(d.xEl, v.xEl);
  const step = pointSpacing(d.xEl, v.xEl);
  const kv = new Float64Array(d.n * v.n);
  for (let a = 0; a < d.n; a++) for (let b = 0; b < v.n; b++) kv[a * v.n + b] = kernel(Math.round(Math.abs(d.xEl[a] - v.xEl[b]) / step));
  // (M_d·K·M_v)_ij for the shared pairs only: K·M_v first (n_d × n_v), then the rows of M_d that are needed.
  const kmv = new Float64Array(d.n * v.n);
  for (let a = 0; a < d.n; a++) {
    for (let b = 0; b < v.n; b++) {
      const kab = kv[a * v.n + b];
      if (kab !== 0) for (let c = 0; c < v.n; c++) kmv[a * v.n + c] += kab * v.m[b * v.n + c];
    }
  }
  let num = 0, den = 0;
  for (const [i, j] of pairs) {
    num += d.u[i] * v.u[j];
    for (let a = 0; a < d.n; a++) den += d.m[i * d.n + a] * kmv[a * v.n + j];
  }
  const raw = den > 0 ? num / den / Math.sqrt(sigma2d * sigma2v) : 0;
  const correlation = Math.max(-MAX_CORRELATION, Math.min(MAX_CORRELATION, Number.isFinite(raw) ? raw : 0));
  const c = correlation * Math.sqrt(sigma2d * sigma2v);
  let gkg = 0;
  for (let a = 0; a < d.n; a++) for (let b = 0; b < v.n; b++) gkg += d.g[a] * kv[a * v.n + b] * v.g[b];
  return { cov: c * gkg, correlation };
}

/** Var(λ_d − λ_v) from the variances of k = 1/λ and their covariance (delta method, λ = 1/k), with the covariance
 *  kept within ±0.95 of √(V_d·V_v) so the joint matrix stays positive definite. */
function differenceVariance(d: SideDesign, v: SideDesign, varKd: number, varKv: number, covK: number): number {
  const vd = varKd / d.k ** 4, vv = varKv / v.k ** 4;
  const bound = MAX_CORRELATION * Math.sqrt(vd * vv);
  const cov = Math.max(-bound, Math.min(bound, covK / (d.k * d.k * v.k * v.k)));
  return vd + vv - 2 * cov;
}

/**
 * λ_dorsal − λ_ventral (x/EL, and µm when eggLengthUm is given) with its SE and 95% t interval, allowing for errors
 * correlated between the sides (see the file's head). The fits must come from fitExponentialDecay on the two sides'
 * profiles, with the same bins. Null when the sides share fewer than 4 positions or either fit's covariance is singular.
 */
export function decayLengthDifference(dorsal: SideFit, ventral: SideFit, eggLengthUm: number | null): DecayLengthDifference | null {
  const d = sideDesign(dorsal), v = sideDesign(ventral);
  if (!d || !v || sharedPositions(d.xEl, v.xEl).length < 4) return null;
  const model = crossCovarianceK(d, v, d.model.sigma2, v.model.sigma2, (lag) => (lag === 0 ? 1 : 0));
  const varModel = differenceVariance(d, v, d.model.varK, v.model.varK, model.cov);
  let varSerial = NaN, serialCorrelation = NaN;
  if (d.serial && v.serial) {
    const rho = (d.serial.rho + v.serial.rho) / 2;
    const serial = crossCovarianceK(d, v, d.serial.sigma2, v.serial.sigma2, (lag) => rho ** lag);
    varSerial = differenceVariance(d, v, d.serial.varK, v.serial.varK, serial.cov);
    serialCorrelation = serial.correlation;
  }
  const useSerial = varSerial > varModel;
  const seEl = Math.sqrt(useSerial ? varSerial : varModel);
  if (!Number.isFinite(seEl)) return null;
  const dof = Math.min(d.dof, v.dof);
  const t = tQuantile(0.975, dof);
  const lambdaEl = dorsal.fit.lambdaEl - ventral.fit.lambdaEl;
  const um = (el: number): number => (eggLengthUm !== null ? el * eggLengthUm : NaN);
  return {
    lambdaUm: um(lambdaEl), lambdaEl, seUm: um(seEl), seEl,
    ciLowUm: um(lambdaEl - t * seEl), ciHighUm: um(lambdaEl + t * seEl), ciLowEl: lambdaEl - t * seEl, ciHighEl: lambdaEl + t * seEl,
    seModelEl: Math.sqrt(varModel), seSerialEl: Math.sqrt(varSerial), seSource: useSerial ? 'serial' : 'model',
    sideCorrelation: useSerial ? serialCorrelation : model.correlation, dof,
  };
}
