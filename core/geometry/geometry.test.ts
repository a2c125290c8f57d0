import { describe, expect, it } from 'vitest';
import type { ApAxis } from '../model';
import { axisFrame, pointOnAxis, projectPointOntoAxis } from './axis-math';
import { principalAxis } from './principal-axis';
import { cellSegments, maskContours, maskOutline, type Segment } from './outline';
import { createRng } from '../stats';
import { polesFromOutline } from './poles';
import { straightenPlane } from './straighten';
import { chooseAnterior } from './orientation';

const mask = (width: number, rows: string[]) => ({
  width, height: rows.length, data: Uint8Array.from(rows.join('').split(''), (c) => (c === '#' ? 1 : 0)),
});
const axis = (ax: number, ay: number, px: number, py: number): ApAxis => ({ anterior: { x: ax, y: ay }, posterior: { x: px, y: py }, source: 'hand' });

describe('projectPointOntoAxis', () => {
  it('gives x/EL, µm and the signed off-axis distance (left of A→P positive, y down)', () => {
    // Source: hand computation; heading +x, "left" is up (smaller y).
    const p = projectPointOntoAxis({ x: 15, y: 7 }, axis(10, 10, 20, 10), 2);
    expect(p).toEqual({ xEl: 0.5, xPx: 5, xUm: 10, offAxisPx: 3, offAxisUm: 6 });
    const q = projectPointOntoAxis({ x: 13, y: 14 }, axis(10, 10, 10, 20), null);
    expect([q.xEl, q.xPx, q.offAxisPx]).toEqual([0.4, 4, 3]); // heading +y (down): left is +x
    expect(Number.isNaN(q.xUm)).toBe(true);
  });

  it('round-trips with pointOnAxis and rejects a zero-length axis', () => {
    const a = axis(3, 4, 30, 40);
    const pt = pointOnAxis(a, 0.3, -5);
    const back = projectPointOntoAxis(pt, a, 1);
    expect(back.xEl).toBeCloseTo(0.3, 12);
    expect(back.offAxisPx).toBeCloseTo(-5, 12);
    expect(() => axisFrame(axis(1, 1, 1, 1))).toThrow('the AP axis has zero length (anterior and posterior are the same point)');
  });
});

describe('principalAxis', () => {
  it('finds centroid, direction and spreads of a bar', () => {
    // Source: hand computation; x = 1..7 → mean 4, variance 28/7 = 4.
    const pa = principalAxis(mask(9, ['.........', '.#######.', '.........']));
    expect(pa.centroid).toEqual({ x: 4, y: 1 });
    expect(Math.abs(pa.ux)).toBeCloseTo(1, 12);
    expect(pa.majorSdPx).toBeCloseTo(2, 12);
    expect(pa.minorSdPx).toBeCloseTo(0, 12);
  });

  it('finds a diagonal direction', () => {
    const pa = principalAxis(mask(4, ['#...', '.#..', '..#.', '...#']));
    expect(Math.abs(pa.ux * pa.uy)).toBeCloseTo(0.5, 12);
    expect(pa.ux * pa.uy).toBeGreaterThan(0);
    expect(() => principalAxis(mask(2, ['..']))).toThrow('the mask is empty');
  });
});

describe('outline and poles', () => {
  it('outlines one pixel with a diamond through the mid-points to its neighbours', () => {
    // Source: marching squares at level 0.5 (from memory): vertices half-way between inside and outside centres.
    const [c] = maskContours(mask(3, ['...', '.#.', '...']));
    const key = (p: { x: number; y: number }) => `${p.x},${p.y}`;
    expect(c.map(key).sort()).toEqual(['0.5,1', '1,0.5', '1,1.5', '1.5,1'].sort());
  });

  it('gives a ring two contours and picks the outer one as outline', () => {
    const ring = mask(5, ['.....', '.###.', '.#.#.', '.###.', '.....']);
    const contours = maskContours(ring);
    expect(contours).toHaveLength(2);
    expect(maskOutline(ring).length).toBe(Math.max(...contours.map((c) => c.length)));
  });

  it('measures length and width of a block as its pixel counts', () => {
    // Source: hand computation; a 7×3 block spans x 0.5..7.5 and y 0.5..3.5 at the half level.
    const m = mask(9, ['.........', '.#######.', '.#######.', '.#######.', '.........']);
    const ext = polesFromOutline(maskOutline(m), principalAxis(m));
    expect(ext.lengthPx).toBeCloseTo(7, 12);
    expect(ext.widthPx).toBeCloseTo(3, 12);
    const xs = [ext.first.x, ext.second.x].sort((a, b) => a - b);
    expect(xs[0]).toBeCloseTo(0.5, 12);
    expect(xs[1]).toBeCloseTo(7.5, 12);
    expect(ext.first.y).toBeCloseTo(2, 12);
  });
});

