import { describe, expect, it } from 'vitest';
import { fitLine, meanOf, sdOf, tQuantileOf } from './stats-local';

describe('local statistics', () => {
  it('mean and sample SD (n − 1) of a tiny sample', () => {
    // Source: hand-computed: [2,4,4,4,5,5,7,9] mean 5, sum of squares 32, sd = sqrt(32/7)
    expect(meanOf([2, 4, 4, 4, 5, 5, 7, 9])).toBe(5);
    expect(sdOf([2, 4, 4, 4, 5, 5, 7, 9])).toBeCloseTo(Math.sqrt(32 / 7), 12);
    expect(sdOf([1])).toBeNaN();
  });
  it('t quantiles match table values', () => {
    // Source: Student t table (from memory): t(0.975, 4) = 2.776445, t(0.975, 10) = 2.228139, t(0.975, 1) = 12.706205
    expect(tQuantileOf(0.975, 4)).toBeCloseTo(2.776445, 5);
    expect(tQuantileOf(0.975, 10)).toBeCloseTo(2.228139, 5);
    expect(tQuantileOf(0.975, 1)).toBeCloseTo(12.706205, 5);
    expect(tQuantileOf(0.975, 0)).toBeNaN();
  });
  it('least-squares line on a hand-computed case', () => {
    // Source: hand-computed: x 1..5, y [2,4,5,4,5]: Sxx 10, Sxy 6 → slope 0.6, intercept 2.2, RSS 2.4, SStot 6
    const f = fitLine([1, 2, 3, 4, 5], [2, 4, 5, 4, 5]);
    expect(f.slope).toBeCloseTo(0.6, 12);
    expect(f.intercept).toBeCloseTo(2.2, 12);
    expect(f.r2).toBeCloseTo(0.6, 12);
    expect(f.slopeSe).toBeCloseTo(Math.sqrt(2.4 / 3 / 10), 12);
    expect(f.interceptSe).toBeCloseTo(Math.sqrt((2.4 / 3) * (1 / 5 + 9 / 10)), 12);
    expect(f.dof).toBe(3);
    // Source: t(0.975, 3) = 3.182446 (t table, from memory)
    expect(f.slopeCi[1] - f.slope).toBeCloseTo(3.182446 * Math.sqrt(0.08), 5);
  });
  it('an exact line has R² = 1 and zero slope SE', () => {
    // Source: hand-computed: y = 1 + 2x
    const f = fitLine([0, 1, 2, 3], [1, 3, 5, 7]);
    expect([f.slope, f.intercept, f.r2, f.slopeSe]).toEqual([2, 1, 1, 0]);
  });
});
