import { describe, expect, it } from 'vitest';
import { createRng, linearRegression, weightedLinearRegression } from '../stats';
import { fitNonlinear } from './levenberg-marquardt';
import type { ModelFunction } from './problem';
import { fitErrorOf as errorOf } from './fit-error-of.test-helper';

const line: ModelFunction = ([a, b]) => (x) => a + b * x;
const decay: ModelFunction = ([a, k]) => (x) => a * Math.exp(-k * x);


describe('fitNonlinear', () => {
  it('reproduces ordinary least squares for a straight line (same SEs)', () => {
    // Source: hand computation — slope 0.6, intercept 2.2, SEs √0.08 and √0.88 (see stats/regression.test.ts).
    const x = Float64Array.from([1, 2, 3, 4, 5]), y = Float64Array.from([2, 4, 5, 4, 5]);
    // Central differences carry ~1e-11 relative rounding error (ε/h), which bounds the agreement.
    const fit = fitNonlinear(x, y, line, [0, 0]);
    expect(fit.params[0]).toBeCloseTo(2.2, 9);
    expect(fit.params[1]).toBeCloseTo(0.6, 9);
    const exact = fitNonlinear(x, y, line, [0, 0], { jacobian: () => (v) => [1, v] });
    expect(exact.params[0]).toBeCloseTo(2.2, 13);
    expect(exact.params[1]).toBeCloseTo(0.6, 13);
    expect(fit.se[0]).toBeCloseTo(Math.sqrt(0.88), 9);
    expect(fit.se[1]).toBeCloseTo(Math.sqrt(0.08), 9);
    expect(fit.rss).toBeCloseTo(2.4, 12);
    expect(exact.rss).toBeCloseTo(2.4, 14);
    expect(fit.dof).toBe(3);
    expect(fit.r2).toBeCloseTo(0.6, 12);
    expect(fit.covariance[0][1]).toBeCloseTo(fit.covariance[1][0], 15);
  });
  it('matches weighted line regression when weights are given', () => {
    // Source: cross-check against the closed-form weighted least squares in core/stats (demo data).
    const x = Float64Array.from([0, 1, 2, 3, 4, 5]), y = Float64Array.from([1.1, 2.9, 5.2, 6.8, 9.3, 10.7]);
    const w = Float64Array.from([1, 4, 1, 0.25, 2, 1]);
    const fit = fitNonlinear(x, y, line, [1, 1], { weights: w });
    const ref = weightedLinearRegression(x, y, w);
    expect(fit.params[1]).toBeCloseTo(ref.slope, 9);
    expect(fit.se[1]).toBeCloseTo(ref.slopeSe, 9);
    expect(fit.se[0]).toBeCloseTo(ref.interceptSe, 9);
    const unweighted = linearRegression(x, y);
    expect(Math.abs(fit.params[1] - unweighted.slope)).toBeGreaterThan(1e-6);
  });
  it('recovers exact exponential parameters from a poor start', () => {
    // Source: demo data — y = 3·exp(−0.7x) exactly.
    const x = Float64Array.from({ length: 20 }, (_, i) => i * 0.25);
    const y = x.map((v) => 3 * Math.exp(-0.7 * v));
    const fit = fitNonlinear(x, y, decay, [1, 5]);
    expect(fit.params[0]).toBeCloseTo(3, 12);
    expect(fit.params[1]).toBeCloseTo(0.7, 12);
    expect(fit.rss).toBeLessThan(1e-24);
  });
  it('gives standard errors that match the scatter of refits over noisy seeds', () => {
    // Source: demo data — 300 seeded noisy replicates; the SD of fitted k should match the reported SE (±15%).
    const x = Float64Array.from({ length: 30 }, (_, i) => i * 0.2);
    const rng = createRng(5);
    const ks: number[] = [], ses: number[] = [];
    for (let s = 0; s < 300; s++) {
      const y = x.map((v) => 3 * Math.exp(-0.7 * v) + 0.05 * rng.normal());
      const fit = fitNonlinear(x, y, decay, [2, 1], { restarts: false });
      ks.push(fit.params[1]);
      ses.push(fit.se[1]);
    }
    const m = ks.reduce((a, b) => a + b) / ks.length;
    const sdK = Math.sqrt(ks.reduce((a, b) => a + (b - m) ** 2, 0) / (ks.length - 1));
    const meanSe = ses.reduce((a, b) => a + b) / ses.length;
    expect(Math.abs(m - 0.7)).toBeLessThan(4 * sdK / Math.sqrt(300));
    expect(meanSe / sdK).toBeGreaterThan(0.85);
    expect(meanSe / sdK).toBeLessThan(1.15);
  });
  it('does not modify its inputs', () => {
    const x = Float64Array.from([0, 1, 2, 3]), y = Float64Array.from([3, 2, 1.5, 1]);
    const initial = [1, 0.1];
    fitNonlinear(x, y, decay, initial);
    expect(initial).toEqual([1, 0.1]);
    expect(Array.from(y)).toEqual([3, 2, 1.5, 1]);
  });
  it('rejects bad input with exact messages and code bad-input', () => {
    const x = Float64Array.from([0, 1, 2]), y = Float64Array.from([1, 2, 3]);
    const cases: [() => unknown, string][] = [
      [() => fitNonlinear(x, Float64Array.from([1, 2]), line, [0, 1]), 'fitNonlinear: x and y differ in length (3 vs 2)'],
      [() => fitNonlinear(x, y, line, []), 'fitNonlinear: initial must hold at least one parameter'],
      [() => fitNonlinear(x.subarray(0, 2), y.subarray(0, 2), line, [0, 1]), 'fitNonlinear: need more data points (2) than parameters (2)'],
      [() => fitNonlinear(x, Float64Array.from([1, NaN, 3]), line, [0, 1]), 'fitNonlinear: y[1] is not a finite number'],
      [() => fitNonlinear(Float64Array.from([0, Infinity, 2]), y, line, [0, 1]), 'fitNonlinear: x[1] is not a finite number'],
      [() => fitNonlinear(x, y, line, [0, NaN]), 'fitNonlinear: initial[1] is not a finite number'],
      [() => fitNonlinear(x, y, line, [0, 1], { maxIterations: 0 }), 'fitNonlinear: maxIterations must be a positive integer, got 0'],
      [() => fitNonlinear(x, y, line, [0, 1], { weights: Float64Array.from([1, 1]) }), 'fitNonlinear: weights and x differ in length (2 vs 3)'],
      [() => fitNonlinear(x, y, line, [0, 1], { weights: Float64Array.from([1, -1, 1]) }), 'fitNonlinear: weights[1] must be a positive finite number'],
    ];
    for (const [run, message] of cases) {
      const e = errorOf(run);
      expect(e.code).toBe('bad-input');
      expect(e.message).toBe(message);
    }
  });
  it('reports a model that is NaN at the start with code nan', () => {
    const x = Float64Array.from([0, 1, 2]), y = Float64Array.from([1, 2, 3]);
    const e = errorOf(() => fitNonlinear(x, y, ([a]) => (v) => Math.sqrt(a) * v, [-1]));
    expect(e.code).toBe('nan');
    expect(e.message).toBe('fitNonlinear: the model gives NaN or Infinity at the starting parameters');
  });
  it('survives NaN at trial points (treated as rejected steps)', () => {
    // Source: demo data — y = √a·x with a = 4; large steps towards a < 0 give NaN and must be refused.
    const x = Float64Array.from([1, 2, 3, 4]), y = Float64Array.from([2, 4, 6, 8]);
    const fit = fitNonlinear(x, y, ([a]) => (v) => Math.sqrt(a) * v, [0.01]);
    expect(fit.params[0]).toBeCloseTo(4, 10);
  });
  it('reports non-identifiable parameters with code nan', () => {
    // Two parameters that only enter as a sum: the Jacobian is singular at every point.
    const x = Float64Array.from([0, 1, 2, 3]), y = Float64Array.from([1, 3, 5, 7]);
    const e = errorOf(() => fitNonlinear(x, y, ([a, b, c]) => (v) => a + b + c * v, [0, 0, 1]));
    expect(e.code).toBe('nan');
    expect(e.message).toBe('fitNonlinear: the parameters are not identifiable from these data (singular Jacobian)');
  });
  it('reports non-convergence with code not-converged', () => {
    // Source: demo data — a slowly converging problem cut off after one iteration.
    const x = Float64Array.from({ length: 10 }, (_, i) => i);
    const y = x.map((v) => 5 * Math.exp(-0.3 * v) + 0.01 * Math.sin(v));
    const e = errorOf(() => fitNonlinear(x, y, decay, [1, 3], { maxIterations: 1 }));
    expect(e.code).toBe('not-converged');
    expect(e.message).toBe('fitNonlinear: no convergence within 1 iterations');
  });
  it('uses an analytic Jacobian when given and agrees with central differences', () => {
    const x = Float64Array.from({ length: 15 }, (_, i) => i * 0.3);
    const rng = createRng(3);
    const y = x.map((v) => 2 * Math.exp(-0.4 * v) + 0.02 * rng.normal());
    let calls = 0;
    const jacobian = ([a, k]: number[]) => { calls++; return (v: number) => [Math.exp(-k * v), -a * v * Math.exp(-k * v)]; };
    const analytic = fitNonlinear(x, y, decay, [1, 1], { jacobian });
    const numeric = fitNonlinear(x, y, decay, [1, 1]);
    expect(calls).toBeGreaterThan(0);
    expect(analytic.params[1]).toBeCloseTo(numeric.params[1], 9);
    expect(analytic.se[1] / numeric.se[1]).toBeCloseTo(1, 7);
  });
});

describe('fitNonlinear fallback option', () => {
  // Source: demo data — the same slowly converging problem as above.
  const x = Float64Array.from({ length: 10 }, (_, i) => i);
  const y = x.map((v) => 5 * Math.exp(-0.3 * v) + 0.01 * Math.sin(v));
  it('throws not-converged at once when the single run fails and fallback is false', () => {
    const e = errorOf(() => fitNonlinear(x, y, decay, [1, 3], { maxIterations: 2, restarts: false, fallback: false }));
    expect(e.code).toBe('not-converged');
    expect(e.message).toBe('fitNonlinear: no convergence within 2 iterations');
  });
  it('does not change a single run that converges', () => {
    const a = fitNonlinear(x, y, decay, [4, 0.25], { restarts: false, fallback: false });
    const b = fitNonlinear(x, y, decay, [4, 0.25], { restarts: false });
    expect(a.params).toEqual(b.params);
    expect(a.rss).toBe(b.rss);
  });
});
