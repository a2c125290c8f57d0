import { describe, expect, it } from 'vitest';
import { indexRuns } from './prepare';

describe('indexRuns', () => {
  it('splits an ascending index list into stretches of consecutive pixels', () => {
    // Source: hand arithmetic — 3, 4, 5 | 9 | 11, 12 → [3, 6), [9, 10), [11, 13).
    const runs = indexRuns(Int32Array.from([3, 4, 5, 9, 11, 12]));
    expect(Array.from(runs.start)).toEqual([3, 9, 11]);
    expect(Array.from(runs.end)).toEqual([6, 10, 13]);
    expect(indexRuns(new Int32Array(0)).start.length).toBe(0);
    expect(Array.from(indexRuns(Int32Array.from([7])).end)).toEqual([8]);
  });
});
