import { describe, expect, it } from 'vitest';
import { erfc, pixelTable } from './camera-table';

describe('erfc', () => {
  it('matches known values within its stated error', () => {
    // Source: from memory — erfc(0) = 1, erfc(1) = 0.15729920705028513, erfc(−1) = 2 − erfc(1), erfc(2) = 0.004677734981047266.
    expect(erfc(0)).toBeCloseTo(1, 7);
    expect(Math.abs(erfc(1) / 0.15729920705028513 - 1)).toBeLessThan(1.2e-7);
    expect(erfc(-1)).toBeCloseTo(2 - 0.15729920705028513, 7);
    expect(Math.abs(erfc(2) / 0.004677734981047266 - 1)).toBeLessThan(1.2e-7);
  });
});

describe('pixelTable', () => {
  it('is the shifted Poisson distribution without read noise', () => {
    // Source: Poisson pmf e^−λ λ^k / k! for λ = 2 (hand computation), shifted by the offset 100.
    const t = pixelTable(100, 2, 0);
    const p = (k: number): number => t.pmf[k - t.first];
    const e = Math.exp(-2);
    [e, 2 * e, 2 * e, (4 / 3) * e, (2 / 3) * e].forEach((v, k) => expect(p(100 + k)).toBeCloseTo(v, 12));
    expect(t.sample(0)).toBe(100);
    expect(t.sample(e * 0.999)).toBe(100);
    expect(t.sample(e * 1.001)).toBe(101);
    expect(t.sample(0.999999999)).toBeGreaterThan(105);
  });

  it('has mean offset + λ and variance λ + σ² + 1/12 with read noise', () => {
    // Source: sums of independent Poisson and normal variables; rounding adds 1/12 (Sheppard's correction, from memory).
    const t = pixelTable(100, 8, 4);
    let m = 0;
    let total = 0;
    t.pmf.forEach((q, k) => { m += q * (t.first + k); total += q; });
    let v = 0;
    t.pmf.forEach((q, k) => { v += q * (t.first + k - m) ** 2; });
    expect(total).toBeCloseTo(1, 12);
    expect(m).toBeCloseTo(108, 5);
    expect(v).toBeCloseTo(8 + 16 + 1 / 12, 3);
  });
});
