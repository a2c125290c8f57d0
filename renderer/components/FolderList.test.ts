import { describe, expect, it } from 'vitest';
import { entryStatus } from './FolderList';

// Demo entries.
describe('entryStatus', () => {
  const e = { path: '/d/a.tif', name: 'a.tif', status: 'analysed' as const, message: null };
  it('shows edited when the project holds edits', () => expect(entryStatus(e, true)).toBe('edited'));
  it('keeps the stored status otherwise', () => expect(entryStatus(e, false)).toBe('analysed'));
  it('keeps error even with edits', () => expect(entryStatus({ ...e, status: 'error' }, true)).toBe('error'));
  it('shows the last batch: analysed when ok, error when it failed', () => {
    expect(entryStatus({ ...e, status: 'new' }, false, 'ok')).toBe('analysed');
    expect(entryStatus({ ...e, status: 'new' }, true, 'error')).toBe('error');
    expect(entryStatus({ ...e, status: 'new' }, true, 'ok')).toBe('edited');
  });
});
