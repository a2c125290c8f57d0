import { describe, expect, it } from 'vitest';
import { flattenRecord } from './flatten-record';

describe('flattenRecord', () => {
  it('dotted keys, joined plain arrays, counted object arrays', () => {
    // Source: demo data (a run record shaped like run.json)
    const rows = flattenRecord({ software: { eggline: '0.1.0' }, settings: { fitRangeEl: [0.1, 0.6], pixelSizeUm: null, profile: {} }, inputs: [{ file: 'a' }, { file: 'b' }], ok: 2 });
    expect(rows).toEqual([
      ['software.eggline', '0.1.0'], ['settings.fitRangeEl', '0.1, 0.6'], ['settings.pixelSizeUm', '—'], ['settings.profile', '(empty)'],
      ['inputs', '2 entries (see the full record)'], ['ok', '2'],
    ]);
  });
  it('stops at maxRows', () => {
    // Source: demo data
    expect(flattenRecord({ a: 1, b: 2, c: 3 }, '', 2).length).toBe(2);
  });
});
