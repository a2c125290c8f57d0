import { describe, expect, it } from 'vitest';
import { inverseNormalMatrix } from './covariance';
import { ar1Covariance, lag1Correlation, lagProductOfM, matchedRho, residualMaker, sandwich } from './serial-covariance';

const ones = (n: number): Float64Array => new Float64Array(n).fill(1);

describe('AR(1) sandwich covariance', () => {
  it('gives the variance of the mean of an AR(1) series', () => {
    // Source: Var(ȳ) = σ²/n·[(1+ρ)/(1−ρ) − 2ρ(1−ρⁿ)/(n(1−ρ)²)] for a stationary AR(1) series (time-series texts,
    // e.g. Box, Jenkins & Reinsel, Time Series Analysis; from memory, and equal to σ²/n²·Σ_ab ρ^|a−b| by summing).
    for (const [n, rho] of [[20, 0.5], [50, 0.3], [7, -0.4]]) {
      const j = ones(n);
      const bread = inverseNormalMatrix(j, n, 1)!;
      const v = sandwich(j, bread, n, 1, (a, b) => 2 * rho ** Math.abs(a - b))[0][0];
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
