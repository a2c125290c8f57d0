import { describe, expect, it } from 'vitest';
import type { EmbryoResult, Profile } from '../../core/model';
import { lambdaSummaryEl, lambdaValuesEl, meanScaledProfile } from './cohortSeries';

// Demo results, worked by hand.
const prof = (mean: number[]): Profile => ({ channel: 'g', xEl: Float64Array.from([0, 1]), xUm: new Float64Array(2), mean: Float64Array.from(mean), sd: new Float64Array(2), n: new Float64Array(2) });
const res = (p: Profile | null, lambdaEl: number | null) => ({ file: 'f.tif', gradientProfile: p, gradientFit: lambdaEl === null ? null : { lambdaEl, amplitude: 1 }, eggLengthUm: null }) as unknown as EmbryoResult;

describe('meanScaledProfile', () => {
  it('scales each profile to [0, 1] and averages on the report grid', () => {
    const r = meanScaledProfile([res(prof([10, 0]), 0.2), res(prof([5, 3]), 0.3), res(null, null)]);
    expect(r?.embryoCount).toBe(2);
    expect(r?.xEl.length).toBe(101);
    expect([r?.mean[0], r?.mean[100]]).toEqual([1, 0]);
    expect(r?.mean[50]).toBeCloseTo(0.5, 12);
    expect([r?.sd[0], r?.sd[100]]).toEqual([0, 0]);
  });
  it('uses the sample SD (n − 1) across embryos, as the report', () => {
    // Source: worked by hand; sample SD of {1, 0} is √((0.25 + 0.25)/1) = √0.5 (a statistics text's n − 1 formula, from memory).
    const r = meanScaledProfile([res(prof([1, 0]), 0.2), res(prof([0, 1]), 0.3)]);
    // At x = 0 the scaled values are 1 and 0: mean 0.5, sample SD √(0.5) (population SD would be 0.5).
    expect(r?.mean[0]).toBe(0.5);
    expect(r?.sd[0]).toBeCloseTo(Math.SQRT1_2, 12);
  });
  it('returns null without profiles', () => expect(meanScaledProfile([res(null, null)])).toBeNull());
});

describe('lambdaValuesEl and lambdaSummaryEl', () => {
  it('collects fitted λ', () => expect(lambdaValuesEl([res(null, 0.2), res(null, null)])).toEqual([0.2]));
  it('summarises with the sample SD', () => {
    // Source: worked by hand: {0.2, 0.4}: mean 0.3, sample SD √0.02.
    const s = lambdaSummaryEl([res(null, 0.2), res(null, 0.4)]);
    expect(s.n).toBe(2);
    expect(s.mean).toBeCloseTo(0.3, 15);
    expect(s.sd).toBeCloseTo(Math.sqrt(0.02), 15);
  });
});
