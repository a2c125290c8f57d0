import { describe, expect, it } from 'vitest';
import { checkTimeStepS, parseTimeSelection, parseTimeStepS, selectTimeIndices, timePointForFile, timePointsForMovie, timeSelectionText } from './time-selection';

describe('parseTimeSelection / selectTimeIndices', () => {
  it('reads all, one time point and an inclusive range', () => {
    expect(selectTimeIndices(parseTimeSelection('all'), 3)).toEqual([0, 1, 2]);
    expect(selectTimeIndices(parseTimeSelection('2'), 5)).toEqual([2]);
    expect(selectTimeIndices(parseTimeSelection('1:3'), 5)).toEqual([1, 2, 3]);
    // A range past the end stops at the last time point.
    expect(selectTimeIndices(parseTimeSelection('3:9'), 5)).toEqual([3, 4]);
  });

  it('takes the last time point for a single one past the end, picks none for a range wholly past it, and rejects bad text with a one-line message', () => {
    expect(selectTimeIndices(parseTimeSelection('7'), 5)).toEqual([4]);
    expect(selectTimeIndices(parseTimeSelection('5:9'), 5)).toEqual([]);
    expect(selectTimeIndices(parseTimeSelection('4:9'), 5)).toEqual([4]);
    expect(selectTimeIndices(parseTimeSelection('all'), 0)).toEqual([]);
    expect(() => parseTimeSelection('4:2')).toThrow('--time must be all, a time point K or a range A:B (0-based, A ≤ B), got "4:2"');
    expect(() => parseTimeSelection('-1')).toThrow(/got "-1"/);
  });

  it('writes a selection back as the flag\'s text', () => {
    for (const t of ['all', '7', '3:9']) expect(timeSelectionText(parseTimeSelection(t))).toBe(t);
  });

  it('reads a time step in seconds and refuses what is not a positive number, with the flag\'s message', () => {
    expect(parseTimeStepS('30')).toBe(30);
    expect(parseTimeStepS(' 2.5 ')).toBe(2.5);
    expect(checkTimeStepS(0.5)).toBe(0.5);
    for (const bad of ['0', '-3', 'abc', '', 'Infinity']) expect(() => parseTimeStepS(bad)).toThrow(`--time-step must be a positive number of seconds (got "${bad}")`);
    expect(() => checkTimeStepS(NaN, 'time step')).toThrow('time step must be a positive number of seconds (got "NaN")');
  });
});

describe('timePointsForMovie', () => {
  // Known answers (demo data): one --time over movies of 4 and 46 time points; each movie analysed over what it has.
  it('keeps what the movie has, with no warning', () => {
    expect(timePointsForMovie(parseTimeSelection('all'), 4, 'a.tif')).toEqual({ tIndices: [0, 1, 2, 3], warning: null });
    expect(timePointsForMovie(parseTimeSelection('3'), 4, 'a.tif')).toEqual({ tIndices: [3], warning: null });
    expect(timePointsForMovie(parseTimeSelection('1:3'), 4, 'a.tif')).toEqual({ tIndices: [1, 2, 3], warning: null });
    expect(timePointsForMovie(parseTimeSelection('10:25'), 46, 'long.ome.tif')).toEqual({ tIndices: Array.from({ length: 16 }, (_, i) => 10 + i), warning: null });
  });

  it('analyses a single time point past the end at the last one, naming the file, the asked and the analysed time point', () => {
    expect(timePointsForMovie(parseTimeSelection('50'), 4, 'short/m.tif')).toEqual({
      tIndices: [3], warning: 'short/m.tif: time point 50 asked for (--time, 0-based), but the movie has 4 time points (0 to 3); time point 3 was analysed',
    });
    expect(timePointsForMovie(parseTimeSelection('4'), 4, 'm.tif').tIndices).toEqual([3]);
  });

  it('cuts a range at the movie\'s last time point, with the asked and the analysed range', () => {
    expect(timePointsForMovie(parseTimeSelection('2:50'), 4, 'm.tif')).toEqual({
      tIndices: [2, 3], warning: 'm.tif: time points 2:50 asked for (--time, 0-based), but the movie has 4 time points (0 to 3); time points 2 to 3 were analysed',
    });
    expect(timePointsForMovie(parseTimeSelection('3:50'), 4, 'm.tif').warning).toBe(
      'm.tif: time points 3:50 asked for (--time, 0-based), but the movie has 4 time points (0 to 3); time point 3 was analysed');
    // A range ending exactly at the last time point is not cut.
    expect(timePointsForMovie(parseTimeSelection('2:3'), 4, 'm.tif').warning).toBeNull();
  });

  it('gives a range wholly past the end no time points, and says so; names where the selection came from', () => {
    expect(timePointsForMovie(parseTimeSelection('10:20'), 4, 'm.tif')).toEqual({
      tIndices: [], warning: 'm.tif: time points 10:20 asked for (--time, 0-based), but the movie has 4 time points (0 to 3); no time point was analysed over time',
    });
    expect(timePointsForMovie(parseTimeSelection('4:4'), 4, 'm.tif').tIndices).toEqual([]);
    expect(timePointsForMovie(parseTimeSelection('9'), 4, 'm.tif', 'the project\'s time for this file').warning).toBe(
      'm.tif: time point 9 asked for (the project\'s time for this file, 0-based), but the movie has 4 time points (0 to 3); time point 3 was analysed');
  });
});

describe('timePointForFile', () => {
  // Known answers (demo data): the asked time point when the file has it, else the file's last, with one line.
  it('keeps the asked time point when the file has it, with no warning', () => {
    expect(timePointForFile(0, 1, 'a.tif')).toEqual({ tIndex: 0, warning: null });
    expect(timePointForFile(5, 46, 'm.ome.tif')).toEqual({ tIndex: 5, warning: null });
    expect(timePointForFile(45, 46, 'm.ome.tif')).toEqual({ tIndex: 45, warning: null });
  });

  it('takes the only time point of a single stack and the last of a shorter movie, naming the file, the asked and the used time point', () => {
    expect(timePointForFile(5, 1, 'single/a.tif')).toEqual({
      tIndex: 0, warning: 'single/a.tif: time point 5 asked for (--time-index, 0-based), but the file has one time point; time point 0 was analysed',
    });
    expect(timePointForFile(5, 3, 'short.tif')).toEqual({
      tIndex: 2, warning: 'short.tif: time point 5 asked for (--time-index, 0-based), but the file has 3 time points (0 to 2); time point 2 was analysed',
    });
    expect(timePointForFile(3, 3, 'short.tif').tIndex).toBe(2);
  });

  it('leaves a file without time points to the analysis, which refuses it', () => {
    expect(timePointForFile(2, 0, 'empty.tif')).toEqual({ tIndex: 2, warning: null });
  });
});
