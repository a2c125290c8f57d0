import { describe, expect, it } from 'vitest';
import { toRational } from './rational';

describe('toRational', () => {
  // Source: TIFF 6.0 §2 (RATIONAL = two LONGs, numerator then denominator).
  // Source: continued-fraction convergents are best rational approximations (from memory).
  it('finds exact fractions for pixel sizes and stays within uint32', () => {
    expect(toRational(20000)).toEqual([20000, 1]);
    expect(toRational(10000 / 0.325)).toEqual([400000, 13]);
    expect(toRational(10000 / 0.65)).toEqual([200000, 13]);
    expect(toRational(0.5)).toEqual([1, 2]);
    // Source: convergents of π, OEIS A002485/A002486 (from memory); the first one equal in float64 is returned.
    expect(toRational(Math.PI)).toEqual([80143857, 25510582]);
    expect(toRational(355 / 113)).toEqual([355, 113]);
    expect(toRational(1e12)).toEqual([0xffffffff, 1]);
    const [n, d] = toRational(10000 / 0.325);
    expect(n).toBeLessThanOrEqual(0xffffffff);
    expect(10000 / (n / d)).toBeCloseTo(0.325, 9);
  });

  it('rejects non-positive values', () => {
    expect(() => toRational(0)).toThrow('a resolution must be a positive finite number');
  });
});
