import { describe, expect, it } from 'vitest';
import { createRng } from '../stats';
import { fitExponentialDecay } from './exponential';
import { fitErrorOf as errorOf } from './fit-error-of.test-helper';

// Demo data: a 500 µm egg, 100 bins with centres at (i + 0.5)/100 EL.
const EGG_UM = 500;
const BINS = 100;
const xEl = Float64Array.from({ length: BINS }, (_, i) => (i + 0.5) / BINS);
const xUm = xEl.map((v) => v * EGG_UM);
const profile = (a: number, lambdaUm: number, b: number): Float64Array => xUm.map((x) => a * Math.exp(-x / lambdaUm) + b);


describe('fitExponentialDecay', () => {
  it('recovers exact parameters to 1e-8 relative', () => {
    // Source: demo data — A = 1200, λ = 95 µm, B = 40, no noise.
    const fit = fitExponentialDecay(xUm, profile(1200, 95, 40), { eggLengthUm: EGG_UM, fitRangeEl: [0.1, 0.8], xEl });
    expect(Math.abs(fit.lambdaUm / 95 - 1)).toBeLessThan(1e-8);
    expect(Math.abs(fit.amplitude / 1200 - 1)).toBeLessThan(1e-8);
    expect(Math.abs(fit.background / 40 - 1)).toBeLessThan(1e-8);
    expect(fit.lambdaEl).toBeCloseTo(95 / EGG_UM, 10);
    expect(fit.r2).toBeCloseTo(1, 12);
    // Bins 10..79 have centres inside [0.1, 0.8]: 70 points, dof 67.
    expect(fit.xEl.length).toBe(70);
    expect(fit.xEl[0]).toBeCloseTo(0.105, 12);
    expect(fit.dof).toBe(67);
    expect(Math.max(...fit.residuals.map(Math.abs))).toBeLessThan(1e-8);
    expect(fit.fitRangeEl).toEqual([0.1, 0.8]);
  });
  it('includes points exactly on the range ends', () => {
    // Source: demo data — x/EL 0, 0.25, 0.5, 0.75, 1 with range [0.25, 1]: four points in range, λ = 250 µm.
    const el = Float64Array.from([0, 0.25, 0.5, 0.75, 1]);
    const um = el.map((v) => v * 400);
    const y = um.map((x) => 10 * Math.exp(-x / 250) + 1);
    const fit = fitExponentialDecay(um, y, { eggLengthUm: 400, fitRangeEl: [0.25, 1], xEl: el });
    expect(Array.from(fit.xEl)).toEqual([0.25, 0.5, 0.75, 1]);
    expect(fit.lambdaUm).toBeCloseTo(250, 6);
    expect(fit.lambdaEl).toBeCloseTo(0.625, 8);
    expect(fit.dof).toBe(1);
  });
  it('reports a rising profile as a negative decay length', () => {
    // Source: demo data — y = 30·exp(+x/150) + 5, i.e. λ = −150 µm.
    const fit = fitExponentialDecay(xUm, profile(30, -150, 5), { eggLengthUm: EGG_UM, fitRangeEl: [0, 1], xEl });
    expect(fit.lambdaUm).toBeCloseTo(-150, 6);
    expect(fit.lambdaEl).toBeCloseTo(-0.3, 8);
  });
  it('does not need a good start: very short and very long decay lengths', () => {
    // Source: demo data — λ = 12 µm (steep) and λ = 2000 µm (nearly linear) over the full egg.
    for (const lambda of [12, 2000]) {
      const fit = fitExponentialDecay(xUm, profile(800, lambda, 100), { eggLengthUm: EGG_UM, fitRangeEl: [0, 1], xEl });
      expect(Math.abs(fit.lambdaUm / lambda - 1)).toBeLessThan(1e-7);
    }
  });
  it('standard error and interval are consistent and scale to EL', () => {
    // Source: demo data with seeded Gaussian noise (σ = 10 on an amplitude of 1000).
    const rng = createRng(17);
    const y = profile(1000, 100, 50).map((v) => v + 10 * rng.normal());
    const fit = fitExponentialDecay(xUm, y, { eggLengthUm: EGG_UM, fitRangeEl: [0.05, 0.9], xEl });
    expect(fit.lambdaSeUm).toBeGreaterThan(0);
    expect(fit.lambdaSeEl).toBeCloseTo(fit.lambdaSeUm / EGG_UM, 14);
    // Source: from memory — t(0.975, 80) = 1.990063421 (85 points − 3 parameters = 82 dof, here checked loosely).
    const tUsed = (fit.lambdaCiHighUm - fit.lambdaUm) / fit.lambdaSeUm;
    expect(tUsed).toBeGreaterThan(1.98);
    expect(tUsed).toBeLessThan(2.0);
    expect(fit.lambdaCiLowUm).toBeCloseTo(2 * fit.lambdaUm - fit.lambdaCiHighUm, 9);
    expect(Math.abs(fit.lambdaUm - 100)).toBeLessThan(4 * fit.lambdaSeUm);
  });
  it('95% intervals cover the true λ about 95% of the time (200 seeds)', () => {
    // Source: demo data — 200 seeded noisy profiles from known parameters; the coverage of a correct 95%
    // interval is binomial(200, 0.95): mean 190, SD ≈ 3.1, so 181–198 is a ±3 SD band (common practice).
    let covered = 0;
    for (let seed = 1; seed <= 200; seed++) {
      const rng = createRng(seed);
      const y = profile(1000, 90, 60).map((v) => v + 25 * rng.normal());
      const fit = fitExponentialDecay(xUm, y, { eggLengthUm: EGG_UM, fitRangeEl: [0.1, 0.9], xEl });
      if (fit.lambdaCiLowUm <= 90 && 90 <= fit.lambdaCiHighUm) covered++;
    }
    expect(covered).toBeGreaterThanOrEqual(181);
    expect(covered).toBeLessThanOrEqual(198);
  });
  it('uses weights (down-weighting an outlier bin)', () => {
    // Source: demo data — one corrupted bin; with weight 1e-6 it barely affects λ.
    const y = profile(1000, 100, 50);
    y[30] += 500;
    const weights = new Float64Array(BINS).fill(1);
    weights[30] = 1e-6;
    const fit = fitExponentialDecay(xUm, y, { eggLengthUm: EGG_UM, fitRangeEl: [0, 1], xEl, weights });
    expect(Math.abs(fit.lambdaUm / 100 - 1)).toBeLessThan(1e-3);
    const unweighted = fitExponentialDecay(xUm, y, { eggLengthUm: EGG_UM, fitRangeEl: [0, 1], xEl });
    expect(Math.abs(unweighted.lambdaUm / 100 - 1)).toBeGreaterThan(1e-3);
  });
  it('ignores NaN outside the fit range and does not modify inputs', () => {
    const y = profile(1000, 100, 50);
    y[0] = NaN;
    const copy = Float64Array.from(y);
    const fit = fitExponentialDecay(xUm, y, { eggLengthUm: EGG_UM, fitRangeEl: [0.2, 0.9], xEl });
    expect(fit.lambdaUm).toBeCloseTo(100, 6);
    expect(Array.from(y)).toEqual(Array.from(copy));
  });
  it('rejects bad input with exact messages', () => {
    const y = profile(1000, 100, 50);
    const opts = { eggLengthUm: EGG_UM, fitRangeEl: [0.1, 0.9] as const, xEl };
    const withNaN = Float64Array.from(y);
    withNaN[50] = NaN;
    const cases: [() => unknown, string, string][] = [
      [() => fitExponentialDecay(xUm, withNaN, opts), 'bad-input', 'fitExponentialDecay: point 50 (x/EL 0.505) is NaN or Infinity inside the fit range'],
      [() => fitExponentialDecay(xUm, y, { ...opts, fitRangeEl: [0.5, 0.52] }), 'bad-input', 'fitExponentialDecay: only 2 points in the fit range [0.5, 0.52] x/EL; need at least 4'],
      [() => fitExponentialDecay(xUm, y, { ...opts, fitRangeEl: [0.9, 0.1] }), 'bad-input', 'fitExponentialDecay: fitRangeEl must be [start, end] with start < end, got [0.9, 0.1]'],
      [() => fitExponentialDecay(xUm, y, { ...opts, fitRangeEl: [NaN, 0.5] }), 'bad-input', 'fitExponentialDecay: fitRangeEl must be [start, end] with start < end, got [NaN, 0.5]'],
      [() => fitExponentialDecay(xUm, y, { ...opts, eggLengthUm: 0 }), 'bad-input', 'fitExponentialDecay: eggLengthUm must be a positive number, got 0'],
      [() => fitExponentialDecay(xUm.subarray(1), y, opts), 'bad-input', 'fitExponentialDecay: xUm, xEl and y differ in length (99, 100, 100)'],
      [() => fitExponentialDecay(xUm, y, { ...opts, weights: new Float64Array(3) }), 'bad-input', 'fitExponentialDecay: weights and y differ in length (3 vs 100)'],
    ];
    for (const [run, code, message] of cases) {
      const e = errorOf(run);
      expect(e.message).toBe(message);
      expect(e.code).toBe(code);
    }
  });
  it('reports a flat or noise-only profile as a fit failure, not a number', () => {
    // Source: demo data — constant 100 exactly, and constant plus seeded noise: no decay length exists.
    const opts = { eggLengthUm: EGG_UM, fitRangeEl: [0, 1] as const, xEl };
    const flat = errorOf(() => fitExponentialDecay(xUm, xUm.map(() => 100), opts));
    expect(flat.code).toBe('bad-input');
    expect(flat.message).toBe('fitExponentialDecay: the profile is constant in the fit range');
    const rng = createRng(4);
    const noisy = errorOf(() => fitExponentialDecay(xUm, xUm.map(() => 100 + rng.normal()), opts));
    expect(['not-converged', 'nan']).toContain(noisy.code);
    expect(noisy.message.startsWith('fitExponentialDecay: ')).toBe(true);
  });
});
