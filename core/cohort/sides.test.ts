// The cohort's summary of the paired differences λ_dorsal − λ_ventral: per-condition t interval, test of zero, Holm.
import { describe, expect, it } from 'vitest';
import type { ConditionInfo, Observation } from '../model';
import { parseCsv } from '../csv';
import { SIDE_DIFFERENCE_QUANTITY, sideDifferences, sideDifferencesCsv } from './sides';

const obs = (condition: string, unit: 'EL' | 'um', values: number[]): Observation[] =>
  values.map((value, i) => ({ file: `${condition}-${i}.tif`, condition, lnF: null, quantity: SIDE_DIFFERENCE_QUANTITY, kind: 'side-difference', unit, value }));
const cond = (name: string, dosage: number | null): ConditionInfo => ({ name, dosage, factor: dosage, isReference: false } as unknown as ConditionInfo);

describe('sideDifferences (demo data: invented differences)', () => {
  const observations = [...obs('a', 'EL', [0.01, 0.02, 0.03]), ...obs('a', 'um', [5, 10, 15]), ...obs('b', 'EL', [0.05, 0.06, 0.055, 0.045])];
  const rows = sideDifferences(observations, [cond('a', 1), cond('none', 2), cond('b', 0.5)]);

  it('gives the mean, the t interval and the one-sample t test per condition, Holm across conditions', () => {
    // Source: scipy.stats.ttest_1samp and scipy.stats.t.ppf (Debian's python3-scipy), run by hand:
    // a = [0.01, 0.02, 0.03]: p = 0.07417990022744853, half-width t(0.975, 2)·SEM = 0.02484137711843753;
    // b = [0.05, 0.06, 0.055, 0.045]: p = 0.0005054853461390419, half-width 0.010271301283804395.
    expect(rows.map((r) => r.condition)).toEqual(['a', 'b']);
    const [a, b] = rows;
    expect(a.n).toBe(3);
    expect(a.meanEl).toBeCloseTo(0.02, 12);
    expect(a.ciHighEl - a.meanEl).toBeCloseTo(0.02484137711843753, 10);
    expect(a.p).toBeCloseTo(0.07417990022744853, 8);
    expect(a.meanUm).toBeCloseTo(10, 10);
    expect(a.nUm).toBe(3);
    expect(b.ciHighEl - b.meanEl).toBeCloseTo(0.010271301283804395, 10);
    expect(b.p).toBeCloseTo(0.0005054853461390419, 9);
    expect(Number.isNaN(b.meanUm)).toBe(true);
    // Source: Holm (1979) by hand: 2 × 0.000505 for the smaller, then max(that, 1 × 0.0742).
    expect(b.pHolm).toBeCloseTo(2 * 0.0005054853461390419, 9);
    expect(a.pHolm).toBeCloseTo(0.07417990022744853, 8);
  });

  it('writes side_differences.csv, and nothing when no embryo had both sides measured', () => {
    const table = parseCsv(sideDifferencesCsv(rows)!);
    expect(table[0]).toEqual(['condition', 'dosage', 'n', 'mean_el', 'sd_el', 'sem_el', 'ci_low_el', 'ci_high_el', 'n_um', 'mean_um', 'ci_low_um', 'ci_high_um', 'p_zero', 'p_zero_holm']);
    expect(table).toHaveLength(3);
    expect(sideDifferencesCsv([])).toBeNull();
    expect(sideDifferences([], [cond('a', 1)])).toEqual([]);
  });
});
