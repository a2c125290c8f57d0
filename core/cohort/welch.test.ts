import { describe, expect, it } from 'vitest';
import { welchDifference } from './welch';

describe('welchDifference', () => {
  it('equal n and variances: dof = 2(n − 1) and the t interval by hand', () => {
    // Source: hand-computed: a=[1,2,3], b=[4,5,6]: diff 3, se² = 1/3 + 1/3, dof 4; t(0.975,4) = 2.776445 (t table, from memory)
    const d = welchDifference([1, 2, 3], [4, 5, 6]);
    expect(d.difference).toBe(3);
    expect(d.se).toBeCloseTo(Math.sqrt(2 / 3), 12);
    expect(d.dof).toBeCloseTo(4, 12);
    expect(d.ciLow).toBeCloseTo(3 - 2.776445 * Math.sqrt(2 / 3), 5);
    expect(d.ciHigh).toBeCloseTo(3 + 2.776445 * Math.sqrt(2 / 3), 5);
  });
  it('unequal variances: Welch–Satterthwaite dof = 3888/784', () => {
    // Source: hand-computed: a=[1,2,3] (s²/n = 1/3), b=[4,5,6,7] (s²/n = 5/12); dof = (3/4)² / ((1/3)²/2 + (5/12)²/3)
    const d = welchDifference([1, 2, 3], [4, 5, 6, 7]);
    expect(d.difference).toBeCloseTo(3.5, 12);
    expect(d.se).toBeCloseTo(Math.sqrt(0.75), 12);
    expect(d.dof).toBeCloseTo(3888 / 784, 10);
  });
  it('identical values in both samples: a zero-width interval, not NaN', () => {
    // Source: hand-computed
    const d = welchDifference([2, 2], [3, 3, 3]);
    expect([d.difference, d.se, d.dof, d.ciLow, d.ciHigh]).toEqual([1, 0, 3, 1, 1]);
  });
  it('a sample of one gives NaN spread, not a crash', () => {
    // Source: demo data
    const d = welchDifference([1], [2, 3]);
    expect(d.difference).toBe(1.5);
    expect(d.ciLow).toBeNaN();
  });
});
