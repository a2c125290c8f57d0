import { describe, expect, it } from 'vitest';
import { labelComponents, largestComponent } from './components';
import { fillHoles } from './fill-holes';
import { distanceInside, squaredDistanceToFeatures } from './distance';
import { dilate, erode } from './morphology';

const mask = (width: number, rows: string[]) => ({
  width, height: rows.length, data: Uint8Array.from(rows.join('').split(''), (c) => (c === '#' ? 1 : 0)),
});
const rowsOf = (m: { width: number; data: Uint8Array }) => {
  const out: string[] = [];
  for (let i = 0; i < m.data.length; i += m.width) out.push(Array.from(m.data.subarray(i, i + m.width), (v) => (v ? '#' : '.')).join(''));
  return out;
};

describe('components', () => {
  it('labels 8-connected regions (diagonals join)', () => {
    // Source: hand labelling (demo data).
    const m = mask(5, ['##...', '..#..', '....#', '#...#']);
    const { labels, count, sizes } = labelComponents(m);
    expect(count).toBe(3);
    expect(Array.from(labels)).toEqual([1, 1, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0, 2, 3, 0, 0, 0, 2]);
    expect(sizes.slice(1)).toEqual([3, 2, 1]);
  });

  it('keeps the largest region', () => {
    expect(rowsOf(largestComponent(mask(5, ['##..#', '##...', '....#'])))).toEqual(['##...', '##...', '.....']);
    expect(rowsOf(largestComponent(mask(2, ['..'])))).toEqual(['..']);
  });
});

describe('fillHoles', () => {
  it('fills enclosed background but not background reaching the border', () => {
    // Source: hand computation (demo data).
    expect(rowsOf(fillHoles(mask(6, ['......', '.###..', '.#.#..', '.###.#', '....#.'])))).toEqual(['......', '.###..', '.###..', '.###.#', '....#.']);
    expect(rowsOf(fillHoles(mask(3, ['#.#', '#.#', '###'])))).toEqual(['#.#', '#.#', '###']);
  });
});

describe('distance transform', () => {
  it('gives exact squared distances to one feature', () => {
    // Source: definition of the Euclidean distance, (x − 2)² + (y − 1)².
    const d = squaredDistanceToFeatures(mask(4, ['....', '..#.', '....']));
    expect(Array.from(d)).toEqual([5, 2, 1, 2, 4, 1, 0, 1, 5, 2, 1, 2]);
  });

  it('gives exact distances to the nearest of several features', () => {
    // Source: hand computation, the smaller of the squared distances to (0,0) and to (4,2).
    const d = squaredDistanceToFeatures(mask(5, ['#....', '.....', '....#']));
    expect(Array.from(d)).toEqual([0, 1, 4, 9, 16, 1, 2, 5, 2, 1, 4, 5, 4, 1, 0].map((v, i) => Math.min(v, [20, 13, 8, 5, 4, 17, 10, 5, 2, 1, 16, 9, 4, 1, 0][i])));
  });

  it('measures depth inside a mask, the image border counting as outside', () => {
    // Source: hand computation (nearest background centre).
    expect(Array.from(distanceInside(mask(5, ['.....', '.###.', '.###.', '.###.', '.....'])))).toEqual([
      0, 0, 0, 0, 0, 0, 1, 1, 1, 0, 0, 1, 2, 1, 0, 0, 1, 1, 1, 0, 0, 0, 0, 0, 0]);
    expect(Array.from(distanceInside(mask(3, ['###'])))).toEqual([1, 1, 1]);
    expect(Array.from(distanceInside(mask(5, ['#####', '#####', '#####'])))).toEqual([1, 1, 1, 1, 1, 1, 2, 2, 2, 1, 1, 1, 1, 1, 1]);
  });
});

describe('morphology', () => {
  it('dilates with a Euclidean disk', () => {
    // Source: hand computation; radius 1 reaches the 4 neighbours, 1.5 also the diagonals (√2).
    const one = mask(5, ['.....', '.....', '..#..', '.....', '.....']);
    expect(rowsOf(dilate(one, 1))).toEqual(['.....', '..#..', '.###.', '..#..', '.....']);
    expect(rowsOf(dilate(one, 1.5))).toEqual(['.....', '.###.', '.###.', '.###.', '.....']);
  });

  it('erodes with a Euclidean disk', () => {
    expect(rowsOf(erode(mask(5, ['.....', '.###.', '.###.', '.###.', '.....']), 1))).toEqual(['.....', '.....', '..#..', '.....', '.....']);
  });
});

describe('opening', () => {
  it('with radius 1.5 removes one-pixel spurs and keeps 3×3 blocks (same as the Euclidean disk)', async () => {
    const { open } = await import('./morphology');
    const m = mask(7, ['.......', '.###...', '.####..', '.###.#.', '.......']);
    expect(rowsOf(open(m, 1.5))).toEqual(['.......', '.###...', '.###...', '.###...', '.......']);
    expect(rowsOf(open(m, 1.5))).toEqual(rowsOf(dilate(erode(m, 1.5), 1.5)));
  });
});
