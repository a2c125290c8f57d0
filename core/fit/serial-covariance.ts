// Parameter covariance of a least-squares fit whose residuals are correlated along x (neighbouring profile bins
// share nuclei, blur and texture). Two estimators on the whitened problem (J̃ = √W·J, u = √W·residuals, points in
// x order): a sandwich B·meat·B with the bread B = (J̃ᵀJ̃)⁻¹ under a first-order autoregressive error model,
// Corr(u_i, u_j) = ρ^|i−j|, with ρ and σ² matched to the residuals (the residuals of a fit are less correlated than
// the errors, so the lag-1 correlation is matched in expectation through the residual maker M = I − J̃BJ̃ᵀ rather
// than taken at face value). Newey–West (1987) with Bartlett weights and ⌊4(n/100)^(2/9)⌋ lags was tried first
// and covered only ~82% at ρ = 0.5 over 50 bins (nominal 95%): too few points for a model-free estimate.
// The work is n²·m for n points and m parameters (n × n matrices are never multiplied together).
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

/** P = J̃·B (n × m, row-major): the hat matrix is H = J̃(J̃ᵀJ̃)⁻¹J̃ᵀ = P·J̃ᵀ, of rank m. */
function timesBread(j: Float64Array, bread: number[][], n: number, m: number): Float64Array {
  const p = new Float64Array(n * m);
  for (let a = 0; a < n; a++) {
    for (let l = 0; l < m; l++) {
      let s = 0;
      for (let k = 0; k < m; k++) s += j[a * m + k] * bread[k][l];
      p[a * m + l] = s;
    }
  }
  return p;
}

/** Σ_l x[a·m + l]·y[b·m + l]: row a of x times row b of y (both n × m, row-major). */
function rowDot(x: Float64Array, a: number, y: Float64Array, b: number, m: number): number {
  let s = 0;
  for (let l = 0, i = a * m, k = b * m; l < m; l++, i++, k++) s += x[i] * y[k];
  return s;
}

