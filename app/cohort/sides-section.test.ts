// The report's plain reading of the dorsal − ventral differences: "rejected" / "not rejected", never "equal".
import { describe, expect, it } from 'vitest';
import type { SideDifferenceRow } from '../../core/cohort';
import { sideDifferenceSentence } from './sides-section';

// Demo data: invented condition summaries.
const row = (over: Partial<SideDifferenceRow>): SideDifferenceRow => ({
  condition: 'c1', dosage: 1, n: 6, meanEl: 0.012, sdEl: 0.006, semEl: 0.00245, ciLowEl: 0.0057, ciHighEl: 0.0183,
  nUm: 6, meanUm: 6, ciLowUm: 2.9, ciHighUm: 9.1, p: 0.004, pHolm: 0.008, ...over,
});

describe('sideDifferenceSentence', () => {
  it('says zero is rejected, and which side is longer, when the interval excludes it', () => {
    const s = sideDifferenceSentence(row({}), 0.95);
    expect(s).toContain('A mean difference of zero is rejected at the 0.05 level');
    expect(s).toContain('longer on the dorsal side');
    expect(s).toContain('Holm-adjusted over the conditions 0.008');
    expect(sideDifferenceSentence(row({ meanEl: -0.012, ciLowEl: -0.0183, ciHighEl: -0.0057 }), 0.95)).toContain('longer on the ventral side');
  });
  it('says "not rejected" without claiming the sides are equal when the interval holds zero', () => {
    const s = sideDifferenceSentence(row({ meanEl: 0.002, ciLowEl: -0.004, ciHighEl: 0.008, p: 0.4, pHolm: 0.8 }), 0.95);
    expect(s).toContain('is not rejected at the 0.05 level');
    expect(s).toContain('does not show that the sides are equal');
    expect(s).not.toMatch(/longer on/);
  });
  it('gives no interval for one embryo', () => {
    expect(sideDifferenceSentence(row({ n: 1, ciLowEl: NaN, ciHighEl: NaN }), 0.95)).toContain('at least two embryos are needed');
  });
});
