import { describe, expect, it } from 'vitest';
import { createProjector } from './projector';

// Source: hand-computed tiny planes (demo data).
const a = { width: 2, height: 2, data: new Uint16Array([1, 5, 3, 0]) };
const b = { width: 2, height: 2, data: new Uint16Array([4, 2, 3, 1]) };

describe('createProjector', () => {
  it.each([
    ['max', [4, 5, 3, 1]],
    ['mean', [2.5, 3.5, 3, 0.5]],
    ['sum', [5, 7, 6, 1]],
    ['slice', [4, 2, 3, 1]],
  ] as const)('%s projection of two planes', (method, expected) => {
    const p = createProjector(2, 2, method);
    p.add(a);
    p.add(b);
    expect(Array.from(p.result().data)).toEqual(expected);
    expect(p.count).toBe(2);
  });

  it('does not change its input planes', () => {
    const p = createProjector(2, 2, 'sum');
    p.add(a);
    p.add(a);
    expect(Array.from(a.data)).toEqual([1, 5, 3, 0]);
  });

  it('rejects bad options and planes with exact messages', () => {
    expect(() => createProjector(0, 2, 'max')).toThrow('projector size must be positive integers, got 0×2');
    expect(() => createProjector(2, 2, 'median' as never)).toThrow('unknown projection method "median" (use max, mean, sum or slice)');
    const p = createProjector(3, 2, 'max');
    expect(() => p.add(a)).toThrow('plane is 2×2 but the projection is 3×2');
    expect(() => p.result()).toThrow('no planes were added to the projection');
  });
});
