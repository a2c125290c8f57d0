import { describe, expect, it } from 'vitest';
import { fiellerInterval } from './fieller';

describe('fiellerInterval', () => {
  it('matches the roots of the defining quadratic', () => {
    // Source: test/stats-reference/fieller_reference.py (numpy.roots of (a − ρb)² = t²(sa² + ρ²sb²), t from scipy;
    // demo data): a, sa, b, sb, dof, level, low, high, g.
    const cases = [
      [0.17, 0.0075, 0.19, 0.005, 10, 0.95, 0.7951893747895242, 1.0004579073597557, 0.003438090542683957],
      [0.3, 0.05, 0.2, 0.03, 5, 0.95, 0.7889836526756965, 2.7349454878092017, 0.14867754702150612],
      [-0.12, 0.04, 0.21, 0.06, 8, 0.9, -1.3909256311791192, -0.20141636918511385, 0.28227909419224934],
    ];
    for (const [a, sa, b, sb, dof, level, low, high, g] of cases) {
      const r = fiellerInterval(a, sa, b, sb, dof, level);
      // 1e-8: the t quantile here (@stdlib) and scipy's agree to about 1e-10 relative.
      expect(r.low).toBeCloseTo(low, 8);
      expect(r.high).toBeCloseTo(high, 8);
      expect(r.g).toBeCloseTo(g, 9);
    }
  });
  it('is unbounded when the denominator is not distinguishable from zero (g ≥ 1)', () => {
    // Source: Fieller 1954 (from memory): with g ≥ 1 the confidence set is not a finite interval.
    const r = fiellerInterval(0.3, 0.05, 0.05, 0.04, 10);
    expect([r.low, r.high]).toEqual([null, null]);
    expect(r.g).toBeGreaterThan(1);
  });
  it('is the same for −a/−b and lies close to the delta method when g is small', () => {
    const a = fiellerInterval(0.3, 0.05, 0.2, 0.03, 5);
    const b = fiellerInterval(-0.3, 0.05, -0.2, 0.03, 5);
    expect(b.low).toBeCloseTo(a.low!, 12);
    expect(b.high).toBeCloseTo(a.high!, 12);
    // Demo data: g = 0.0034; the delta method's width 2·t·√(sa² + ρ²sb²)/|b| is within 1% of Fieller's.
    const f = fiellerInterval(0.17, 0.0075, 0.19, 0.005, 10);
    const rho = 0.17 / 0.19;
    const delta = (2 * 2.2281388519649385 * Math.sqrt(0.0075 ** 2 + rho * rho * 0.005 ** 2)) / 0.19; // t(0.975, 10): scipy
    expect(Math.abs((f.high! - f.low!) / delta - 1)).toBeLessThan(0.01);
  });
});
