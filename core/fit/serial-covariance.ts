// Parameter covariance of a least-squares fit whose residuals are correlated along x (neighbouring profile bins
// share nuclei, blur and texture). Two estimators on the whitened problem (J̃ = √W·J, u = √W·residuals, points in
// x order): a sandwich B·meat·B with the bread B = (J̃ᵀJ̃)⁻¹ under a first-order autoregressive error model,
// Corr(u_i, u_j) = ρ^|i−j|, with ρ and σ² matched to the residuals (the residuals of a fit are less correlated than
// the errors, so the lag-1 correlation is matched in expectation through the residual maker M = I − J̃BJ̃ᵀ rather
// than taken at face value). Newey–West (1987) with Bartlett weights and ⌊4(n/100)^(2/9)⌋ lags was tried first
// and covered only ~82% at ρ = 0.5 over 50 bins (nominal 95%): too few points for a model-free estimate.
// The work is n × n for n ≤ a few hundred points.
import { inverseNormalMatrix } from './covariance';

/** The serial-correlation covariance of the parameters and what it rests on. */
export interface SerialCovariance {
  /** Sandwich covariance of the parameters (same units as the model-based one). */
  readonly covariance: number[][];
  /** Lag-1 correlation of the whitened residuals, as measured. */
  readonly residualLag1: number;
  /** Error correlation ρ implied by it (after the bias of fitted residuals is removed), clamped to ±0.95. */
  readonly rho: number;
}

/** Residual maker M = I − J̃(J̃ᵀJ̃)⁻¹J̃ᵀ (n × n, row-major) from the bread. */
export function residualMaker(j: Float64Array, bread: number[][], n: number, m: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      let h = 0;
      for (let k = 0; k < m; k++) for (let l = 0; l < m; l++) h += j[a * m + k] * bread[k][l] * j[b * m + l];
      out[a * n + b] = (a === b ? 1 : 0) - h;
    }
  }
  return out;
}

/** Lag-1 autocorrelation Σu_i·u_{i+1} / Σu_i² (0 for a zero vector). */
export function lag1Correlation(u: ArrayLike<number>): number {
  let num = 0, den = 0;
  for (let i = 0; i < u.length; i++) {
    den += u[i] * u[i];
    if (i + 1 < u.length) num += u[i] * u[i + 1];
  }
  return den > 0 ? num / den : 0;
}

/** Σ_ab X_ab·ρ^|a−b| for a symmetric n × n matrix X. */
export function traceWithAr1(x: Float64Array, n: number, rho: number): number {
  let s = 0;
  for (let a = 0; a < n; a++) {
    let p = 1;
    s += x[a * n + a];
    for (let b = a + 1; b < n; b++) { p *= rho; s += 2 * x[a * n + b] * p; }
  }
  return s;
}

/**
 * traceWithAr1(x, n, ρ) / traceWithAr1(y, n, ρ) in one pass over both matrices, with the powers of ρ made once
 * (each the same product ρ·ρ·… that traceWithAr1 forms, summed in the same order: the same number bit for bit).
 * `powers` (n values) is working space.
 */
function traceRatioWithAr1(x: Float64Array, y: Float64Array, n: number, rho: number, powers: Float64Array): number {
  let p = 1;
  for (let l = 1; l < n; l++) { p *= rho; powers[l] = p; }
  let sx = 0, sy = 0;
  for (let a = 0; a < n; a++) {
    const row = a * n;
    sx += x[row + a];
    sy += y[row + a];
    for (let b = a + 1; b < n; b++) {
      const pw = powers[b - a];
      sx += 2 * x[row + b] * pw;
      sy += 2 * y[row + b] * pw;
    }
  }
  return sx / sy;
}

/**
 * ρ such that E[Σu_i·u_{i+1}] / E[Σu_i²] of the residuals under AR(1) errors equals the measured lag-1 value
 * (a ratio-of-expectations match, solved by bisection on [−0.95, 0.95]; the ratio rises with ρ).
 */
