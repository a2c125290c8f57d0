import { describe, expect, it } from 'vitest';
import type { DecayLengthDifference, ExponentialFit, SidesMeasurement } from '../../core/model';
import { negativeLambdaHint, sideNumberRows } from './FitNumbers';

describe('negative-λ hint', () => {
  it('suggests swapping poles only for a hand axis; with the automatic axis it points at the gradient channel first', () => {
    expect(negativeLambdaHint('hand')).toMatch(/swapped \(S\)/);
    expect(negativeLambdaHint('auto')).not.toMatch(/swapped/);
    expect(negativeLambdaHint('auto')).toMatch(/gradient channel/);
  });
});

describe('the numbers of each side measured on its own', () => {
  // Demo data: invented fits and difference.
  const fit = (lambdaUm: number) => ({ lambdaUm, lambdaSeUm: 2, lambdaCiLowUm: lambdaUm - 4, lambdaCiHighUm: lambdaUm + 4 }) as unknown as ExponentialFit;
  const difference = { lambdaUm: 20, seUm: 3, ciLowUm: 14, ciHighUm: 26, lambdaEl: 0.04, seEl: 0.006, ciLowEl: 0.028, ciHighEl: 0.052, sideCorrelation: 0.31, seSource: 'model' } as unknown as DecayLengthDifference;
  const sides = { dorsalFit: fit(100), ventralFit: null, difference } as unknown as SidesMeasurement;
  it('shows each side\'s λ, the difference with its interval and the sides\' error correlation; nothing when not measured', () => {
    const rows = sideNumberRows(sides);
    expect(rows.map((r) => r[0])).toEqual(['λ dorsal', 'λ ventral', 'dorsal − ventral', 'sides\' error corr.']);
    expect(rows[0][1]).toBe('100 ± 2 µm (96 – 104)');
    expect(rows[1][1]).toBe('fit failed');
    expect(rows[2][1]).toBe('20 ± 3 µm (95% CI 14 – 26)');
    expect(rows[3][1]).toBe('0.31 (model SE)');
    // Without a pixel size the difference is shown in EL.
    expect(sideNumberRows({ ...sides, difference: { ...difference, lambdaUm: NaN } })[2][1]).toBe('0.0400 ± 0.0060 EL (95% CI 0.0280 – 0.0520)');
    expect(sideNumberRows(null)).toEqual([]);
  });
});
