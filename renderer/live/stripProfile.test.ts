import { describe, expect, it } from 'vitest';
import { profileFromStrip } from './stripProfile';

// Demo data: a 4-column, 2-row strip; worked by hand.
describe('profileFromStrip', () => {
  const strip = { width: 4, height: 2, data: Float32Array.from([1, 2, 3, 4, 3, 4, 5, Number.NaN]) };
  it('bins columns into x/EL bins, subtracts background, skips NaN', () => {
    const p = profileFromStrip(strip, 200, 2, 1, 'c1');
    // Columns at x/EL 0, 1/3 → bin 0; 2/3, 1 → bin 1.
    expect(Array.from(p.xEl)).toEqual([0.25, 0.75]);
    expect(Array.from(p.xUm)).toEqual([50, 150]);
    expect(Array.from(p.n)).toEqual([4, 3]);
    expect(Array.from(p.mean)).toEqual([(0 + 1 + 2 + 3) / 4, (2 + 3 + 4) / 3]);
    expect(p.sd[0]).toBeCloseTo(Math.sqrt(1.25), 12);
  });
  it('marks empty bins NaN', () => {
    const p = profileFromStrip(strip, 1, 8, 0, 'c1');
    expect(p.n[1]).toBe(0);
    expect(p.mean[1]).toBeNaN();
  });
  it('rejects a bad bin count', () => {
    expect(() => profileFromStrip(strip, 1, 0, 0, 'c1')).toThrow('binCount must be a positive integer');
  });
});

describe('profileFromStrip with a selection', () => {
  it('uses only selected pixels', () => {
    const strip = { width: 2, height: 2, data: Float32Array.from([1, 2, 5, 6]) };
    const p = profileFromStrip(strip, 1, 1, 0, 'c1', Uint8Array.from([1, 0, 0, 1]));
    expect(Array.from(p.mean)).toEqual([3.5]);
    expect(Array.from(p.n)).toEqual([2]);
  });
});
