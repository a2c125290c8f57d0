import { describe, expect, it } from 'vitest';
import { binWeights } from './measure';

describe('binWeights', () => {
  it('weights bin means by n/SD², floors tiny variances and fills unusable bins with the median', () => {
    // Source: Var(mean of n values) = SD²/n (any statistics text); inputs are demo data.
    const sd = Float64Array.from([2, 4, 0.001, 3, Number.NaN, 5]);
    const n = Float64Array.from([4, 16, 100, 1, 10, 25]);
    const w = binWeights(sd, n)!;
    // Variances 1, 1, 1e-8, –, –, 1: median of the usable values is 1 (sorted 1e-8, 1, 1, 1 → index 2).
    expect(Array.from(w)).toEqual([1, 1, 100, 1, 1, 1]);
  });
  it('returns null when no bin has a usable SD', () => {
    expect(binWeights(Float64Array.from([0, 0]), Float64Array.from([5, 5]))).toBeNull();
  });
});
