// Known-answer checks of the fast image primitives against naive direct references written here, on small seeded
// random inputs (demo data) of odd and edge-case sizes.
import { describe, expect, it } from 'vitest';
import { createRng } from '../stats';
import type { Mask, Plane } from '../model';
import { boxWidthsForSigma, fastGaussianSmooth } from './box-blur';
import { maxFilter, rowMaxima, rowMaximaAt } from './max-filter';
import { dilate, erode, open, squareDilate, squareErode } from './morphology';
import { distanceInside, distanceOutside, foregroundBox, squaredDistanceToFeatures } from './distance';
import { fillHoles } from './fill-holes';
import { labelComponents, largestComponent } from './components';
import { estimateBackgroundLevel } from './background-level';
import { otsuBin, otsuThreshold } from './threshold';

const SIZES: readonly [number, number][] = [[1, 1], [1, 6], [6, 1], [2, 2], [5, 3], [3, 8], [9, 7], [16, 11]];

/** Seeded random plane (demo data): values in [−50, 50), a few repeated so ties occur. */
function randomPlane(width: number, height: number, seed: number): Plane {
  const rng = createRng(seed);
  const data = Float32Array.from({ length: width * height }, () => (rng.uniform() < 0.2 ? 7 : Math.round(rng.uniform() * 1000) / 10 - 50));
  return { width, height, data };
}

/** Seeded random mask (demo data) with foreground fraction p. */
function randomMask(width: number, height: number, seed: number, p = 0.5): Mask {
  const rng = createRng(seed);
  return { width, height, data: Uint8Array.from({ length: width * height }, () => (rng.uniform() < p ? 1 : 0)) };
}

/** Value at (x, y) with coordinates clamped into the image (edge replication). */
function clamped(p: Plane, x: number, y: number): number {
  return p.data[Math.min(p.height - 1, Math.max(0, y)) * p.width + Math.min(p.width - 1, Math.max(0, x))];
}

describe('fastGaussianSmooth against direct box means', () => {
  it('equals the same box passes done by direct window sums (edges replicated)', () => {
    // Source: definition of a box mean with replicated edges (from memory); the direct sums differ from running sums
    // only by rounding, hence the tolerance.
    for (const [w, h] of SIZES) {
      for (const sigma of [0.6, 1.5, 4]) {
        const p = randomPlane(w, h, 11 * w + h);
        let ref: Plane = p;
        for (const bw of boxWidthsForSigma(sigma)) {
          const r = (bw - 1) >> 1;
          if (r === 0) continue;
          const rows = Float32Array.from({ length: w * h }, (_, i) => {
            let s = 0;
            for (let d = -r; d <= r; d++) s += clamped(ref, (i % w) + d, Math.floor(i / w));
            return s / bw;
          });
          const rp = { width: w, height: h, data: rows };
          ref = { width: w, height: h, data: Float32Array.from({ length: w * h }, (_, i) => {
            let s = 0;
            for (let d = -r; d <= r; d++) s += clamped(rp, i % w, Math.floor(i / w) + d);
            return s / bw;
          }) };
        }
        const out = fastGaussianSmooth(p, sigma).data;
        for (let i = 0; i < out.length; i++) expect(out[i]).toBeCloseTo(ref.data[i], 3);
      }
    }
  });

  it('returns a new array and leaves the input unchanged (also when every box has width 1)', () => {
    const p = randomPlane(4, 3, 5);
    const before = Float32Array.from(p.data);
    const out = fastGaussianSmooth(p, 0.2);
    expect(boxWidthsForSigma(0.2)).toEqual([1, 1, 1]);
    expect(out.data).not.toBe(p.data);
    expect(Array.from(out.data)).toEqual(Array.from(before));
    fastGaussianSmooth(p, 3);
    expect(Array.from(p.data)).toEqual(Array.from(before));
  });
});

