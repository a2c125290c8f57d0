import { describe, expect, it } from 'vitest';
import type { Plane } from '../model';
import { sampleBilinear } from '../image';
import { straightenPlane } from './straighten';

const bilinearAt = (plane: Plane, x: number, y: number): number => sampleBilinear(plane, x, y, Number.NaN);

// Demo data: a 4×3 ramp image, value = 10·row + column (row-major), like an arange test image.
const ramp: Plane = { width: 4, height: 3, data: Float32Array.from([0, 1, 2, 3, 10, 11, 12, 13, 20, 21, 22, 23]) };

// Source: bilinear interpolation of a plane that is linear in x and y reproduces it exactly (from memory).
describe('sampleBilinear (the rule straightenPlane inlines)', () => {
  it('returns pixel values at centres and linear values between', () => {
    expect(bilinearAt(ramp, 2, 1)).toBe(12);
    expect(bilinearAt(ramp, 0.5, 0.5)).toBeCloseTo(5.5, 6);
    expect(bilinearAt(ramp, 3, 2)).toBe(23);
  });
  it('is NaN outside the pixel centres', () => {
    expect(bilinearAt(ramp, -0.1, 0)).toBeNaN();
    expect(bilinearAt(ramp, 0, 2.01)).toBeNaN();
  });
});

describe('straightenPlane', () => {
  it('samples a horizontal axis along row 1 with rows above (left of A→P) first', () => {
    const axis = { anterior: { x: 0, y: 1 }, posterior: { x: 3, y: 1 }, source: 'auto' as const };
    const s = straightenPlane(ramp, axis, 1, 4);
    expect(s.width).toBe(4);
    expect(s.height).toBe(3);
    // Row 0 is left of A→P (image up, row 0 of the ramp), row 2 is right (image row 2).
    expect(Array.from(s.data).map((v) => Math.round(v * 1e4) / 1e4)).toEqual([0, 1, 2, 3, 10, 11, 12, 13, 20, 21, 22, 23]);
  });
  it('reverses columns when the poles are swapped', () => {
    const axis = { anterior: { x: 3, y: 1 }, posterior: { x: 0, y: 1 }, source: 'hand' as const };
    const s = straightenPlane(ramp, axis, 0, 4);
    expect(Array.from(s.data)).toEqual([13, 12, 11, 10]);
  });
  it('rejects bad sizes with exact messages', () => {
    const axis = { anterior: { x: 0, y: 0 }, posterior: { x: 1, y: 0 }, source: 'auto' as const };
    expect(() => straightenPlane(ramp, axis, -1, 4)).toThrow('halfWidthPx must be an integer ≥ 0, got -1');
    expect(() => straightenPlane(ramp, axis, 1, 1)).toThrow('samplesAlong must be an integer ≥ 2, got 1');
  });
});

describe('straightenPlane with a row step', () => {
  it('spaces rows rowStepPx apart', () => {
    const axis = { anterior: { x: 0, y: 1 }, posterior: { x: 3, y: 1 }, source: 'auto' as const };
    const s = straightenPlane(ramp, axis, 1, 2, 0.5);
    // Rows at y = 0.5, 1, 1.5; columns at x = 0, 3.
    expect(Array.from(s.data).map((v) => Math.round(v * 1e4) / 1e4)).toEqual([5, 8, 10, 13, 15, 18]);
  });
});

describe('straightenPlane outside the image', () => {
  it('gives NaN by default and the chosen value when asked', () => {
    const axis = { anterior: { x: -1, y: 0 }, posterior: { x: 2, y: 0 }, source: 'auto' as const };
    expect(Array.from(straightenPlane(ramp, axis, 0, 4).data)).toEqual([NaN, 0, 1, 2]);
    expect(Array.from(straightenPlane(ramp, axis, 0, 4, 1, 0).data)).toEqual([0, 0, 1, 2]);
  });
});
