// The window's results keyed by (file, time point). All inputs are demo data.
import { describe, expect, it } from 'vitest';
import { errorResult, type EmbryoResult } from '../../core/model';
import { fileResult, indexResults, resultAt, timePointsOf } from './results';
import { initialState } from './initial';
import { editorReducer as reduce } from './reducer';

const at = (file: string, tIndex?: number): EmbryoResult => ({ ...errorResult(file, 'demo'), ...(tIndex === undefined ? {} : { tIndex }) });

describe('results keyed by (file, time point)', () => {
  const movie = [at('movie.tif', 2), at('movie.tif', 0), at('movie.tif', 1)];
  const index = indexResults([at('single.tif'), ...movie]);

  it('finds a result without a time point at t = 0 (a file with one time point)', () => {
    expect(resultAt(index, 'single.tif')?.file).toBe('single.tif');
    expect(resultAt(index, 'single.tif', 0)?.file).toBe('single.tif');
    expect(resultAt(index, 'single.tif', 1)).toBeUndefined();
  });

  it('keeps one result per time point of a movie, and lists its time points in order', () => {
    expect(index.size).toBe(4);
    expect(resultAt(index, 'movie.tif', 1)).toBe(movie[2]);
    expect(timePointsOf(index, 'movie.tif')).toEqual([0, 1, 2]);
    expect(timePointsOf(index, 'absent.tif')).toEqual([]);
  });

  it('shows the shown time point of a file, else its earliest', () => {
    expect(fileResult(index, 'movie.tif')).toBe(movie[1]);
    expect(fileResult(index, 'movie.tif', 2)).toBe(movie[0]);
    const later = indexResults([at('late.tif', 5), at('late.tif', 7)]);
    expect(fileResult(later, 'late.tif')?.tIndex).toBe(5);
    expect(fileResult(later, 'none.tif')).toBeUndefined();
  });

  it('a repeated key keeps the later result', () => {
    const again = at('movie.tif', 1);
    expect(resultAt(indexResults([...movie, again]), 'movie.tif', 1)).toBe(again);
  });
});

describe('showTimePoint', () => {
  const opened = reduce(initialState(), { type: 'selectFile', key: 'movie.tif', autoAxis: null });

  it('starts at t = 0 and moves to another whole time point without touching the document or history', () => {
    expect(opened.shownTimeIndex).toBe(0);
    const s = reduce(opened, { type: 'showTimePoint', tIndex: 3 });
    expect(s.shownTimeIndex).toBe(3);
    expect(s.doc).toBe(opened.doc);
    expect(s.past).toEqual([]);
    expect(s.revision).toBe(opened.revision);
  });

  it('ignores a negative or fractional time point', () => {
    expect(reduce(opened, { type: 'showTimePoint', tIndex: -1 })).toBe(opened);
    expect(reduce(opened, { type: 'showTimePoint', tIndex: 1.5 })).toBe(opened);
  });

  it('keeps the time point when the same file is selected again (its stack reloaded), resets it for another file', () => {
    const s = reduce(opened, { type: 'showTimePoint', tIndex: 3 });
    expect(reduce(s, { type: 'selectFile', key: 'movie.tif', autoAxis: null }).shownTimeIndex).toBe(3);
    expect(reduce(s, { type: 'selectFile', key: 'other.tif', autoAxis: null }).shownTimeIndex).toBe(0);
  });
});