describe('maxFilter against a direct window search', () => {
  it('gives the maximum over the clipped square window for every radius, size and sign', () => {
    // Source: definition of grey-level dilation by a square, searched directly; the fast path is the van Herk /
    // Gil–Werman running maximum (from memory: van Herk 1992, Gil–Werman 1993).
    for (const [w, h] of SIZES) {
      const p = randomPlane(w, h, 31 * w + h);
      for (const r of [0, 0.4, 1, 2, 3, 5, 40]) {
        const ri = Math.round(r);
        const out = maxFilter(p, r).data;
        for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) {
          let m = -Infinity;
          for (let yy = Math.max(0, y - ri); yy <= Math.min(h - 1, y + ri); yy++) {
            for (let xx = Math.max(0, x - ri); xx <= Math.min(w - 1, x + ri); xx++) m = Math.max(m, p.data[yy * w + xx]);
          }
          expect(out[y * w + x]).toBe(m);
        }
      }
    }
  });

  it('orders negative values, zero and infinities like numbers do', () => {
    // Source: hand computation on a 6×1 line, window of 3.
    const p = { width: 6, height: 1, data: Float32Array.from([-3, -Infinity, -0.5, 0, -7, Infinity]) };
    expect(Array.from(maxFilter(p, 1).data)).toEqual([-3, -0.5, 0, 0, Infinity, Infinity]);
    expect(Array.from(maxFilter({ width: 3, height: 1, data: Float32Array.from([-2, -1e30, -5]) }, 1).data)).toEqual([-2, -2, -5]);
  });
});

describe('rowMaxima against a direct row-window search', () => {
  it('gives the maximum over the clipped row window for every radius and size', () => {
    // Source: definition of a running maximum along a line, searched directly.
    for (const [w, h] of SIZES) {
      const p = randomPlane(w, h, 17 * w + h);
      for (const r of [0, 1, 2, 5, 40]) {
        const out = rowMaxima(p, r);
        for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) {
          let m = -Infinity;
          for (let xx = Math.max(0, x - r); xx <= Math.min(w - 1, x + r); xx++) m = Math.max(m, p.data[y * w + xx]);
          expect(out[y * w + x]).toBe(m);
        }
      }
    }
  });
});

describe('rowMaximaAt against rowMaxima', () => {
  it('gives the same bits at the listed pixels, in any order, and leaves the others alone', () => {
    // Source: rowMaxima (checked above against a direct search); the values include ±0, ±Infinity and NaN, whose
    // bits must come out as rowMaxima gives them.
    for (const [w, h] of SIZES) {
      const p = randomPlane(w, h, 5 * w + 3 * h);
      const specials = [0, -0, Infinity, -Infinity, NaN];
      for (let i = 0; i < p.data.length; i += 7) p.data[i] = specials[i % specials.length];
      const at = Int32Array.from({ length: Math.ceil(w * h / 3) }, (_, k) => (k * 3 * 7919) % (w * h)).filter((v, k, a) => a.indexOf(v) === k);
      for (const r of [0, 1, 2, 5, 40]) {
        const full = new Int32Array(rowMaxima(p, r).buffer);
        const into = new Float32Array(w * h).fill(12345);
        rowMaximaAt(p, r, at, into);
        const bits = new Int32Array(into.buffer);
        const listed = new Set(at);
        for (let i = 0; i < w * h; i++) expect(bits[i]).toBe(listed.has(i) ? full[i] : new Int32Array(Float32Array.of(12345).buffer)[0]);
      }
    }
  });
});

/** Direct square-window test: does every (all) or some (any) pixel of the window satisfy the mask (outside = 0)? */
function squareDirect(m: Mask, r: number, all: boolean): number[] {
  const out: number[] = [];
  for (let y = 0; y < m.height; y++) for (let x = 0; x < m.width; x++) {
    let any = false;
    let every = true;
    for (let yy = y - r; yy <= y + r; yy++) for (let xx = x - r; xx <= x + r; xx++) {
      const v = xx >= 0 && yy >= 0 && xx < m.width && yy < m.height && m.data[yy * m.width + xx] !== 0;
      any ||= v;
      every &&= v;
    }
    out.push((all ? every : any) ? 1 : 0);
  }
  return out;
}

