import { describe, expect, it } from 'vitest';
import { assignAxisRoles, impliedAxes } from './axes';
import type { NgffAxis } from './ngff';

const ax = (name: string, type: string | null = null): NgffAxis => ({ name, type, unit: null });
const space = (name: string) => ax(name, 'space');

describe('assignAxisRoles', () => {
  it('maps the NGFF 0.4 example order (t, c, z, y, x)', () => {
    // Source: NGFF 0.4 specification §axes — "t", "c", then space axes "z", "y", "x".
    expect(assignAxisRoles([ax('t', 'time'), ax('c', 'channel'), space('z'), space('y'), space('x')], [2, 3, 4, 5, 6], 'a'))
      .toEqual({ t: 0, c: 1, z: 2, y: 3, x: 4 });
  });

  it('maps every subset NGFF allows, from 2 to 5 dimensions', () => {
    expect(assignAxisRoles([space('y'), space('x')], [5, 6], 'a')).toEqual({ x: 1, y: 0, z: -1, c: -1, t: -1 });
    expect(assignAxisRoles([ax('c', 'channel'), space('y'), space('x')], [2, 5, 6], 'a')).toEqual({ x: 2, y: 1, z: -1, c: 0, t: -1 });
    expect(assignAxisRoles([ax('t', 'time'), space('z'), space('y'), space('x')], [2, 3, 5, 6], 'a')).toEqual({ x: 3, y: 2, z: 1, c: -1, t: 0 });
    expect(assignAxisRoles([ax('t', 'time'), ax('c', 'channel'), space('y'), space('x')], [2, 3, 5, 6], 'a')).toEqual({ x: 3, y: 2, z: -1, c: 1, t: 0 });
  });

  it('maps axes in other orders by type and name (demo data)', () => {
    expect(assignAxisRoles([space('z'), space('y'), space('x'), ax('c', 'channel')], [3, 5, 6, 2], 'a')).toEqual({ x: 2, y: 1, z: 0, c: 3, t: -1 });
    expect(assignAxisRoles([space('x'), space('y')], [6, 5], 'a')).toEqual({ x: 0, y: 1, z: -1, c: -1, t: -1 });
    // Untyped axes (NGFF 0.3 names) by name; space axes with other names by position (last is x).
    expect(assignAxisRoles([ax('c'), ax('z'), ax('y'), ax('x')], [2, 3, 5, 6], 'a')).toEqual({ x: 3, y: 2, z: 1, c: 0, t: -1 });
    expect(assignAxisRoles([space('depth'), space('row'), space('col')], [3, 5, 6], 'a')).toEqual({ x: 2, y: 1, z: 0, c: -1, t: -1 });
  });

  it('ignores a custom axis of size 1 and refuses one with more entries', () => {
    // Source: NGFF 0.4 specification, examples/valid/custom_type_axes.json — axes may have other types.
    expect(assignAxisRoles([ax('angle', 'custom'), space('y'), space('x')], [1, 5, 6], 'a')).toEqual({ x: 2, y: 1, z: -1, c: -1, t: -1 });
    expect(() => assignAxisRoles([ax('angle', 'custom'), space('y'), space('x')], [4, 5, 6], 'a.zarr'))
      .toThrow('a.zarr: axis "angle" (type custom) has 4 entries; only space, channel and time axes are read');
  });

  it('refuses what does not fit a 2–5-dimensional image with one line', () => {
    expect(() => assignAxisRoles([space('x')], [5], 'a')).toThrow('a: the image has 1 dimensions; Eggline reads 2 to 5 (x, y and optionally z, channel, time)');
    expect(() => assignAxisRoles([space('y'), space('x')], [1, 5, 6], 'a')).toThrow('a: NGFF declares 2 axes but the array has 3 dimensions');
    expect(() => assignAxisRoles([ax('c', 'channel'), ax('d', 'channel'), space('y'), space('x')], [2, 2, 5, 6], 'a')).toThrow('a: has more than one channel axis');
    expect(() => assignAxisRoles([ax('c', 'channel'), space('x')], [2, 6], 'a')).toThrow('a: has 1 space axis; Eggline needs y and x');
  });
});

describe('impliedAxes', () => {
  it('gives the trailing names of (t, c, z, y, x), as NGFF 0.1/0.2 stored them', () => {
    // Source: NGFF 0.2 specification — images are 5-D (t, c, z, y, x).
    expect(impliedAxes(5).map((a) => a.name)).toEqual(['t', 'c', 'z', 'y', 'x']);
    expect(impliedAxes(3).map((a) => a.name)).toEqual(['z', 'y', 'x']);
  });
});
