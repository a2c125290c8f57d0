import { describe, expect, it } from 'vitest';
import type { Profile } from '../../core/model';
import { halfMaxBoundary } from './halfMax';

const prof = (mean: number[]): Profile => {
  const n = mean.length;
  const xEl = Float64Array.from(mean, (_, i) => (i + 0.5) / n);
  return { channel: 'c2', xEl, xUm: xEl.map((x) => x * 100), mean: Float64Array.from(mean), sd: new Float64Array(n), n: new Float64Array(n) };
};

// Demo data, worked by hand: half of (10 + 0) is 5, crossed a quarter of the way from bin 1 (6) to bin 2 (2).
describe('halfMaxBoundary', () => {
  it('finds a falling boundary by linear interpolation', () => {
    const b = halfMaxBoundary(prof([10, 6, 2, 0]), 100);
    expect(b.direction).toBe('falling');
    expect(b.positionEl).toBeCloseTo(0.375 + 0.25 * 0.25, 12);
    expect(b.positionUm).toBeCloseTo((0.375 + 0.0625) * 100, 10);
  });
  it('finds a rising boundary', () => {
    const b = halfMaxBoundary(prof([0, 2, 6, 10]), 100);
    expect(b.direction).toBe('rising');
    expect(b.positionEl).toBeCloseTo(0.625 - 0.0625, 12);
  });
  it('reports a flat profile', () => {
    expect(halfMaxBoundary(prof([3, 3, 3]), 1).note).toBe('flat profile');
  });
});