describe('square dilation, erosion and opening against a direct window search', () => {
  it('match the definition for every radius, size and foreground fraction', () => {
    // Source: definition of binary dilation / erosion by a square structuring element, beyond the border counting
    // as background for the erosion (from memory).
    for (const [w, h] of SIZES) {
      for (const p of [0.1, 0.6, 0.95]) {
        const m = randomMask(w, h, 7 * w + h + Math.round(100 * p), p);
        for (const r of [0, 1, 2, 4, 30]) {
          expect(Array.from(squareDilate(m, r).data)).toEqual(squareDirect(m, r, false));
          expect(Array.from(squareErode(m, r).data)).toEqual(squareDirect(m, r, true));
        }
        const eroded = { width: w, height: h, data: Uint8Array.from(squareDirect(m, 1, true)) };
        expect(Array.from(open(m, 1.5).data)).toEqual(squareDirect(eroded, 1, false));
      }
    }
  });

  it('match the definition on masks whose foreground fills only part of the frame', () => {
    // Source: as above (direct window search); small blobs exercise the bounding-box crop.
    for (const m of regionMasks()) {
      for (const r of [0, 1, 3, 12]) {
        expect(Array.from(squareDilate(m, r).data)).toEqual(squareDirect(m, r, false));
        expect(Array.from(squareErode(m, r).data)).toEqual(squareDirect(m, r, true));
      }
    }
    const corner = { width: 9, height: 7, data: new Uint8Array(63) };
    corner.data[9 + 7] = 1;
    corner.data.fill(1, 45, 48);
    expect(Array.from(squareDilate(corner, 2).data)).toEqual(squareDirect(corner, 2, false));
  });

  it('treat any nonzero value as foreground and leave the input unchanged', () => {
    const m = { width: 4, height: 3, data: Uint8Array.from([0, 255, 2, 0, 7, 7, 7, 7, 0, 0, 9, 0]) };
    const ones = { width: 4, height: 3, data: m.data.map((v) => (v ? 1 : 0)) };
    expect(Array.from(squareDilate(m, 1).data)).toEqual(squareDirect(ones, 1, false));
    expect(Array.from(squareErode({ width: 3, height: 3, data: new Uint8Array(9).fill(5) }, 1).data)).toEqual([0, 0, 0, 0, 1, 0, 0, 0, 0]);
    expect(m.data[1]).toBe(255);
  });
});

/** Blob-like seeded mask (demo data): random discs with random holes, some touching the border. */
function blobMask(width: number, height: number, seed: number): Mask {
  const rng = createRng(seed);
  const data = new Uint8Array(width * height);
  for (let b = 0; b < 4; b++) {
    const cx = rng.uniform() * width;
    const cy = rng.uniform() * height;
    const r = 1 + rng.uniform() * Math.max(width, height) / 2;
    const hole = r * rng.uniform() * 0.6;
    for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) {
      const d = Math.hypot(x - cx, y - cy);
      if (d <= r) data[y * width + x] = d < hole ? 0 : 1;
    }
  }
  for (let i = 0; i < data.length; i++) if (rng.uniform() < 0.05) data[i] ^= 1;
  return { width, height, data };
}

/** Masks for the region tests: uniform random ones of several densities and blob-like ones, of every size. */
function regionMasks(): Mask[] {
  const out: Mask[] = [];
  for (const [w, h] of [...SIZES, [23, 19] as const, [30, 4] as const]) {
    for (const p of [0.3, 0.5, 0.7]) out.push(randomMask(w, h, 13 * w + h + Math.round(100 * p), p));
    out.push(blobMask(w, h, 17 * w + h));
  }
  return out;
}

