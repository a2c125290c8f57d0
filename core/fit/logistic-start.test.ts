import { describe, expect, it } from 'vitest';
import { logistic, logisticStart } from './logistic-start';

// Demo data: 100 bins with centres (i + 0.5)/100 x/EL (spacing 0.01, span 0.99), unit weights.
const xEl = Float64Array.from({ length: 100 }, (_, i) => (i + 0.5) / 100);
const ones = new Float64Array(100).fill(1);
// The 24 trial widths: 0.0025 · (0.99/0.0025)^(s/23).
const gridWidth = (s: number): number => 0.0025 * (0.99 / 0.0025) ** (s / 23);

describe('logistic', () => {
  it('is 1/(1 + e^z) and does not overflow', () => {
    // Source: hand computation — σ(0) = 1/2, σ(ln 3) = 1/4, σ(−ln 3) = 3/4.
    expect(logistic(0)).toBe(0.5);
    expect(logistic(Math.log(3))).toBeCloseTo(0.25, 15);
    expect(logistic(-Math.log(3))).toBeCloseTo(0.75, 15);
    expect(logistic(1000)).toBe(0);
    expect(logistic(-1000)).toBe(1);
  });
});

describe('logisticStart', () => {
  it('recovers exact levels and width when the true width lies on the grid', () => {
    // Source: demo data — lower 10, upper 100, x0 = 0.4 (given as the crossing), w = grid width 10.
    const w = gridWidth(10);
    const y = xEl.map((x) => 10 + 90 * logistic((x - 0.4) / w));
    const start = logisticStart(xEl, y, ones, 0.4, 0.01, 0.99)!;
    expect(start.params[0]).toBeCloseTo(10, 8);
    expect(start.params[1]).toBeCloseTo(100, 8);
    expect(start.params[2]).toBe(0.4);
    expect(start.params[3]).toBe(w);
    expect(Math.abs(start.rss)).toBeLessThan(1e-6);
    expect(start.narrowest).toBe(false);
  });
  it('carries a rising step in the sign of upper − lower', () => {
    // Source: demo data — low anterior (5), high posterior (200), x0 = 0.63, w = grid width 14.
    const w = gridWidth(14);
    const y = xEl.map((x) => 200 + (5 - 200) * logistic((x - 0.63) / w));
    const [lower, upper, , width] = logisticStart(xEl, y, ones, 0.63, 0.01, 0.99)!.params;
    expect(lower).toBeCloseTo(200, 8);
    expect(upper).toBeCloseTo(5, 8);
    expect(width).toBe(w);
  });
  it('flags a step sharper than a quarter bin as narrowest', () => {
    // Source: demo data — 100 anterior of 0.5, 10 posterior.
    const start = logisticStart(xEl, xEl.map((x) => (x < 0.5 ? 100 : 10)), ones, 0.5, 0.01, 0.99)!;
    expect(start.narrowest).toBe(true);
    expect(start.params[3]).toBe(0.0025);
    // The bins next to the step sit 2 widths from it (σ(±2) ≈ 0.88/0.12), so the levels are only near 10 and 100.
    expect(start.params[0]).toBeCloseTo(10, 0);
    expect(start.params[1]).toBeCloseTo(100, 0);
  });
  it('uses the weights (a down-weighted outlier does not move the levels)', () => {
    // Source: demo data — exact step of grid width 8, bin 80 raised by 500 with weight 1e-12.
    const w = gridWidth(8);
    const y = xEl.map((x) => 20 + 60 * logistic((x - 0.3) / w));
    y[80] += 500;
    const weight = ones.slice();
    weight[80] = 1e-12;
    const start = logisticStart(xEl, y, weight, 0.3, 0.01, 0.99)!;
    expect(start.params[0]).toBeCloseTo(20, 4);
    expect(start.params[1]).toBeCloseTo(80, 4);
    expect(start.params[3]).toBe(w);
  });
});
