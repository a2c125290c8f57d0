// A movie's own time points and time step in the project file beat the run's (--time, --time-step). Demo data.
import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { DEFAULT_TIMELAPSE_OPTIONS, fileTimelapseOptions } from './timelapse-pass';

describe('fileTimelapseOptions', () => {
  const doc = (edits: object) => ({ schema: 'eggline-project' as const, version: 2 as const, folder: '/d', settings: DEFAULT_SETTINGS,
    files: { 'm.tif': { axis: null, landmarks: [], fitRangeEl: null, ...edits } } });
  const run = { ...DEFAULT_TIMELAPSE_OPTIONS, selection: { kind: 'one' as const, index: 3 }, timeStepS: 10 };
  it('takes the file\'s own values where the project gives them, the run\'s elsewhere', () => {
    expect(fileTimelapseOptions(null, 'm.tif', run)).toBe(run);
    expect(fileTimelapseOptions(doc({}), 'm.tif', run)).toBe(run);
    expect(fileTimelapseOptions(doc({ time: '5:9' }), 'm.tif', run)).toEqual({ ...run, selection: { kind: 'range', first: 5, last: 9 } });
    expect(fileTimelapseOptions(doc({ timeStepS: 30 }), 'm.tif', run)).toEqual({ ...run, timeStepS: 30 });
    expect(fileTimelapseOptions(doc({ time: 'all', timeStepS: 30 }), 'other.tif', run)).toBe(run);
  });
});