describe('fillHoles against a direct flood', () => {
  it('sets exactly the background not 4-connected to the border', () => {
    // Source: definition of hole filling (background not reachable from the border through 4-neighbours), computed by
    // repeated relaxation until nothing changes (from memory).
    for (const m of regionMasks()) {
      const { width: w, height: h } = m;
      const outside = new Uint8Array(w * h);
      for (let i = 0; i < w * h; i++) {
        const x = i % w;
        const y = Math.floor(i / w);
        if (!m.data[i] && (x === 0 || y === 0 || x === w - 1 || y === h - 1)) outside[i] = 1;
      }
      for (let changed = true; changed;) {
        changed = false;
        for (let i = 0; i < w * h; i++) {
          if (m.data[i] || outside[i]) continue;
          const x = i % w;
          if ((x > 0 && outside[i - 1]) || (x < w - 1 && outside[i + 1]) || (i >= w && outside[i - w]) || (i + w < w * h && outside[i + w])) {
            outside[i] = 1;
            changed = true;
          }
        }
      }
      expect(Array.from(fillHoles(m).data)).toEqual(Array.from(outside, (v) => 1 - v));
    }
  });
});

describe('labelComponents / largestComponent against direct label propagation', () => {
  it('label 8-connected regions in raster order of their first pixel, with their sizes', () => {
    // Source: definition of 8-connected components, found by propagating the smallest pixel index to all
    // 8-neighbours until nothing changes, then numbering regions by first pixel in raster order (from memory).
    for (const m of regionMasks()) {
      const { width: w, height: h } = m;
      const min = Int32Array.from({ length: w * h }, (_, i) => (m.data[i] ? i : -1));
      for (let changed = true; changed;) {
        changed = false;
        for (let i = 0; i < w * h; i++) {
          if (min[i] < 0) continue;
          const x = i % w;
          const y = Math.floor(i / w);
          for (let dy = -1; dy <= 1; dy++) for (let dx = -1; dx <= 1; dx++) {
            const xx = x + dx;
            const yy = y + dy;
            if (xx < 0 || yy < 0 || xx >= w || yy >= h) continue;
            const j = yy * w + xx;
            if (min[j] >= 0 && min[j] < min[i]) { min[i] = min[j]; changed = true; }
          }
        }
      }
      const numberOf = new Map<number, number>();
      const expected = Array.from(min, (v) => (v < 0 ? 0 : numberOf.get(v) ?? (numberOf.set(v, numberOf.size + 1), numberOf.size)));
      const sizes = [0, ...Array.from(numberOf.values(), (l) => expected.filter((v) => v === l).length)];
      const got = labelComponents(m);
      expect(Array.from(got.labels)).toEqual(expected);
      expect(got.count).toBe(numberOf.size);
      expect(got.sizes).toEqual(sizes);
      let best = 1;
      for (let l = 2; l < sizes.length; l++) if (sizes[l] > sizes[best]) best = l;
      expect(Array.from(largestComponent(m).data)).toEqual(expected.map((v) => (sizes.length > 1 && v === best ? 1 : 0)));
    }
  });
});

describe('otsuThreshold against a directly built histogram', () => {
  it('equals otsuBin of the histogram of the finite values (Math.floor bins, maximum in the last bin)', () => {
    // Source: Otsu's method on an equal-width histogram from min to max (from memory), the histogram built directly.
    for (const [w, h] of [...SIZES, [40, 25] as const]) {
      const v = Array.from(randomPlane(w, h, 3 * w + h).data);
      if (v.length > 3) { v[1] = NaN; v[2] = Infinity; v[3] = -Infinity; }
      for (const bins of [2, 7, 256]) {
        const finite = v.filter((x) => Number.isFinite(x));
        const lo = Math.min(...finite);
        const hi = Math.max(...finite);
        const scale = bins / (hi - lo);
        const hist = new Array<number>(bins).fill(0);
        for (const x of finite) hist[Math.min(bins - 1, Math.floor((x - lo) * scale))]++;
        const expected = hi === lo ? lo : lo + (otsuBin(hist) + 1) / scale;
        expect(otsuThreshold(v, bins)).toBe(expected);
        expect(otsuThreshold(Float32Array.from(v), bins)).toBe(expected);
      }
    }
  });
});

