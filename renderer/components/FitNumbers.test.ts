import { describe, expect, it } from 'vitest';
import type { DecayLengthDifference, ExponentialFit, SidesMeasurement } from '../../core/model';
import { intervalSourceText, negativeLambdaHint, sideNumberRows } from './FitNumbers';

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

describe('the sentence on which standard error the interval rests', () => {
  // Demo data: invented fits.
  const base = { lambdaSeModelUm: 0.8, lambdaSeSerialUm: 1.234, residualLag1: -0.314 };
  it('names the serial-correlation SE when it is the wider, with the model SE and the lag-1 correlation beside it', () => {
    const f = { ...base, lambdaSeSource: 'serial' } as unknown as ExponentialFit;
    expect(intervalSourceText(f)).toBe('interval from the serial-correlation SE 1.2 µm (residual lag-1 r = \u22120.31); model SE 0.8 µm');
  });
  it('names the model SE when it is the wider, and says when the serial one could not be computed', () => {
    const f = { ...base, lambdaSeSource: 'model', lambdaSeSerialUm: 0.61, residualLag1: 0.05 } as unknown as ExponentialFit;
    expect(intervalSourceText(f)).toBe('interval from the model SE 0.8 µm; serial-correlation SE 0.61 µm (residual lag-1 r = 0.05)');
    const g = { ...base, lambdaSeSource: 'model', lambdaSeSerialUm: NaN, residualLag1: NaN } as unknown as ExponentialFit;
    expect(intervalSourceText(g)).toBe('interval from the model SE 0.8 µm; serial-correlation SE not computable (residual lag-1 r = —)');
  });
  it('adds a side\'s depth term, and puts the sentence under each side\'s λ', () => {
    const f = { ...base, lambdaSeSource: 'serial', depthTermEl: 0.00213 } as unknown as ExponentialFit;
    expect(intervalSourceText(f)).toBe('interval from the serial-correlation SE 1.2 µm (residual lag-1 r = \u22120.31); model SE 0.8 µm; plus depth term 0.0021 EL in quadrature');
    const rows = sideNumberRows({ dorsalFit: f, ventralFit: null, difference: null } as unknown as SidesMeasurement);
    expect(rows[0][3]).toBe(intervalSourceText(f));
    expect(rows[1][3]).toBeUndefined();
  });
});
