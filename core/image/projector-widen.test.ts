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

describe('createProjector, first plane copied in natively', () => {
  it('gives the plain loops\' projection bit for bit for every integer sample type and method (random planes)', () => {
    // Source: the plain per-pixel loops below are the reference (sum from 0, maximum from −Infinity, the last plane
    // for a slice, the mean as the sum times 1/count rounded to Float32); demo data: seeded random samples.
    let s = 99;
    const rnd = () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s / 4294967296; };
    const types = [
      [Uint8Array, 0, 255], [Uint16Array, 0, 65535], [Int8Array, -128, 127], [Int16Array, -32768, 32767],
      [Uint32Array, 0, 4294967295], [Int32Array, -2147483648, 2147483647],
    ] as const;
    const w = 13;
    const h = 7;
    for (const [Type, lo, hi] of types) {
      for (const method of ['mean', 'sum', 'max', 'slice'] as const) {
        for (const count of [1, 2, 5]) {
          const planes = Array.from({ length: count }, () => {
            const d = new Type(w * h);
            for (let i = 0; i < d.length; i++) d[i] = Math.floor(lo + rnd() * (hi - lo + 1));
            return d;
          });
          const p = createProjector(w, h, method);
          for (const data of planes) p.add({ width: w, height: h, data });
          const ref = new Float64Array(w * h).fill(method === 'max' ? -Infinity : 0);
          for (const d of planes) {
            for (let i = 0; i < w * h; i++) {
              if (method === 'max') ref[i] = Math.max(ref[i], d[i]);
              else if (method === 'slice') ref[i] = d[i];
              else ref[i] += d[i];
            }
          }
          const want = Float32Array.from(ref, (v) => (method === 'mean' && count > 1 ? v * (1 / count) : v));
          expect(Array.from(p.result().data), `${Type.name} ${method} ×${count}`).toEqual(Array.from(want));
          expect(p.count).toBe(count);
        }
      }
    }
  });
});
