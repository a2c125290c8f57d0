import { describe, expect, it } from 'vitest';
import { inverseNormalMatrix } from './covariance';
import { ar1Covariance, ar1Sandwich, ar1TimesJacobian, lag1Correlation, matchedRhoFromSums, residualMaker } from './serial-covariance';

/** M·A·M for a symmetric M, with A the lag-1 matrix (½ on the first off-diagonals), as the product reads. */
function lagProductOfM(m: Float64Array, n: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      let v = 0;
      for (let c = 0; c < n; c++) v += m[a * n + c] * 0.5 * ((c > 0 ? m[(c - 1) * n + b] : 0) + (c + 1 < n ? m[(c + 1) * n + b] : 0));
      out[a * n + b] = v;
    }
  }
  return out;
}

/** d_l = Σ_a X_(a,a+l), the sums along the diagonals of an n × n matrix. */
function diagonalSums(x: Float64Array, n: number): Float64Array {
  const d = new Float64Array(n);
  for (let a = 0; a < n; a++) for (let b = a; b < n; b++) d[b - a] += x[a * n + b];
  return d;
}

/** ρ matched to a measured lag-1 correlation from the matrices M and M·A·M themselves. */
const matchedRho = (mm: Float64Array, mam: Float64Array, n: number, measured: number): number =>
  matchedRhoFromSums(diagonalSums(mam, n), diagonalSums(mm, n), measured);

const ones = (n: number): Float64Array => new Float64Array(n).fill(1);

describe('AR(1) sandwich covariance', () => {
  it('gives the variance of the mean of an AR(1) series', () => {
    // Source: Var(ȳ) = σ²/n·[(1+ρ)/(1−ρ) − 2ρ(1−ρⁿ)/(n(1−ρ)²)] for a stationary AR(1) series (time-series texts,
    // e.g. Box, Jenkins & Reinsel, Time Series Analysis; from memory, and equal to σ²/n²·Σ_ab ρ^|a−b| by summing).
    for (const [n, rho] of [[20, 0.5], [50, 0.3], [7, -0.4]]) {
      const j = ones(n);
      const bread = inverseNormalMatrix(j, n, 1)!;
      const v = ar1Sandwich(j, bread, n, 1, rho, 2)[0][0];
      const expected = (2 / n) * ((1 + rho) / (1 - rho) - (2 * rho * (1 - rho ** n)) / (n * (1 - rho) ** 2));
      expect(v).toBeCloseTo(expected, 12);
    }
  });
  it('residual maker is idempotent with trace n − m', () => {
    // Source: M = I − X(XᵀX)⁻¹Xᵀ is a symmetric idempotent matrix of rank n − p (Seber & Lee, Linear Regression
    // Analysis, §3.1; from memory).
    const n = 9, m = 2;
    const j = Float64Array.from({ length: n * m }, (_, k) => (k % 2 === 0 ? 1 : Math.exp(-Math.floor(k / 2) / 3)));
    const mk = residualMaker(j, inverseNormalMatrix(j, n, m)!, n, m);
    let trace = 0;
    for (let a = 0; a < n; a++) {
      trace += mk[a * n + a];
      for (let b = 0; b < n; b++) {
        let v = 0;
        for (let c = 0; c < n; c++) v += mk[a * n + c] * mk[c * n + b];
        expect(v).toBeCloseTo(mk[a * n + b], 12);
      }
    }
    expect(trace).toBeCloseTo(n - m, 12);
  });
  it('reads the lag-1 correlation −1/n of residuals about the mean as ρ = 0', () => {
    // Source: for independent errors and residuals about the mean, E[Σu_i u_{i+1}] / E[Σu_i²] = tr(AM)/tr(M)
    // = −(n−1)/n / (n−1) = −1/n exactly (derived from M = I − 11ᵀ/n; the same −1/n as Marriott & Pope 1954).
    const n = 30;
    const j = ones(n);
    const mk = residualMaker(j, inverseNormalMatrix(j, n, 1)!, n, 1);
    expect(matchedRho(mk, lagProductOfM(mk, n), n, -1 / n)).toBeCloseTo(0, 9);
    // Larger measured correlations map to larger ρ, and the ends clamp at ±0.95 (demo data).
    expect(matchedRho(mk, lagProductOfM(mk, n), n, 0.3)).toBeGreaterThan(0.3);
    expect(matchedRho(mk, lagProductOfM(mk, n), n, 0.999)).toBe(0.95);
    expect(matchedRho(mk, lagProductOfM(mk, n), n, -0.999)).toBe(-0.95);
  });
  it('lag-1 correlation of a known sequence', () => {
    // Source: hand arithmetic — (1·−1 + −1·1 + 1·−1) / 4 = −0.75.
    expect(lag1Correlation([1, -1, 1, -1])).toBe(-0.75);
    expect(lag1Correlation([0, 0, 0])).toBe(0);
  });
  it('widens the interval for positively correlated residuals and reports ρ', () => {
    // Demo data: a straight-line fit with slowly varying residuals (a smooth wave) and with alternating ones.
    const n = 40, m = 2;
    const j = Float64Array.from({ length: n * m }, (_, k) => (k % 2 === 0 ? 1 : Math.floor(k / 2) / n));
    const smooth = Float64Array.from({ length: n }, (_, i) => Math.sin((2 * Math.PI * i) / 13));
    const alternating = Float64Array.from({ length: n }, (_, i) => (i % 2 === 0 ? 1 : -1) * (1 + 0.1 * (i % 3)));
    const bread = inverseNormalMatrix(j, n, m)!;
    const modelSlopeVar = (u: Float64Array): number => (u.reduce((s, v) => s + v * v, 0) / (n - m)) * bread[1][1];
    const s = ar1Covariance(j, smooth, n, m)!;
    expect(s.rho).toBeGreaterThan(0.8);
    expect(s.covariance[1][1]).toBeGreaterThan(3 * modelSlopeVar(smooth));
    const a = ar1Covariance(j, alternating, n, m)!;
    expect(a.rho).toBeLessThan(-0.8);
    expect(a.covariance[1][1]).toBeLessThan(modelSlopeVar(alternating));
  });
});

