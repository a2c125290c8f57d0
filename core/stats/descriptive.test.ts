import { describe, expect, it } from 'vitest';
import { mad, mean, median, quantile, robustSigma, sd, sem } from './descriptive';

describe('mean / sd / sem', () => {
  it('matches hand-computed values', () => {
    // Source: hand computation — sum 40 / 8 = 5; squared deviations 9,1,1,1,0,0,4,16 sum to 32.
    const v = [2, 4, 4, 4, 5, 5, 7, 9];
    expect(mean(v)).toBe(5);
    expect(sd(v)).toBeCloseTo(Math.sqrt(32 / 7), 14); // sum of squared deviations = 32
    expect(sem(v)).toBeCloseTo(Math.sqrt(32 / 7) / Math.sqrt(8), 14);
    expect(mean(new Float64Array([1, 2, 3, 4]))).toBe(2.5);
  });
  it('keeps precision with a large offset', () => {
    // Source: hand computation — offset 1e9 plus 1..3 gives mean 1e9+2 and sd 1.
    const v = [1e9 + 1, 1e9 + 2, 1e9 + 3];
    expect(mean(v)).toBe(1e9 + 2);
    expect(sd(v)).toBe(1);
  });
  it('returns NaN spread for one value and rejects bad input with exact messages', () => {
    expect(sd([3])).toBeNaN();
    expect(sem([3])).toBeNaN();
    expect(() => mean([])).toThrow('mean: no values');
    expect(() => sd([1, NaN])).toThrow('sd: value 1 is not a finite number');
    expect(() => mean([1, Infinity])).toThrow('mean: value 1 is not a finite number');
  });
  it('does not modify its input', () => {
    const v = new Float64Array([3, 1, 2]);
    median(v);
    quantile(v, 0.3);
    expect(Array.from(v)).toEqual([3, 1, 2]);
  });
});

describe('median / quantile / robust sigma', () => {
  it('matches the linear-interpolation (type 7) definition', () => {
    // Source: hand computation with h = (n−1)p.
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(quantile([1, 2, 3, 4, 5], 0.25)).toBe(2);
    expect(quantile([1, 2, 3, 4], 0.25)).toBe(1.75);
    expect(quantile([10, 20], 0)).toBe(10);
    expect(quantile([10, 20], 1)).toBe(20);
    expect(quantile([7], 0.9)).toBe(7);
  });
  it('computes MAD and 1.4826·MAD', () => {
    // Source: hand computation — median 2, absolute deviations 0,0,1,1,2,4,7, their median 1.
    const v = [1, 1, 2, 2, 4, 6, 9];
    expect(mad(v)).toBe(1);
    // Source: from memory — 1/Φ⁻¹(0.75) = 1.482602218505602.
    expect(robustSigma(v)).toBeCloseTo(1.482602218505602, 15);
  });
  it('rejects bad p with an exact message', () => {
    expect(() => quantile([1, 2], 1.5)).toThrow('quantile: p must be between 0 and 1, got 1.5');
    expect(() => quantile([1, 2], NaN)).toThrow('quantile: p must be between 0 and 1, got NaN');
    expect(() => median([])).toThrow('median: no values');
  });
});
