import { describe, expect, it } from 'vitest';
import type { MovieView } from '../../../core/contract';
import type { EmbryoResult, Profile } from '../../../core/model';
import { earlierIndices, movieIntensityRange, timeLabel } from './movieFigures';

// Source: demo data (invented profiles and times); expected values worked out by hand.
const profile = (mean: number[], sd: number[]): Profile => ({ channel: 'g', xEl: Float64Array.from(mean, (_, i) => i / 2), xUm: Float64Array.from(mean, (_, i) => i * 50), mean: Float64Array.from(mean), sd: Float64Array.from(sd), n: Uint32Array.from(mean, () => 9) } as unknown as Profile);
const view = (timesS: number[] | null, profiles: (Profile | null)[]): MovieView => ({
  file: 'm.ome.tif', sizeT: 46, timeIndices: profiles.map((_, i) => i), timesS,
  results: profiles.map((p) => ({ gradientProfile: p }) as unknown as EmbryoResult),
}) as unknown as MovieView;

describe('the time-lapse view\'s figure helpers', () => {
  it('picks up to ten earlier time points, evenly spread, always the one just before', () => {
    expect(earlierIndices(0)).toEqual([]);
    expect(earlierIndices(3)).toEqual([0, 1, 2]);
    expect(earlierIndices(10)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
    // k = 21: round(i·20/10) for i = 1 … 10.
    expect(earlierIndices(21)).toEqual([2, 4, 6, 8, 10, 12, 14, 16, 18, 20]);
  });
  it('gives one intensity range for the movie: from min(0, lowest mean) to the highest mean + SD', () => {
    expect(movieIntensityRange(view(null, [profile([1, 2, 3], [0.5, 0.5, 0.5]), profile([-1, 8, 2], [1, 1, NaN]), null]))).toEqual([-1, 9]);
    expect(movieIntensityRange(view(null, [null]))).toEqual([0, 1]);
  });
  it('labels the time in minutes from 10 min on, with the time point counted from 1', () => {
    const all = (v: MovieView): MovieView => ({ ...v, sizeT: v.timeIndices.length });
    expect(timeLabel(all(view([0, 300, 600], [null, null, null])), 1)).toBe('t = 5 min · time point 2 of 3'); // the movie spans 10 min
    expect(timeLabel(all(view([0, 30, 60], [null, null, null])), 1)).toBe('t = 30 s · time point 2 of 3');
    expect(timeLabel(all(view(null, [null, null])), 1)).toBe('time point 2 of 2 · times unknown');
  });
  it('says which of the analysed time points is shown when only some of the movie\'s were analysed', () => {
    const part = { ...view([600, 660, 720], [null, null, null]), timeIndices: [10, 11, 12] };
    expect(timeLabel(part, 2)).toBe('t = 720 s · time point 13 of 46 (3 of 3 analysed)');
    expect(timeLabel(part, 2, false)).toBe('t = 720 s · time point 13 of 46');
  });
});
