import { describe, expect, it } from 'vitest';
import type { PixelArray, ProjectionMethod } from '../model';
import { createProjector, projectOnePlane } from './projector';

/** Seeded linear congruential generator (demo data). */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s / 4294967296; };
}

/** The bits of a Float32 plane, so −0 and +0 (and NaN patterns) count as different. */
const bits = (a: Float32Array): number[] => Array.from(new Uint32Array(a.buffer, a.byteOffset, a.length));

const METHODS: readonly ProjectionMethod[] = ['max', 'mean', 'sum', 'slice'];
const W = 37;
const H = 11;

/** Random planes of every sample type, floats with NaN, ±Infinity, −0 and values Float32 must round (demo data). */
function planesOfEveryType(seed: number): PixelArray[] {
  const r = lcg(seed);
  const n = W * H;
  const ints = (scale: number, offset: number) => Array.from({ length: n }, () => Math.floor(r() * scale) + offset);
  const floats = Array.from({ length: n }, () => {
    const u = r();
    if (u < 0.03) return NaN;
    if (u < 0.05) return -0;
    if (u < 0.06) return Infinity;
    if (u < 0.07) return -Infinity;
    return (r() - 0.3) * 1e5 + r() * 1e-3;
  });
  return [
    Uint8Array.from(ints(256, 0)), Int8Array.from(ints(256, -128)), Uint16Array.from(ints(65_536, 0)),
    Int16Array.from(ints(65_536, -32_768)), Uint32Array.from(ints(2 ** 32, 0)), Int32Array.from(ints(2 ** 32, -(2 ** 31))),
    Float32Array.from(floats), Float64Array.from(floats),
  ];
}

describe('projectOnePlane', () => {
  it('converts a 16-bit plane to floats (tiny known answer)', () => {
    // Source: hand-computed (demo data): the projection of one plane is that plane, for every method.
    for (const m of METHODS) {
      expect(Array.from(projectOnePlane({ width: 2, height: 2, data: new Uint16Array([1, 5, 3, 0]) }, m).data)).toEqual([1, 5, 3, 0]);
    }
  });

  it('keeps the accumulators\' marks on float samples: −0 → +0 in a mean, NaN → −Infinity in a maximum', () => {
    // Source: IEEE 754-2019 §6.3 (from memory): +0 + −0 = +0 in round-to-nearest; every comparison with NaN is false.
    const plane = { width: 3, height: 1, data: new Float32Array([-0, NaN, 2.5]) };
    expect(Object.is(projectOnePlane(plane, 'mean').data[0], 0)).toBe(true);
    expect(Object.is(projectOnePlane(plane, 'slice').data[0], -0)).toBe(true);
    expect(Array.from(projectOnePlane(plane, 'max').data)).toEqual([-0, -Infinity, 2.5]);
  });

  it('equals the projector after one plane, bit for bit, for every sample type and method', () => {
    // Source: the streaming projector (createProjector) as reference, on seeded random planes (demo data).
    for (const seed of [1, 2, 3]) {
      for (const data of planesOfEveryType(seed)) {
        for (const m of METHODS) {
          const p = createProjector(W, H, m);
          p.add({ width: W, height: H, data });
          expect(bits(projectOnePlane({ width: W, height: H, data }, m).data), `${data.constructor.name} ${m}`).toEqual(bits(p.result().data));
        }
      }
    }
  });

  it('writes into a given array, leaves its input alone, and rejects bad sizes and methods with exact messages', () => {
    const data = new Uint16Array([7, 8, 9, 10, 11, 12]);
    const out = new Float32Array(6);
    expect(projectOnePlane({ width: 3, height: 2, data }, 'mean', out).data).toBe(out);
    expect(Array.from(out)).toEqual([7, 8, 9, 10, 11, 12]);
    expect(Array.from(data)).toEqual([7, 8, 9, 10, 11, 12]);
    expect(() => projectOnePlane({ width: 4, height: 2, data }, 'max')).toThrow('plane is 4×2 but holds 6 values');
    expect(() => projectOnePlane({ width: 3, height: 2, data }, 'max', new Float32Array(5))).toThrow('output holds 5 values, the plane 6');
    expect(() => projectOnePlane({ width: 3, height: 2, data }, 'median' as never)).toThrow('unknown projection method "median" (use max, mean, sum or slice)');
  });
});
