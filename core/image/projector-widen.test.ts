import { describe, expect, it } from 'vitest';
import { createProjector } from './projector';

describe('createProjector with mixed pixel types', () => {
  it('stays exact when a later plane needs a wider accumulator', () => {
    // Source: hand computation.
    const sum = createProjector(2, 1, 'sum');
    sum.add({ width: 2, height: 1, data: Uint16Array.from([1, 65535]) });
    sum.add({ width: 2, height: 1, data: Uint16Array.from([65535, 65535]) });
    sum.add({ width: 2, height: 1, data: Float32Array.from([0.5, -1]) });
    expect(Array.from(sum.result().data)).toEqual([65536.5, 131069]);
    const max = createProjector(2, 1, 'max');
    max.add({ width: 2, height: 1, data: Uint16Array.from([7, 65535]) });
    max.add({ width: 2, height: 1, data: Int32Array.from([70000, -5]) });
    expect(Array.from(max.result().data)).toEqual([70000, 65535]);
    const mean = createProjector(1, 1, 'mean');
    for (const v of [1, 2, 4]) mean.add({ width: 1, height: 1, data: Uint8Array.from([v]) });
    expect(mean.result().data[0]).toBeCloseTo(7 / 3, 6);
  });
});