/** Residual maker M = I − J̃(J̃ᵀJ̃)⁻¹J̃ᵀ (n × m·n work through P = J̃B; symmetric by construction). */
export function residualMaker(j: Float64Array, bread: number[][], n: number, m: number): Float64Array {
  const p = timesBread(j, bread, n, m);
  const out = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    for (let b = a; b < n; b++) {
      const v = (a === b ? 1 : 0) - rowDot(p, a, j, b, m);
      out[a * n + b] = v;
      out[b * n + a] = v;
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

/** Σ_ab X_ab·ρ^|a−b| of a symmetric matrix from the sums along its diagonals, d_l = Σ_a X_(a,a+l): d₀ + 2·Σ_l d_l·ρ^l,
 *  by Horner. */
export function ar1Weighted(d: Float64Array, rho: number): number {
  let s = 0;
  for (let l = d.length - 1; l >= 1; l--) s = s * rho + d[l];
  return d[0] + 2 * rho * s;
}

/**
 * ρ such that E[Σu_i·u_{i+1}] / E[Σu_i²] of the residuals under AR(1) errors equals the measured lag-1 value, from
 * the diagonal sums of M·A·M and M (a ratio-of-expectations match, solved by bisection on [−0.95, 0.95]; the ratio
 * rises with ρ). Each step costs n, not n².
 */
export function matchedRhoFromSums(mamSums: Float64Array, mmSums: Float64Array, measured: number): number {
  const ratio = (rho: number): number => ar1Weighted(mamSums, rho) / ar1Weighted(mmSums, rho);
  let lo = -0.95, hi = 0.95;
  if (measured <= ratio(lo)) return lo;
  if (measured >= ratio(hi)) return hi;
  for (let it = 0; it < 50; it++) {
    const mid = (lo + hi) / 2;
    if (ratio(mid) < measured) lo = mid; else hi = mid;
  }
  return (lo + hi) / 2;
}

/** B·X·B for m × m matrices (B symmetric). */
function breadAround(bread: number[][], x: number[][]): number[][] {
  const bm = bread.map((row) => x[0].map((_, c) => row.reduce((s, v, r) => s + v * x[r][c], 0)));
  return bm.map((row) => bread[0].map((_, c) => row.reduce((s, v, r) => s + v * bread[r][c], 0)));
}

/** J̃ᵀ·Y (m × m) for n × m row-major J̃ and Y. */
function crossProduct(j: Float64Array, y: Float64Array, n: number, m: number): number[][] {
  const out = Array.from({ length: m }, () => new Array<number>(m).fill(0));
  for (let a = 0; a < n; a++) for (let p = 0; p < m; p++) for (let q = 0; q < m; q++) out[p][q] += j[a * m + p] * y[a * m + q];
  return out;
}

/**
 * R·J̃ with R_ab = ρ^|a−b| (the AR(1) correlation), in n·m work: the sums over b ≤ a and b ≥ a run as two
 * recursions F_a = J̃_a + ρ·F_(a−1) and G_a = J̃_a + ρ·G_(a+1), and R·J̃ = F + G − J̃.
 */
export function ar1TimesJacobian(j: Float64Array, n: number, m: number, rho: number): Float64Array {
  const forward = new Float64Array(n * m);
  const out = new Float64Array(n * m);
  for (let a = 0; a < n; a++) for (let q = 0; q < m; q++) forward[a * m + q] = j[a * m + q] + (a > 0 ? rho * forward[(a - 1) * m + q] : 0);
  const backward = new Float64Array(m);
  for (let a = n - 1; a >= 0; a--) {
    for (let q = 0; q < m; q++) {
      backward[q] = j[a * m + q] + (a < n - 1 ? rho * backward[q] : 0);
      out[a * m + q] = forward[a * m + q] + backward[q] - j[a * m + q];
    }
  }
  return out;
}

/**
 * The sums along the diagonals (as ar1Weighted takes them) of M and of M·A·M, with M = I − H the residual maker, H = P·J̃ᵀ and A the lag-1
 * matrix, without forming either: with Ĵ = A·J̃ and C = J̃ᵀĴ, M·A·M = A − P·Ĵᵀ − Ĵ·Pᵀ + P·C·Pᵀ, each entry m or m²
 * products (n²·m work instead of the n³ of the product itself).
 */
function residualDiagonalSums(j: Float64Array, p: Float64Array, n: number, m: number): { mm: Float64Array; mam: Float64Array } {
  const jHat = new Float64Array(n * m);
  for (let a = 0; a < n; a++) {
    for (let q = 0; q < m; q++) jHat[a * m + q] = 0.5 * ((a > 0 ? j[(a - 1) * m + q] : 0) + (a + 1 < n ? j[(a + 1) * m + q] : 0));
  }
  // P·C (n × m), C = J̃ᵀĴ.
  const c = crossProduct(j, jHat, n, m);
  const pc = new Float64Array(n * m);
  for (let a = 0; a < n; a++) for (let q = 0; q < m; q++) { let s = 0; for (let r = 0; r < m; r++) s += p[a * m + r] * c[r][q]; pc[a * m + q] = s; }
  const mm = new Float64Array(n);
  const mam = new Float64Array(n);
  for (let a = 0; a < n; a++) {
    for (let b = a; b < n; b++) {
      const l = b - a;
      mm[l] += (l === 0 ? 1 : 0) - rowDot(p, a, j, b, m);
      mam[l] += (l === 1 ? 0.5 : 0) - rowDot(p, a, jHat, b, m) - rowDot(jHat, a, p, b, m) + rowDot(pc, a, p, b, m);
    }
  }
  return { mm, mam };
}

/** σ²·B·J̃ᵀR(ρ)J̃·B, the sandwich covariance under AR(1) errors of correlation ρ and variance σ² (R·J̃ by
 *  ar1TimesJacobian). */
export function ar1Sandwich(j: Float64Array, bread: number[][], n: number, m: number, rho: number, sigma2: number): number[][] {
  const meat = crossProduct(j, ar1TimesJacobian(j, n, m, rho), n, m).map((row) => row.map((v) => sigma2 * v));
  return breadAround(bread, meat);
}

/**
 * Covariance of the parameters under AR(1) errors along the point order: ρ matched to the residuals' lag-1
 * correlation, σ² = RSS / tr(M·R(ρ)) (unbiased under that model), covariance σ²·B·J̃ᵀR(ρ)J̃·B. j is the whitened
 * Jacobian (n × m, row-major) at the solution, u the whitened residuals in x order. Null when J̃ is singular.
 * The work is n²·m (the residual maker's diagonal sums), not n³: the fit runs at every time point of a movie.
 */
export function ar1Covariance(j: Float64Array, u: Float64Array, n: number, m: number): SerialCovariance | null {
  const bread = inverseNormalMatrix(j, n, m);
  if (!bread || n <= m + 1) return null;
  // E[uᵀAu] = σ²·tr(A·M·R·M) = σ²·Σ (MAM)_ab R_ab, and E[uᵀu] = σ²·Σ (MM)_ab R_ab = σ²·Σ M_ab R_ab.
  const sums = residualDiagonalSums(j, timesBread(j, bread, n, m), n, m);
  const residualLag1 = lag1Correlation(u);
  const rho = matchedRhoFromSums(sums.mam, sums.mm, residualLag1);
  let rss = 0;
  for (let i = 0; i < n; i++) rss += u[i] * u[i];
  const sigma2 = rss / ar1Weighted(sums.mm, rho);
  return { covariance: ar1Sandwich(j, bread, n, m, rho, sigma2), residualLag1, rho };
}
