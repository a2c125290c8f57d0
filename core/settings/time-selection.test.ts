import { describe, expect, it } from 'vitest';
import { checkTimeStepS, parseTimeSelection, parseTimeStepS, selectTimeIndices, timePointForFile, timeSelectionText } from './time-selection';

describe('parseTimeSelection / selectTimeIndices', () => {
  it('reads all, one time point and an inclusive range', () => {
    expect(selectTimeIndices(parseTimeSelection('all'), 3)).toEqual([0, 1, 2]);
    expect(selectTimeIndices(parseTimeSelection('2'), 5)).toEqual([2]);
    expect(selectTimeIndices(parseTimeSelection('1:3'), 5)).toEqual([1, 2, 3]);
    // A range past the end stops at the last time point.
    expect(selectTimeIndices(parseTimeSelection('3:9'), 5)).toEqual([3, 4]);
  });

  it('says why a selection picks nothing, and rejects bad text with a one-line message', () => {
    expect(selectTimeIndices(parseTimeSelection('7'), 5)).toBe('time point 7 is outside the movie (T = 5, time points 0 to 4)');
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
