import { describe, expect, it } from 'vitest';
import type { EmbryoResult } from '../model';
import { makeDemoCohort } from './demo-cohort';
import { localLambdaEl, localLambdaWithSe } from './local-lambda';

// Demo data: noise-free profiles C(x) = A·exp(−x/λ) + B on 100 bins, with the fit's background B.
function embryo(file: string, a: number, lambdaEl: number, b: number, bend = 0): EmbryoResult {
  const base = makeDemoCohort({ conditions: [{ name: 'r', dosage: 1, count: 1 }] }).results[0];
  const xEl = Float64Array.from({ length: 100 }, (_, i) => (i + 0.5) / 100);
  // `bend` adds a second, slower decay beyond 0.5 EL (a profile that is not one exponential).
  const mean = xEl.map((x) => a * Math.exp(-x / lambdaEl) + b + (x > 0.5 ? bend * a * (x - 0.5) ** 2 : 0));
  return {
    ...base, file, gradientProfile: { channel: 'g', xEl, xUm: xEl.map((x) => 500 * x), mean, sd: mean.map(() => 0), n: mean.map(() => 50) },
    gradientFit: { ...base.gradientFit!, background: b },
  };
}
const cond = { name: 'r', dosage: 1, factor: 1 };
const opts = { gridStepEl: 0.01, slopeHalfWidthEl: 0.04 };

describe('local decay length', () => {
  it('equals the global λ on an exact exponential, up to the central difference', () => {
    // Source: for C − B = A·exp(−x/λ) the central difference over ±h gives slope·sinh(h/λ)/(h/λ), so
    // (C − B)/|ΔC/Δx| = λ·(h/λ)/sinh(h/λ) = 0.2·0.2/sinh(0.2) = 0.198673 (derived).
    const refs = [embryo('a', 1000, 0.2, 30), embryo('b', 800, 0.2, 30), embryo('c', 1200, 0.2, 30)];
    const [l3, l4] = localLambdaEl(refs, cond, [0.3, 0.4], opts);
    expect(l3).toBeCloseTo((0.2 * 0.2) / Math.sinh(0.2), 4);
    expect(l4).toBeCloseTo((0.2 * 0.2) / Math.sinh(0.2), 4);
    const withSe = localLambdaWithSe(refs, cond, [0.4], opts)[0];
    expect(withSe.seEl).toBeLessThan(1e-6);
  });
  it('differs from the global λ where the profile bends, and is NaN outside the data', () => {
    const refs = [embryo('a', 1000, 0.2, 30, 0.5), embryo('b', 900, 0.2, 30, 0.5), embryo('c', 1100, 0.2, 30, 0.5)];
    const [before, after, outside] = localLambdaEl(refs, cond, [0.3, 0.7, 1.5], opts);
    expect(before).toBeCloseTo((0.2 * 0.2) / Math.sinh(0.2), 4);
    expect(after).toBeGreaterThan(0.25);
    expect(outside).toBeNaN();
  });
});
