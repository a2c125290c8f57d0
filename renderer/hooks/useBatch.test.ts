import { describe, expect, it } from 'vitest';
import { applyProgress, sheetColumnsOf, sheetConditionsOf } from './useBatch';

// Demo progress events.
describe('applyProgress', () => {
  const s0 = { outDir: '/o', running: true, runId: null, done: 0, total: 0, files: [], summary: null, error: null, sheetConditions: [], sheetColumns: [], recomputing: false };
  it('records counts and replaces a file line by name', () => {
    const s1 = applyProgress(s0, { runId: 'r1', done: 0, total: 2, file: 'a.tif', status: 'running', message: null });
    const s2 = applyProgress(s1, { runId: 'r1', done: 1, total: 2, file: 'a.tif', status: 'error', message: 'a.tif: bad' });
    expect(s2.files).toEqual([{ file: 'a.tif', status: 'error', message: 'a.tif: bad' }]);
    expect([s2.runId, s2.done, s2.total]).toEqual(['r1', 1, 2]);
  });
  it('ignores file-less events for the list', () => {
    expect(applyProgress(s0, { runId: 'r', done: 2, total: 2, file: null, status: 'finished', message: null }).files).toEqual([]);
  });
});

describe('sheetConditionsOf', () => {
  const cohort = (names: string[], backgroundCondition: string | null) => ({ cohort: { conditions: names.map((name) => ({ name })), backgroundCondition } }) as unknown as Parameters<typeof sheetConditionsOf>[0];
  it('lists the compared conditions and the background condition last; keeps the previous list without a comparison', () => {
    expect(sheetConditionsOf(cohort(['wt', 'half'], 'null-stain'), [])).toEqual(['wt', 'half', 'null-stain']);
    expect(sheetConditionsOf(cohort(['wt'], null), ['x'])).toEqual(['wt']);
    expect(sheetConditionsOf(null, ['wt', 'half'])).toEqual(['wt', 'half']);
  });
  it('lists a condition set aside by the choice "none" last too, so it can be chosen again', () => {
    const aside = { cohort: { conditions: [{ name: 'wt' }], backgroundCondition: null, backgroundSetAside: 'null-stain' } } as unknown as Parameters<typeof sheetConditionsOf>[0];
    expect(sheetConditionsOf(aside, [])).toEqual(['wt', 'null-stain']);
  });
});

describe('sheetColumnsOf', () => {
  it('takes the compared sheet\'s free columns, keeps the previous ones when there is no comparison', () => {
    const withColumns = { cohort: { sheetColumns: ['stage', 'batch'] } } as unknown as Parameters<typeof sheetColumnsOf>[0];
    expect(sheetColumnsOf(withColumns, [])).toEqual(['stage', 'batch']);
    expect(sheetColumnsOf({ cohort: {} } as unknown as Parameters<typeof sheetColumnsOf>[0], ['x'])).toEqual([]);
    expect(sheetColumnsOf({ cohort: null } as unknown as Parameters<typeof sheetColumnsOf>[0], ['stage'])).toEqual(['stage']);
  });
});