// The plain O(n³) forms the fast ones replace, written as the formulas read (the previous implementation).
function plainResidualMaker(j: Float64Array, bread: number[][], n: number, m: number): Float64Array {
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

function plainAr1Covariance(j: Float64Array, u: Float64Array, n: number, m: number): { covariance: number[][]; rho: number } {
  const bread = inverseNormalMatrix(j, n, m)!;
  const mk = plainResidualMaker(j, bread, n, m);
  const mam = lagProductOfM(mk, n);
  const ar1Sum = (x: Float64Array, rho: number) => {
    let s = 0;
    for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) s += x[a * n + b] * rho ** Math.abs(a - b);
    return s;
  };
  let lo = -0.95, hi = 0.95;
  const measured = lag1Correlation(u);
  const ratio = (rho: number) => ar1Sum(mam, rho) / ar1Sum(mk, rho);
  let rho: number;
  if (measured <= ratio(lo)) rho = lo;
  else if (measured >= ratio(hi)) rho = hi;
  else {
    for (let it = 0; it < 50; it++) { const mid = (lo + hi) / 2; if (ratio(mid) < measured) lo = mid; else hi = mid; }
    rho = (lo + hi) / 2;
  }
  const sigma2 = u.reduce((s, v) => s + v * v, 0) / ar1Sum(mk, rho);
  const meat = Array.from({ length: m }, () => new Array<number>(m).fill(0));
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) for (let p = 0; p < m; p++) for (let q = 0; q < m; q++) meat[p][q] += j[a * m + p] * sigma2 * rho ** Math.abs(a - b) * j[b * m + q];
  const bm = bread.map((row) => meat[0].map((_, c) => row.reduce((s, v, r) => s + v * meat[r][c], 0)));
  return { covariance: bm.map((row) => bread[0].map((_, c) => row.reduce((s, v, r) => s + v * bread[r][c], 0))), rho };
}

describe('the n²·m forms against the plain matrix products', () => {
  it('give the same residual maker, ρ and covariance on random exponential-fit problems', () => {
    // Demo data: decay Jacobians (A0, k, B) on 12–90 points with residuals of random smoothness; the plain forms are
    // the definitions M = I − J̃(J̃ᵀJ̃)⁻¹J̃ᵀ, Σ_ab X_ab ρ^|a−b| and B·J̃ᵀRJ̃·B summed term by term.
    let seed = 7;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 2 ** 32) - 0.5;
    for (const n of [12, 37, 90]) {
      for (const smooth of [0, 0.6, 0.95]) {
        const m = 3;
        const j = new Float64Array(n * m);
        for (let a = 0; a < n; a++) {
          const x = a / n, w = 1 + rnd();
          j[a * m] = w * Math.exp(-3 * x); j[a * m + 1] = -w * 2 * x * Math.exp(-3 * x); j[a * m + 2] = w;
        }
        const u = new Float64Array(n);
        for (let a = 0; a < n; a++) u[a] = (a > 0 ? smooth * u[a - 1] : 0) + rnd();
        const bread = inverseNormalMatrix(j, n, m)!;
        const fastM = residualMaker(j, bread, n, m);
        const plainM = plainResidualMaker(j, bread, n, m);
        for (let i = 0; i < n * n; i++) expect(Math.abs(fastM[i] - plainM[i])).toBeLessThan(1e-12);
        const fast = ar1Covariance(j, u, n, m)!;
        const plain = plainAr1Covariance(j, u, n, m);
        expect(Math.abs(fast.rho - plain.rho)).toBeLessThan(1e-12);
        for (let p = 0; p < m; p++) for (let q = 0; q < m; q++) {
          expect(Math.abs(fast.covariance[p][q] - plain.covariance[p][q])).toBeLessThanOrEqual(1e-10 * Math.sqrt(Math.abs(plain.covariance[p][p] * plain.covariance[q][q])));
        }
      }
    }
  });
  it('ar1TimesJacobian equals R·J̃ summed term by term', () => {
    // Demo data: a 9 × 2 Jacobian; R_ab = ρ^|a−b| written out.
    const n = 9, m = 2;
    const j = Float64Array.from({ length: n * m }, (_, k) => Math.cos(k * 1.3));
    for (const rho of [-0.7, 0, 0.4, 0.95]) {
      const fast = ar1TimesJacobian(j, n, m, rho);
      for (let a = 0; a < n; a++) for (let q = 0; q < m; q++) {
        let s = 0;
        for (let b = 0; b < n; b++) s += rho ** Math.abs(a - b) * j[b * m + q];
        expect(fast[a * m + q]).toBeCloseTo(s, 13);
      }
    }
  });
});
