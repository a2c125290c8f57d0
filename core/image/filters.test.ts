import { describe, expect, it } from 'vitest';
import { gaussianKernel, gaussianSmooth } from './gaussian';
import { otsuBin, otsuThreshold } from './threshold';
import { maxFilter } from './max-filter';
import { sampleBilinear } from './bilinear';

const plane = (width: number, height: number, values: number[]) => ({ width, height, data: Float32Array.from(values) });

describe('gaussianKernel / gaussianSmooth', () => {
  it('builds the normalised sampled Gaussian of radius ceil(3σ)', () => {
    // Source: definition of the sampled Gaussian, exp(−i²/2σ²) normalised to sum 1 (from memory).
    const k = gaussianKernel(1);
    const raw = [-3, -2, -1, 0, 1, 2, 3].map((i) => Math.exp(-i * i / 2));
    const total = raw.reduce((s, v) => s + v, 0);
    expect(k.length).toBe(7);
    raw.forEach((v, i) => expect(k[i]).toBeCloseTo(v / total, 12));
  });

  it('spreads an impulse into the outer product of the kernel and keeps flat images flat', () => {
    const img = plane(9, 9, Array(81).fill(0));
    img.data[4 * 9 + 4] = 1;
    const out = gaussianSmooth(img, 1).data;
    const k = gaussianKernel(1);
    expect(out[4 * 9 + 4]).toBeCloseTo(k[3] * k[3], 6);
    expect(out[3 * 9 + 5]).toBeCloseTo(k[2] * k[4], 6);
    const flat = gaussianSmooth(plane(5, 4, Array(20).fill(7)), 2).data;
    flat.forEach((v) => expect(v).toBeCloseTo(7, 5));
    expect(img.data[4 * 9 + 4]).toBe(1);
  });

  it('rejects a bad sigma', () => {
    expect(() => gaussianKernel(0)).toThrow('sigmaPx must be a positive number, got 0');
  });
});

describe('otsu', () => {
  it('chooses the bin of the largest between-class variance', () => {
    // Source: hand computation of w0·w1·(m0 − m1)² for histogram [1,2,1,0,3,3]: 106.8, 253.7, 294, 294, 154.7 → bin 2.
    expect(otsuBin([1, 2, 1, 0, 3, 3])).toBe(2);
  });

  it('separates two flat populations', () => {
    const values = [10, 10, 11, 10, 50, 52, 51, 50];
    const t = otsuThreshold(values);
    expect(values.filter((v) => v > t)).toEqual([50, 52, 51, 50]);
    expect(otsuThreshold([3, 3, 3])).toBe(3);
    expect(() => otsuThreshold([NaN])).toThrow('otsuThreshold needs at least one finite value');
  });
});

describe('maxFilter', () => {
  it('gives the running maximum over the clipped window', () => {
    // Source: hand computation, window of 3 along a 7×1 line.
    expect(Array.from(maxFilter(plane(7, 1, [0, 5, 1, 0, 0, 0, 9]), 1).data)).toEqual([5, 5, 5, 1, 0, 9, 9]);
  });

  it('matches a direct window search on a 13×9 image', () => {
    const values = Array.from({ length: 117 }, (_, i) => (i * 37) % 101);
    const out = maxFilter(plane(13, 9, values), 2).data;
    for (let y = 0; y < 9; y++) for (let x = 0; x < 13; x++) {
      let m = -Infinity;
      for (let yy = Math.max(0, y - 2); yy <= Math.min(8, y + 2); yy++) for (let xx = Math.max(0, x - 2); xx <= Math.min(12, x + 2); xx++) m = Math.max(m, values[yy * 13 + xx]);
      expect(out[y * 13 + x]).toBe(m);
    }
  });
});

describe('sampleBilinear', () => {
  it('interpolates between pixel centres and returns the outside value beyond them', () => {
    // Source: hand computation on [[0, 1], [2, 3]].
    const p = plane(2, 2, [0, 1, 2, 3]);
    expect(sampleBilinear(p, 0.5, 0.5)).toBe(1.5);
    expect(sampleBilinear(p, 1, 0)).toBe(1);
    expect(sampleBilinear(p, 1, 1)).toBe(3);
    expect(sampleBilinear(p, 0.25, 1)).toBe(2.25);
    expect(sampleBilinear(p, -0.1, 0, -1)).toBe(-1);
  });
});

describe('fastGaussianSmooth', () => {
  it('chooses box widths whose combined variance matches sigma²', async () => {
    const { boxWidthsForSigma } = await import('./box-blur');
    // Source: a box of odd width w has variance (w² − 1)/12 (from memory); for σ = 2 the nearest odd widths give
    // 3, 3, 5 → 40/12 (5, 5, 3 would give 56/12: both miss 4 by 2/3).
    const w = boxWidthsForSigma(2);
    expect(w).toEqual([3, 3, 5]);
    expect(w.reduce((s, x) => s + (x * x - 1) / 12, 0)).toBeCloseTo(40 / 12, 12);
    expect(boxWidthsForSigma(3)).toEqual([5, 5, 7]); // variance (24 + 24 + 48)/12 = 8 for σ² = 9
  });

  it('keeps flat images flat and the total of an impulse, with the variance of sigma²', async () => {
    const { fastGaussianSmooth } = await import('./box-blur');
    const img = plane(41, 1, Array(41).fill(0));
    img.data[20] = 1;
    // A 41×1 line: only the x passes spread it (y passes see a single row).
    const out = fastGaussianSmooth(img, 2).data;
    let total = 0;
    let variance = 0;
    out.forEach((v, i) => { total += v; variance += v * (i - 20) ** 2; });
    expect(total).toBeCloseTo(1, 6);
    expect(variance).toBeCloseTo(40 / 12, 5);
    fastGaussianSmooth(plane(6, 5, Array(30).fill(3)), 1.3).data.forEach((v) => expect(v).toBeCloseTo(3, 5));
  });
});

describe('selectKth / medianInPlace', () => {
  it('finds order statistics like a full sort does', async () => {
    const { selectKth, medianInPlace } = await import('./select');
    // Source: hand-sorted [1, 2, 3, 5, 8, 9]; median of an even count is the mean of the two middle values.
    expect(selectKth(Float64Array.from([9, 1, 8, 2, 5, 3]), 4)).toBe(8);
    expect(medianInPlace(Float64Array.from([9, 1, 8, 2, 5, 3]))).toBe(4);
    expect(medianInPlace(Float32Array.from([7, 7, 1, 7, 2]))).toBe(7);
    const v = Float64Array.from({ length: 1001 }, (_, i) => (i * 7919) % 1009);
    const sorted = Float64Array.from(v).sort();
    for (const k of [0, 1, 500, 999, 1000]) expect(selectKth(Float64Array.from(v), k)).toBe(sorted[k]);
  });
});

describe('squareDilate / squareErode', () => {
  it('grow and shrink by a square window', async () => {
    const { squareDilate, squareErode } = await import('./morphology');
    const m = { width: 5, height: 5, data: Uint8Array.from([0, 0, 0, 0, 0, 0, 1, 1, 1, 0, 0, 1, 1, 1, 0, 0, 1, 1, 1, 0, 0, 0, 0, 0, 0]) };
    expect(Array.from(squareErode(m, 1).data)).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0]);
    expect(Array.from(squareDilate(squareErode(m, 1), 1).data)).toEqual(Array.from(m.data));
  });
});
