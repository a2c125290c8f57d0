import { describe, expect, it } from 'vitest';
import { createRng } from '../stats';
import { FitError } from './fit-error';
import { fitLogisticBoundary } from './logistic-boundary';

// Demo data: 100 bins with centres (i + 0.5)/100 x/EL.
const xEl = Float64Array.from({ length: 100 }, (_, i) => (i + 0.5) / 100);
const logisticProfile = (lower: number, upper: number, x0: number, w: number): Float64Array =>
  xEl.map((x) => lower + (upper - lower) / (1 + Math.exp((x - x0) / w)));

describe('fitLogisticBoundary', () => {
  it('recovers an exact falling logistic', () => {
    // Source: demo data — lower 10, upper 100, x0 = 0.4 EL, w = 0.02 EL, no noise.
    const b = fitLogisticBoundary(xEl, logisticProfile(10, 100, 0.4, 0.02));
    expect(b.positionEl).toBeCloseTo(0.4, 10);
    expect(b.widthEl).toBeCloseTo(0.02, 10);
    expect(b.lower).toBeCloseTo(10, 8);
    expect(b.upper).toBeCloseTo(100, 8);
    expect(b.direction).toBe('falling');
    expect(b.r2).toBeCloseTo(1, 12);
    expect(b.note).toBeNull();
  });
  it('recovers an exact rising logistic with positive width and ordered levels', () => {
    // Source: demo data — the same curve mirrored: low anterior, high posterior, x0 = 0.63.
    const b = fitLogisticBoundary(xEl, logisticProfile(200, 5, 0.63, 0.035));
    expect(b.positionEl).toBeCloseTo(0.63, 10);
    expect(b.widthEl).toBeCloseTo(0.035, 10);
    expect(b.direction).toBe('rising');
    expect(b.lower).toBeCloseTo(5, 8);
    expect(b.upper).toBeCloseTo(200, 8);
  });
  it('reports a step sharper than a bin at the midpoint of the bracketing bins', () => {
    // Source: demo data — 100 anterior of 0.5, 10 posterior: bracket bins 0.495 and 0.505.
    const b = fitLogisticBoundary(xEl, xEl.map((x) => (x < 0.5 ? 100 : 10)));
    expect(b.positionEl).toBeCloseTo(0.5, 14);
    expect(b.widthEl).toBe(0);
    expect(b.positionSeEl).toBeCloseTo(0.01 / Math.sqrt(12), 14);
    expect(b.direction).toBe('falling');
    expect(b.lower).toBeCloseTo(10, 12);
    expect(b.upper).toBeCloseTo(100, 12);
    expect(b.note).toBe('the step is sharper than the bin spacing; position is the midpoint of the bracketing bins');
  });
  it('finds noisy sigmoid boundaries within a few thousandths of EL, with honest standard errors', () => {
    // Source: demo data — 200 seeds, x0 = 0.35, w = 0.03, noise SD 5 on a range of 100. Coverage of ±1.96·SE
    // should be near 95%: binomial(200, 0.95) has SD ≈ 3.1, so 181–198 is a ±3 SD band (common practice).
    const clean = logisticProfile(20, 120, 0.35, 0.03);
    let covered = 0;
    let worst = 0;
    for (let seed = 1; seed <= 200; seed++) {
      const rng = createRng(1000 + seed);
      const b = fitLogisticBoundary(xEl, clean.map((v) => v + 5 * rng.normal()));
      worst = Math.max(worst, Math.abs(b.positionEl - 0.35));
      if (Math.abs(b.positionEl - 0.35) <= 1.96 * b.positionSeEl) covered++;
    }
    expect(worst).toBeLessThan(0.01);
    expect(covered).toBeGreaterThanOrEqual(181);
    expect(covered).toBeLessThanOrEqual(198);
  });
  it('uses weights (a corrupted bin with tiny weight barely moves the boundary)', () => {
    // Source: demo data — exact logistic with one bin near the boundary raised by 60.
    const y = logisticProfile(10, 100, 0.4, 0.02);
    y[42] += 60;
    const weights = new Float64Array(100).fill(1);
    weights[42] = 1e-8;
    expect(fitLogisticBoundary(xEl, y, { weights }).positionEl).toBeCloseTo(0.4, 6);
    expect(Math.abs(fitLogisticBoundary(xEl, y).positionEl - 0.4)).toBeGreaterThan(1e-4);
    expect(() => fitLogisticBoundary(xEl, y, { weights: new Float64Array(3) })).toThrow(
      'fitLogisticBoundary: weights and y differ in length (3 vs 100)');
    weights[5] = 0;
    expect(() => fitLogisticBoundary(xEl, y, { weights })).toThrow('fitLogisticBoundary: weights[5] must be a positive finite number');
  });
  it('skips non-finite bins', () => {
    const y = logisticProfile(10, 100, 0.4, 0.02);
    y[3] = NaN;
    y[70] = Infinity;
    expect(fitLogisticBoundary(xEl, y).positionEl).toBeCloseTo(0.4, 9);
  });
  it('throws FitError with exact messages when there is no step or too little data', () => {
    const flat = () => fitLogisticBoundary(xEl, xEl.map(() => 7));
    expect(flat).toThrow(FitError);
    expect(flat).toThrow('fitLogisticBoundary: the profile has no step (it never crosses its half-maximum)');
    expect(() => fitLogisticBoundary([0, 1, 2, 3], [1, 1, 0, 0])).toThrow('fitLogisticBoundary: need at least 5 finite bins, got 4');
    expect(() => fitLogisticBoundary([0, 1], [1])).toThrow('fitLogisticBoundary: xEl and y differ in length (2 vs 1)');
  });
});
