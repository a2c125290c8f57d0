import { describe, expect, it } from 'vitest';
import { applyProgress } from './useBatch';

// Demo progress events.
describe('applyProgress', () => {
  const s0 = { outDir: '/o', running: true, runId: null, done: 0, total: 0, files: [], summary: null, error: null };
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