describe('straightenPlane', () => {
  it('resamples along the axis, anterior left, left side of A→P on top', () => {
    // Demo data: a plane whose value is 10·x + y, so samples reveal their position exactly.
    const w = 8;
    const h = 6;
    const plane = { width: w, height: h, data: Float32Array.from({ length: w * h }, (_, i) => 10 * (i % w) + Math.floor(i / w)) };
    const s = straightenPlane(plane, axis(1, 2, 5, 2), 1, 5);
    expect([s.width, s.height]).toEqual([5, 3]);
    expect(Array.from(s.data)).toEqual([11, 21, 31, 41, 51, 12, 22, 32, 42, 52, 13, 23, 33, 43, 53]);
    expect(() => straightenPlane(plane, axis(1, 2, 5, 2), 1, 1)).toThrow('samplesAlong must be an integer ≥ 2, got 1');
  });
});

describe('chooseAnterior', () => {
  it('puts anterior at the high end, the low end when asked, and warns when ambiguous', () => {
    expect(chooseAnterior({ first: 10, second: 100 }, 'auto')).toEqual({ firstIsAnterior: false, warning: null });
    expect(chooseAnterior({ first: 10, second: 100 }, 'low').firstIsAnterior).toBe(true);
    expect(chooseAnterior({ first: 100, second: 95 }, 'auto').warning).toMatch(/^anterior end is ambiguous/);
    expect(chooseAnterior({ first: 100, second: 95 }, 'high').warning).toBeNull();
  });
});

describe('maskContours against the cell-by-cell reference', () => {
  /** Reference: every cell's segments from cellSegments at its own position, linked as maskContours links them. */
  function refContours(m: { width: number; height: number; data: Uint8Array }): { x: number; y: number }[][] {
    const segs: Segment[] = [];
    const at = (x: number, y: number): boolean => x >= 0 && y >= 0 && x < m.width && y < m.height && m.data[y * m.width + x] !== 0;
    for (let y = -1; y < m.height; y++) for (let x = -1; x < m.width; x++) cellSegments([at(x, y), at(x + 1, y), at(x + 1, y + 1), at(x, y + 1)], x, y, segs);
    const key = (px: number, py: number): string => `${px},${py}`;
    const byStart = new Map(segs.map((s, i) => [key(s.sx, s.sy), i]));
    const used = new Uint8Array(segs.length);
    const out: { x: number; y: number }[][] = [];
    for (let i = 0; i < segs.length; i++) {
      if (used[i]) continue;
      const c: { x: number; y: number }[] = [];
      for (let j: number | undefined = i; j !== undefined && !used[j]; j = byStart.get(key(segs[j].ex, segs[j].ey))) { used[j] = 1; c.push({ x: segs[j].sx, y: segs[j].sy }); }
      out.push(c);
    }
    return out;
  }

  it('gives the same contours, vertex for vertex and in the same order (random masks with saddles and holes; demo data)', () => {
    // Source: cellSegments evaluated cell by cell (the marching-squares definition above), on seeded random masks.
    const rng = createRng(44);
    for (let trial = 0; trial < 40; trial++) {
      const width = 1 + Math.floor(rng.uniform() * 30);
      const height = 1 + Math.floor(rng.uniform() * 30);
      const p = 0.2 + 0.6 * rng.uniform();
      const m = { width, height, data: Uint8Array.from({ length: width * height }, () => +(rng.uniform() < p)) };
      expect(maskContours(m)).toEqual(refContours(m));
    }
  });
});