/** Plain reference of estimateBackgroundLevel's two histograms (one loop, one test per value, Math.floor bins). */
function refBackgroundLevel(values: ArrayLike<number>): { level: number; noiseSd: number } {
  const v = Array.from(values).filter((x) => !Number.isNaN(x));
  const min = Math.min(...v);
  const max = Math.max(...v);
  const floor = Math.max(1e-6 * (max - min), 1e-12);
  const hist = (lo: number, hi: number, bins: number) => {
    const counts = new Float64Array(bins);
    let below = 0;
    for (const x of v) {
      if (x < lo) below++;
      else if (x <= hi) counts[Math.min(bins - 1, Math.floor((x - lo) * (bins / (hi - lo))))]++;
    }
    return { counts, below };
  };
  const quantile = (h: { counts: Float64Array; below: number }, lo: number, hi: number, p: number) => {
    const target = p * v.length;
    let acc = h.below;
    for (let b = 0; b < h.counts.length; b++) {
      if (acc + h.counts[b] >= target && h.counts[b] > 0) return lo + (b + (target - acc) / h.counts[b]) * ((hi - lo) / h.counts.length);
      acc += h.counts[b];
    }
    return hi;
  };
  const coarse = hist(min, max, 4096);
  const lo = quantile(coarse, min, max, 0.001);
  const hi = Math.max(quantile(coarse, min, max, 0.5), lo + floor);
  const top = hi + (hi - lo) / 4096;
  const fine = hist(lo, top, 1024);
  let best = 0;
  for (let b = 1; b < 1024; b++) if (fine.counts[b] > fine.counts[best]) best = b;
  const level = lo + (best + 0.5) * ((top - lo) / 1024);
  let belowLevel = fine.below;
  for (let b = 0; b < best; b++) belowLevel += fine.counts[b];
  belowLevel += fine.counts[best] / 2;
  const sdQuantile = quantile(fine, lo, top, (0.3173 * belowLevel) / v.length);
  return { level, noiseSd: Math.max(level - sdQuantile, floor) };
}

describe('estimateBackgroundLevel against a plain two-histogram reference', () => {
  it('gives the same level and noise bit for bit (random data, with and without NaN; demo data)', () => {
    const rng = createRng(22);
    for (const n of [10_001, 4_099, 97]) {
      const v = Float32Array.from({ length: n }, (_, i) => (i % 7 < 2 ? 300 + 40 * rng.normal() : 100 + 5 * rng.normal()));
      expect(estimateBackgroundLevel(v), `n=${n}`).toEqual(refBackgroundLevel(v));
      const f64 = Float64Array.from(v, (x, i) => (i % 53 === 0 ? NaN : x * 1.37));
      expect(estimateBackgroundLevel(f64), `n=${n} with NaN`).toEqual(refBackgroundLevel(f64));
    }
  });
});

describe('estimateBackgroundLevel input handling', () => {
  it('gives the same result for any array type and ignores NaN', () => {
    // Demo data: 70% normal(20, 2), 30% normal(80, 4), seeded.
    const rng = createRng(21);
    const v = Float32Array.from({ length: 9_999 }, (_, i) => (i % 10 < 3 ? 80 + 4 * rng.normal() : 20 + 2 * rng.normal()));
    const ref = estimateBackgroundLevel(v);
    expect(estimateBackgroundLevel(Array.from(v))).toEqual(ref);
    expect(estimateBackgroundLevel(Float64Array.from(v))).toEqual(ref);
    const withNan = Array.from(v);
    withNan.splice(500, 0, NaN, NaN);
    withNan.push(NaN);
    expect(estimateBackgroundLevel(withNan)).toEqual(ref);
    expect(Math.abs(ref.level - 20)).toBeLessThan(0.5);
    expect(Math.abs(ref.noiseSd - 2)).toBeLessThan(0.3);
  });

  it('falls back on flat or non-finite input', () => {
    // Source: the documented fallbacks (flat: the value with a tiny noise floor; an infinity: noise 1).
    expect(estimateBackgroundLevel([4, 4, 4])).toEqual({ level: 4, noiseSd: 1e-12 });
    expect(estimateBackgroundLevel([1, Infinity, 3])).toEqual({ level: 1, noiseSd: 1 });
    expect(estimateBackgroundLevel([NaN, NaN])).toEqual({ level: 0, noiseSd: 1 });
  });
});

