// The Over time bar's line on which time points are analysed and where their times come from. Demo data.
import { describe, expect, it } from 'vitest';
import type { MovieView } from '../../../core/contract';
import type { StackInfo } from '../../../core/model';
import { timesLine, timeSourceText } from './TimelapseView';

const timed = { sizeT: 46, sizeZ: 24, isOme: true, time: { timesS: Float64Array.from({ length: 46 }, (_, t) => 240 * t), source: 'ome-increment' } } as unknown as StackInfo;
const untimed = { sizeT: 12, sizeZ: 1, isOme: true, time: { timesS: null, source: 'unknown' } } as unknown as StackInfo;

describe('the Over time bar', () => {
  it('says which time points are analysed, 0-based as --time, and where the times come from', () => {
    expect(timesLine(timed, null, { time: null, timeStepS: null })).toBe('All 46 time points; times from the file (OME TimeIncrement).');
    expect(timesLine(timed, null, { time: '10:25', timeStepS: null })).toBe('Time points 10 to 25 (0-based) of 46; times from the file (OME TimeIncrement).');
    expect(timesLine(timed, null, { time: '7', timeStepS: null })).toBe('Time point 7 (0-based) of 46; times from the file (OME TimeIncrement).');
    expect(timesLine(untimed, null, { time: null, timeStepS: null })).toBe('All 12 time points; times from nowhere: unknown (give a time step).');
    expect(timesLine(untimed, null, { time: null, timeStepS: 30 })).toBe('All 12 time points; times from you (the time step below), 30 s apart.');
    // After an analysis, the analysis says where its times came from.
    expect(timesLine(untimed, { sizeT: 12, timeSource: 'user' } as unknown as MovieView, { time: null, timeStepS: 30 })).toBe('All 12 time points; times from you (the time step below), 30 s apart.');
    expect(timeSourceText('imagej')).toBe('the file (ImageJ frame interval)');
  });

  it('says what is analysed when the movie ends before the chosen time points do, as the batch cuts them', () => {
    expect(timesLine(timed, null, { time: '50', timeStepS: null })).toBe('Time point 45 (0-based) of 46 (50 asked for, past the movie\'s end); times from the file (OME TimeIncrement).');
    expect(timesLine(timed, null, { time: '40:60', timeStepS: null })).toBe('Time points 40 to 45 (0-based) of 46 (40:60 asked for, past the movie\'s end); times from the file (OME TimeIncrement).');
    expect(timesLine(timed, null, { time: '45:60', timeStepS: null })).toBe('Time point 45 (0-based) of 46 (45:60 asked for, past the movie\'s end); times from the file (OME TimeIncrement).');
    expect(timesLine(untimed, null, { time: '20:30', timeStepS: 30 })).toBe('No time point (20:30 asked for lies past the movie\'s end, time points 0 to 11); times from you (the time step below), 30 s apart.');
    // The last time point itself is not past the end.
    expect(timesLine(timed, null, { time: '45', timeStepS: null })).toBe('Time point 45 (0-based) of 46; times from the file (OME TimeIncrement).');
  });
});
