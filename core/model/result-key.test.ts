// The (file, time point) key of a result. All inputs are demo data.
import { describe, expect, it } from 'vitest';
import { errorResult } from './error-result';
import { parseResultKey, resultKey, resultKeyOf, resultTimeIndex, withTimePoint } from './result-key';

describe('result keys', () => {
  it('a result without a time point is time point 0', () => {
    const r = errorResult('a.tif', 'demo');
    expect(resultTimeIndex(r)).toBe(0);
    expect(resultKeyOf(r)).toBe(resultKey('a.tif', 0));
  });

  it('keys of different time points or files differ, and read back', () => {
    const keys = [resultKey('a.tif', 0), resultKey('a.tif', 1), resultKey('a.tif1', 0), resultKey('dir/a.tif', 10)];
    expect(new Set(keys).size).toBe(4);
    expect(keys.map(parseResultKey)).toEqual([
      { file: 'a.tif', tIndex: 0 }, { file: 'a.tif', tIndex: 1 }, { file: 'a.tif1', tIndex: 0 }, { file: 'dir/a.tif', tIndex: 10 },
    ]);
    expect(parseResultKey('a.tif')).toBeNull();
  });

  it('withTimePoint sets the time point and time, keeps the rest, and turns a non-finite time into null', () => {
    const r = withTimePoint(errorResult('m.tif', 'demo'), 4, 120);
    expect(r).toMatchObject({ file: 'm.tif', tIndex: 4, tS: 120, status: 'error' });
    expect(Object.keys(r).slice(0, 3)).toEqual(['file', 'tIndex', 'tS']);
    expect(withTimePoint(r, 2, Number.NaN)).toMatchObject({ tIndex: 2, tS: null });
  });
});
