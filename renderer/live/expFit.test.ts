import { describe, expect, it } from 'vitest';
import type { Profile } from '../../core/model';
import { createRng } from '../../core/stats';
import { fitProfileExponential, invert3 } from './expFit';

/** Demo data: profile from known A, λ, B on an egg of length L µm, optional seeded Gaussian noise. */
function demoProfile(A: number, lambdaUm: number, B: number, eggUm: number, noiseSd = 0, bins = 100): Profile {
  const rng = createRng(7);
  const xEl = new Float64Array(bins).map((_, b) => (b + 0.5) / bins);
  const xUm = xEl.map((x) => x * eggUm);
  const mean = xUm.map((x) => A * Math.exp(-x / lambdaUm) + B + noiseSd * rng.normal());
  return { channel: 'c1', xEl, xUm, mean, sd: new Float64Array(bins), n: new Float64Array(bins).fill(10) };
}

describe('invert3', () => {
  // Source: worked by hand (diagonal matrix inverse).
  it('inverts a diagonal matrix', () => {
    expect(invert3([2, 0, 0, 0, 4, 0, 0, 0, 0.5])).toEqual([0.5, 0, 0, 0, 0.25, 0, 0, 0, 2]);
  });
  it('returns null for a singular matrix', () => {
    expect(invert3([1, 2, 3, 2, 4, 6, 0, 0, 1])).toBeNull();
  });
});

describe('fitProfileExponential', () => {
  it('recovers exact parameters from noise-free demo data', () => {
    const f = fitProfileExponential(demoProfile(1000, 100, 50, 500), [0.05, 0.8], 500);
    if (typeof f === 'string') throw new Error(f);
    expect(f.lambdaUm).toBeCloseTo(100, 4);
    expect(f.amplitude).toBeCloseTo(1000, 2);
    expect(f.background).toBeCloseTo(50, 3);
    expect(f.lambdaEl).toBeCloseTo(0.2, 6);
    expect(f.r2).toBeCloseTo(1, 10);
    expect(f.dof).toBe(75 - 3);
  });
  it('recovers λ within 3 SE from seeded noisy demo data, with a CI that brackets it', () => {
    const f = fitProfileExponential(demoProfile(800, 90, 30, 500, 10), [0.05, 0.9], 500);
    if (typeof f === 'string') throw new Error(f);
    expect(Math.abs(f.lambdaUm - 90)).toBeLessThan(3 * f.lambdaSeUm);
    expect(f.lambdaCiLowUm).toBeLessThan(90);
    expect(f.lambdaCiHighUm).toBeGreaterThan(90);
    expect(f.lambdaSeUm).toBeGreaterThan(0);
  });
  it('explains a range that is too small', () => {
    expect(fitProfileExponential(demoProfile(1, 1, 0, 10), [0.1, 0.13], 10)).toBe('fit range 0.1–0.13 EL holds 3 bins; at least 5 are needed');
  });
});
