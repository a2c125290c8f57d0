// The Time point panel's words: what a time point has of its own, and its time. Demo data (invented times).
import { describe, expect, it } from 'vitest';
import type { MovieView } from '../../core/contract';
import type { StackInfo } from '../../core/model';
import { ownFieldsText, shownTimeText } from './TimePointPanel';

describe('the Time point panel', () => {
  it('names the fields a time point has of its own', () => {
    expect(ownFieldsText({ axis: null })).toBe('axis');
    expect(ownFieldsText({ axis: null, fitRangeEl: [0.1, 0.5] })).toBe('axis and fit range');
    expect(ownFieldsText({ axis: null, landmarks: [], fitRangeEl: null })).toBe('axis, landmarks and fit range');
  });
  it('gives the time from the analysed movie, else from the file, in the unit of the movie\'s span; null when unknown', () => {
    const view = { timeIndices: [10, 11, 12], timesS: [600, 660, 720] } as unknown as MovieView;
    expect(shownTimeText(view, null, 11)).toBe('t = 660 s'); // a 120 s span is shown in seconds
    const info = { time: { timesS: Float64Array.from([100, 400, 700, 1000]), source: 'ome-plane' } } as unknown as StackInfo;
    expect(shownTimeText(null, info, 2)).toBe('t = 10 min'); // 600 s from the first time point; the movie spans 900 s
    expect(shownTimeText(view, info, 3)).toBe('t = 15 min'); // not analysed: the file's own times
    expect(shownTimeText(null, { time: { timesS: null, source: 'unknown' } } as unknown as StackInfo, 1)).toBeNull();
  });
});
