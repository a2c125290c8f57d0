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

describe('createProjector accumulating in a lent array', () => {
  /** Seeded random plane of a given type (demo data). */
  function planeOf(Type: Uint8ArrayConstructor | Uint16ArrayConstructor | Int16ArrayConstructor | Float32ArrayConstructor, n: number, seed: number) {
    let s = seed;
    const d = new Type(n);
    for (let i = 0; i < n; i++) { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; d[i] = Type === Float32Array ? (s / 65536) - 30000.5 : s >>> 20; }
    return d;
  }

  it('gives the same projection as new arrays for every method, sample type and plane count, the lent array as output', () => {
    // Source: createProjector without a lent array is the reference (demo data: seeded random planes).
    const w = 9;
    const h = 5;
    for (const Type of [Uint8Array, Uint16Array, Int16Array, Float32Array]) {
      for (const method of ['mean', 'sum', 'max', 'slice'] as const) {
        for (const count of [1, 2, 4]) {
          const planes = Array.from({ length: count }, (_, k) => ({ width: w, height: h, data: planeOf(Type, w * h, 7 + k) }));
          const plain = createProjector(w, h, method);
          const lent = new Float32Array(w * h).fill(12345);
          const lending = createProjector(w, h, method, lent);
          for (const p of planes) { plain.add(p); lending.add(p); }
          const want = plain.result().data;
          const got = lending.result(lent).data;
          expect(got, `${Type.name} ${method} ×${count}`).toBe(lent);
          expect(Array.from(got), `${Type.name} ${method} ×${count}`).toEqual(Array.from(want));
        }
      }
    }
  });

  it('stays exact when a later plane needs a wider accumulator, and with another output array', () => {
    // Source: hand computation (as the mixed-type test above), then createProjector without a lent array.
    const lent = new Float32Array(2);
    const sum = createProjector(2, 1, 'sum', lent);
    sum.add({ width: 2, height: 1, data: Uint16Array.from([1, 65535]) });
    sum.add({ width: 2, height: 1, data: Uint16Array.from([65535, 65535]) });
    sum.add({ width: 2, height: 1, data: Float32Array.from([0.5, -1]) });
    expect(Array.from(sum.result(lent).data)).toEqual([65536.5, 131069]);
    const other = new Float32Array(2);
    const mean = createProjector(2, 1, 'mean', new Float32Array(2));
    for (const v of [1, 2, 4]) mean.add({ width: 2, height: 1, data: Uint8Array.from([v, 2 * v]) });
    expect(Array.from(mean.result(other).data)).toEqual([Math.fround(7 * (1 / 3)), Math.fround(14 * (1 / 3))]);
    // Another view of the lent bytes as output: the accumulator is copied before it is overwritten.
    const lent2 = new Float32Array(2);
    const mean2 = createProjector(2, 1, 'mean', lent2);
    for (const v of [1, 2, 4]) mean2.add({ width: 2, height: 1, data: Uint8Array.from([v, 2 * v]) });
    expect(Array.from(mean2.result(new Float32Array(lent2.buffer, 0, 2)).data)).toEqual([Math.fround(7 * (1 / 3)), Math.fround(14 * (1 / 3))]);
    // A new array when no output is given; the lent bytes are left as accumulated.
    const max = createProjector(2, 1, 'max', new Float32Array(2));
    max.add({ width: 2, height: 1, data: Uint16Array.from([3, 9]) });
    max.add({ width: 2, height: 1, data: Uint16Array.from([5, 1]) });
    expect(Array.from(max.result().data)).toEqual([5, 9]);
  });

  it('refuses a lent array of the wrong size, and more planes once written in place', () => {
    // Source: the projector's contract (demo data).
    expect(() => createProjector(2, 2, 'mean', new Float32Array(3))).toThrow(/output holds 3 values, the projection 4/);
    const lent = new Float32Array(2);
    const p = createProjector(2, 1, 'mean', lent);
    p.add({ width: 2, height: 1, data: Uint16Array.from([1, 2]) });
    p.add({ width: 2, height: 1, data: Uint16Array.from([3, 4]) });
    expect(Array.from(p.result(lent).data)).toEqual([2, 3]);
    expect(() => p.add({ width: 2, height: 1, data: Uint16Array.from([1, 2]) })).toThrow(/already written/);
  });
});
