import { describe, expect, it } from 'vitest';
import type { EmbryoResult, Profile } from '../../core/model';
import { lambdaValuesEl, meanScaledProfile } from './cohortSeries';

// Demo results, worked by hand.
const prof = (mean: number[]): Profile => ({ channel: 'g', xEl: Float64Array.from([0.25, 0.75]), xUm: new Float64Array(2), mean: Float64Array.from(mean), sd: new Float64Array(2), n: new Float64Array(2) });
const res = (p: Profile | null, lambdaEl: number | null) => ({ gradientProfile: p, gradientFit: lambdaEl === null ? null : { lambdaEl } }) as unknown as EmbryoResult;

describe('meanScaledProfile', () => {
  it('scales each profile to [0, 1] and averages', () => {
    const r = meanScaledProfile([res(prof([10, 0]), 0.2), res(prof([5, 3]), 0.3), res(null, null)]);
    expect(r?.count).toBe(2);
    expect(Array.from(r?.mean ?? [])).toEqual([1, 0]);
    expect(Array.from(r?.sd ?? [])).toEqual([0, 0]);
  });
  it('returns null without profiles', () => expect(meanScaledProfile([res(null, null)])).toBeNull());
});

describe('lambdaValuesEl', () => {
  it('collects fitted λ', () => expect(lambdaValuesEl([res(null, 0.2), res(null, null)])).toEqual([0.2]));
});
