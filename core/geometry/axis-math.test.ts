import { describe, expect, it } from 'vitest';
import type { ApAxis, ImagePoint } from '../model';
import { axisFraction, axisLeftNormal, distancePx, pointOnAxis } from './axis-math';

const ax = (anterior: ImagePoint, posterior: ImagePoint): ApAxis => ({ anterior, posterior, source: 'hand' });

// Source: worked by hand (vector projection onto a line).
describe('axisFraction', () => {
  const a = { x: 10, y: 0 };
  const p = { x: 30, y: 0 };
  it('is 0 at the anterior pole, 1 at the posterior pole, 0.25 a quarter along', () => {
    expect(axisFraction(ax(a, p), a)).toBe(0);
    expect(axisFraction(ax(a, p), p)).toBe(1);
    expect(axisFraction(ax(a, p), { x: 15, y: 7 })).toBe(0.25);
  });
  it('is not clamped outside the poles', () => {
    expect(axisFraction(ax(a, p), { x: 0, y: 0 })).toBe(-0.5);
  });
  it('is 0 for a zero-length axis', () => {
    expect(axisFraction(ax(a, a), p)).toBe(0);
  });
});

describe('pointOnAxis', () => {
  it('interpolates linearly', () => {
    expect(pointOnAxis(ax({ x: 0, y: 0 }, { x: 10, y: 20 }), 0.5)).toEqual({ x: 5, y: 10 });
  });
  it('gives the anterior pole for a zero-length axis (no throw while a handle is dragged onto the other)', () => {
    expect(pointOnAxis(ax({ x: 3, y: 4 }, { x: 3, y: 4 }), 0.7, 5)).toEqual({ x: 3, y: 4 });
  });
});

describe('axisLeftNormal', () => {
  it('points up (−y) for an axis running right in image coordinates', () => {
    const n = axisLeftNormal(ax({ x: 0, y: 0 }, { x: 5, y: 0 }));
    expect(n.x).toBeCloseTo(0, 12);
    expect(n.y).toBe(-1);
  });
});

describe('distancePx', () => {
  it('is the Euclidean distance (3-4-5 triangle)', () => {
    expect(distancePx({ x: 1, y: 1 }, { x: 4, y: 5 })).toBe(5);
  });
});
