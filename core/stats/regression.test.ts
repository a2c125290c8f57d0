import { describe, expect, it } from 'vitest';
import { linearRegression, weightedLinearRegression } from './regression';

describe('linearRegression', () => {
  it('matches a hand-computed fit', () => {
    // Source: hand computation — x̄ = 3, ȳ = 4, Sxx = 10, Sxy = 6, RSS = 2.4, Syy = 6.
    const r = linearRegression([1, 2, 3, 4, 5], [2, 4, 5, 4, 5]);
    expect(r.slope).toBeCloseTo(0.6, 14);
    expect(r.intercept).toBeCloseTo(2.2, 14);
    expect(r.slopeSe).toBeCloseTo(Math.sqrt(0.08), 14);
    expect(r.interceptSe).toBeCloseTo(Math.sqrt(0.88), 14);
    expect(r.r2).toBeCloseTo(0.6, 14);
    expect(r.residualSd).toBeCloseTo(Math.sqrt(0.8), 14);
    expect(r).toMatchObject({ n: 5, dof: 3, level: 0.95 });
    // Source: from memory — t(0.975, 3) = 3.182446305.
    expect(r.slopeCi[0]).toBeCloseTo(0.6 - 3.182446305 * Math.sqrt(0.08), 8);
    expect(r.slopeCi[1]).toBeCloseTo(0.6 + 3.182446305 * Math.sqrt(0.08), 8);
    expect(r.interceptCi[1]).toBeCloseTo(2.2 + 3.182446305 * Math.sqrt(0.88), 8);
  });
  it('recovers an exact line with zero error and works on typed arrays', () => {
    // Source: demo data — y = 1.5 − 0.25x exactly.
    const x = Float64Array.from({ length: 7 }, (_, i) => i * 0.5);
    const y = x.map((v) => 1.5 - 0.25 * v);
    const r = linearRegression(x, y);
    expect(r.slope).toBeCloseTo(-0.25, 14);
    expect(r.intercept).toBeCloseTo(1.5, 14);
    expect(r.slopeSe).toBeLessThan(1e-14);
    expect(r.r2).toBeCloseTo(1, 14);
  });
  it('gives NaN standard errors for two points', () => {
    const r = linearRegression([0, 1], [1, 3]);
    expect(r.slope).toBe(2);
    expect(r.slopeSe).toBeNaN();
    expect(r.dof).toBe(0);
  });
  it('rejects bad input with exact messages', () => {
    expect(() => linearRegression([1, 2, 3], [1, 2])).toThrow('linearRegression: x and y differ in length (3 vs 2)');
    expect(() => linearRegression([1], [1])).toThrow('linearRegression (x): need at least 2 values, got 1');
    expect(() => linearRegression([2, 2, 2], [1, 2, 3])).toThrow('linearRegression: all x values are equal, the slope is undefined');
    expect(() => linearRegression([1, 2, 3], [1, NaN, 3])).toThrow('linearRegression (y): value 1 is not a finite number');
  });
});

describe('weightedLinearRegression', () => {
  it('equals OLS with equal weights and OLS on repeated points with integer weights', () => {
    // Source: hand reasoning — weight 2 on a point is the same as listing it twice (for the estimates).
    const a = weightedLinearRegression([1, 2, 3, 4, 5], [2, 4, 5, 4, 5], [1, 1, 1, 1, 1]);
    expect(a.slope).toBeCloseTo(0.6, 14);
    expect(a.slopeSe).toBeCloseTo(Math.sqrt(0.08), 14);
    const b = weightedLinearRegression([1, 2, 3], [1, 3, 2], [2, 1, 1]);
    const c = linearRegression([1, 1, 2, 3], [1, 1, 3, 2]);
    expect(b.slope).toBeCloseTo(c.slope, 14);
    expect(b.intercept).toBeCloseTo(c.intercept, 14);
  });
  it('rejects non-positive weights', () => {
    expect(() => weightedLinearRegression([1, 2, 3], [1, 2, 3], [1, 0, 1])).toThrow(
      'weightedLinearRegression: weight 1 must be a positive finite number',
    );
  });
});