/** Brute-force squared distance from every pixel to the nearest pixel with isFeature true (Infinity when none). */
function bruteSquared(m: Mask, isFeature: (v: number) => boolean, borderIsFeature: boolean): number[] {
  const { width: w, height: h } = m;
  return Array.from({ length: w * h }, (_, i) => {
    const x = i % w;
    const y = Math.floor(i / w);
    let best = borderIsFeature ? Math.min(x + 1, w - x, y + 1, h - y) ** 2 : Infinity;
    for (let j = 0; j < w * h; j++) if (isFeature(m.data[j])) best = Math.min(best, (j % w - x) ** 2 + (Math.floor(j / w) - y) ** 2);
    return best;
  });
}

describe('distance transforms against brute force', () => {
  it('give exact squared and rounded distances inside and outside, and the disk dilation and erosion', () => {
    // Source: definition of the Euclidean distance, minimised over every pixel (brute force); the fast path is the
    // lower envelope of parabolas (from memory: Felzenszwalb–Huttenlocher 2012 distance transform).
    for (const m of regionMasks()) {
      const toFeature = bruteSquared(m, (v) => v !== 0, false);
      const toBackground = bruteSquared(m, (v) => v === 0, true);
      expect(Array.from(squaredDistanceToFeatures(m))).toEqual(toFeature);
      expect(Array.from(distanceOutside(m))).toEqual(toFeature.map((v) => Math.fround(Math.sqrt(v))));
      const inside = toBackground.map((v, i) => (m.data[i] ? Math.fround(Math.sqrt(v)) : 0));
      expect(Array.from(distanceInside(m))).toEqual(inside);
      for (const r of [0, 1, 1.5, 2.3, 5]) {
        expect(Array.from(dilate(m, r).data)).toEqual(toFeature.map((v) => (v <= r * r ? 1 : 0)));
        expect(Array.from(erode(m, r).data)).toEqual(inside.map((v) => (v > r ? 1 : 0)));
      }
    }
  });
});

describe('foregroundBox against a plain scan', () => {
  it('gives the bounding box of the non-zero bytes for masks at every byte offset (seeded random data)', () => {
    // Source: the definition (every pixel looked at), on sparse random masks, empty masks and single pixels.
    const rng = createRng(12);
    for (let trial = 0; trial < 300; trial++) {
      const width = 1 + Math.floor(rng.uniform() * 23);
      const height = 1 + Math.floor(rng.uniform() * 9);
      const offset = trial & 3;
      const buffer = new Uint8Array(width * height + 8);
      const p = trial % 5 === 0 ? 0 : rng.uniform() * 0.1;
      const data = buffer.subarray(offset, offset + width * height);
      for (let i = 0; i < data.length; i++) data[i] = rng.uniform() < p ? 1 + Math.floor(rng.uniform() * 255) : 0;
      if (trial % 7 === 0) data[Math.floor(rng.uniform() * data.length)] = 1;
      let x0 = width; let y0 = height; let x1 = -1; let y1 = -1;
      for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) {
        if (data[y * width + x] === 0) continue;
        x0 = Math.min(x0, x); x1 = Math.max(x1, x); y0 = Math.min(y0, y); y1 = Math.max(y1, y);
      }
      expect(foregroundBox({ width, height, data }), `trial ${trial}`).toEqual(x1 < 0 ? null : { x0, y0, x1: x1 + 1, y1: y1 + 1 });
    }
  });
});
