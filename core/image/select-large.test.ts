import { describe, expect, it } from 'vitest';
import { medianInPlace } from './select';

describe('medianInPlace on large Float32 arrays (bucket path)', () => {
  it('gives the exact median of shuffled integers and of negative values', () => {
    // Source: hand computation — the median of 0..70000 is 35000; of 0..69999 it is 34999.5.
    const shuffled = (n: number): Float32Array => {
      const a = Float32Array.from({ length: n }, (_, i) => i);
      for (let i = n - 1, s = 12345; i > 0; i--) { s = (s * 1103515245 + 12345) % 2147483648; const j = s % (i + 1); [a[i], a[j]] = [a[j], a[i]]; }
      return a;
    };
    expect(medianInPlace(shuffled(70_001))).toBe(35_000);
    expect(medianInPlace(shuffled(70_000))).toBe(34_999.5);
    expect(medianInPlace(shuffled(70_001).map((v) => -v - 0.25))).toBe(-35_000.25);
  });
});
