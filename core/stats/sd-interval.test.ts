import { describe, expect, it } from 'vitest';
import { sdConfidenceInterval } from './sd-interval';

describe('sdConfidenceInterval', () => {
  it('gives ×0.624 to ×2.453 of the SD for n = 6 at 95%', () => {
    // Source: χ²(5) quantiles 0.8312 (2.5%) and 12.833 (97.5%) from a chi-square table (from memory):
    // √(5/12.833) = 0.6242, √(5/0.8312) = 2.4526.
    const [lo, hi] = sdConfidenceInterval(1, 6);
    expect(lo).toBeCloseTo(0.6242, 4);
    expect(hi).toBeCloseTo(2.4526, 3);
  });
  it('is NaN for fewer than two values', () => {
    expect(sdConfidenceInterval(1, 1)).toEqual([NaN, NaN]);
  });
});