export function matchedRho(mm: Float64Array, mam: Float64Array, n: number, measured: number): number {
  const powers = new Float64Array(n);
  const ratio = (rho: number): number => traceRatioWithAr1(mam, mm, n, rho, powers);
  let lo = -0.95, hi = 0.95;
  if (measured <= ratio(lo)) return lo;
  if (measured >= ratio(hi)) return hi;
  for (let it = 0; it < 50; it++) {
    const mid = (lo + hi) / 2;
    if (ratio(mid) < measured) lo = mid; else hi = mid;
  }
  return (lo + hi) / 2;
}

/** M·A·M for a symmetric M, with A the lag-1 matrix (½ on the first off-diagonals): Σu_i·u_{i+1} = uᵀAu. */
export function lagProductOfM(m: Float64Array, n: number): Float64Array {
  // (A·M) transposed, amT[b·n + c] = (A·M)_cb, so the product below reads both factors along rows (the same
  // products summed in the same order as with A·M itself).
  const amT = new Float64Array(n * n);
  for (let c = 0; c < n; c++) {
    for (let b = 0; b < n; b++) {
      amT[b * n + c] = 0.5 * ((c > 0 ? m[(c - 1) * n + b] : 0) + (c + 1 < n ? m[(c + 1) * n + b] : 0));
    }
  }
  const out = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    for (let b = a; b < n; b++) {
      let v = 0;
      for (let c = 0, i = a * n, k = b * n; c < n; c++, i++, k++) v += m[i] * amT[k];
      out[a * n + b] = v;
      out[b * n + a] = v;
    }
  }
  return out;
}

/** B·(J̃ᵀ·S·J̃)·B where S_ab = k(a, b). */
export function sandwich(j: Float64Array, bread: number[][], n: number, m: number, k: (a: number, b: number) => number): number[][] {
  const meat = Array.from({ length: m }, () => new Array<number>(m).fill(0));
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      const w = k(a, b);
      if (w === 0) continue;
      for (let p = 0; p < m; p++) for (let q = 0; q < m; q++) meat[p][q] += j[a * m + p] * w * j[b * m + q];
    }
  }
  const bm = bread.map((row) => meat[0].map((_, c) => row.reduce((s, v, r) => s + v * meat[r][c], 0)));
  return bm.map((row) => bread[0].map((_, c) => row.reduce((s, v, r) => s + v * bread[r][c], 0)));
}

/**
 * Covariance of the parameters under AR(1) errors along the point order: ρ matched to the residuals' lag-1
 * correlation, σ² = RSS / tr(M·R(ρ)) (unbiased under that model), covariance σ²·B·J̃ᵀR(ρ)J̃·B. j is the whitened
 * Jacobian (n × m, row-major) at the solution, u the whitened residuals in x order. Null when J̃ is singular.
 */
export function ar1Covariance(j: Float64Array, u: Float64Array, n: number, m: number): SerialCovariance | null {
  const bread = inverseNormalMatrix(j, n, m);
  if (!bread || n <= m + 1) return null;
  const mk = residualMaker(j, bread, n, m);
  // E[uᵀAu] = σ²·tr(A·M·R·M) = σ²·Σ (MAM)_ab R_ab, and E[uᵀu] = σ²·Σ (MM)_ab R_ab = σ²·Σ M_ab R_ab.
  const mam = lagProductOfM(mk, n);
  const residualLag1 = lag1Correlation(u);
  const rho = matchedRho(mk, mam, n, residualLag1);
  let rss = 0;
  for (let i = 0; i < n; i++) rss += u[i] * u[i];
  const sigma2 = rss / traceWithAr1(mk, n, rho);
  const powers = Float64Array.from({ length: n }, (_, l) => sigma2 * rho ** l);
  const covariance = sandwich(j, bread, n, m, (a, b) => powers[Math.abs(a - b)]);
  return { covariance, residualLag1, rho };
}
