import { describe, expect, it } from 'vitest';
import { gradientCosine, polishGaussNewton, runLevenbergMarquardt } from './lm-core';
import type { LeastSquaresProblem } from './problem';

// Demo data: y = 3·exp(−0.7x) at x = 0, 0.25, …, 4.75 (exact).
const x = Float64Array.from({ length: 20 }, (_, i) => i * 0.25);
const exact: LeastSquaresProblem = {
  x, y: x.map((v) => 3 * Math.exp(-0.7 * v)), sqrtW: new Float64Array(20).fill(1),
  model: ([a, k]) => (v) => a * Math.exp(-k * v), jacobian: null,
};

describe('runLevenbergMarquardt', () => {
  it.each(['column', 'unit'] as const)('converges on exact data with %s scaling', (scaling) => {
    const run = runLevenbergMarquardt(exact, [1, 2], scaling, 500);
    expect(run.converged).toBe(true);
    expect(run.params[0]).toBeCloseTo(3, 10);
    expect(run.params[1]).toBeCloseTo(0.7, 10);
  });
  it('does not converge when cut off, and never throws for a NaN start', () => {
    expect(runLevenbergMarquardt(exact, [1, 2], 'column', 1).converged).toBe(false);
    const nanStart = runLevenbergMarquardt({ ...exact, model: () => () => NaN }, [1, 2], 'column', 10);
    expect(nanStart.converged).toBe(false);
    expect(nanStart.iterations).toBe(0);
  });
  it('does not modify the start array', () => {
    const start = [1, 2];
    runLevenbergMarquardt(exact, start, 'unit', 50);
    expect(start).toEqual([1, 2]);
  });
});

describe('gradientCosine', () => {
  it('is the largest |cos| between residual and a Jacobian column', () => {
    // Source: hand computation — J columns (1,0,0) and (0,1,0), r = (3,4,0): cosines 0.6 and 0.8.
    expect(gradientCosine(new Float64Array([1, 0, 0, 1, 0, 0]), new Float64Array([3, 4, 0]), 3, 2)).toBeCloseTo(0.8, 15);
    expect(gradientCosine(new Float64Array([1, 0, 0, 1, 0, 0]), new Float64Array([0, 0, 5]), 3, 2)).toBe(0);
  });
});

describe('polishGaussNewton', () => {
  it('finishes a linear problem in one full step and never makes the fit worse', () => {
    // Source: hand computation — OLS line through (1,2),(2,4),(3,5),(4,4),(5,5): intercept 2.2, slope 0.6.
    const line: LeastSquaresProblem = {
      x: Float64Array.from([1, 2, 3, 4, 5]), y: Float64Array.from([2, 4, 5, 4, 5]), sqrtW: new Float64Array(5).fill(1),
      model: ([a, b]) => (v) => a + b * v, jacobian: () => (v) => [1, v],
    };
    const polished = polishGaussNewton(line, { params: [2.1, 0.7], rss: 10, iterations: 3, converged: true });
    expect(polished.params[0]).toBeCloseTo(2.2, 13);
    expect(polished.params[1]).toBeCloseTo(0.6, 13);
    expect(polished.rss).toBeCloseTo(2.4, 13);
    expect(polished.iterations).toBeGreaterThan(3);
  });
});
