import { describe, expect, it } from 'vitest';
import { SAMPLE_COUNTS, sampleMedian, wholeNumberMedian } from './median-whole';
import { maskRuns } from './runs';
import { maskedMedian } from './select';

/** Seeded linear congruential generator (demo data). */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s / 4294967296; };
}

/** The runs of a one-row keep mask. */
const runsOf = (keep: Uint8Array) => maskRuns({ width: keep.length, height: 1, data: keep }, true);

/** Reference: median of a sorted copy (mean of the two middle values for an even count). */
function sortMedian(values: number[]): number {
  // Source: from memory, the textbook definition of the sample median.
  const s = [...values].sort((a, b) => a - b);
  const n = s.length;
  return n % 2 === 1 ? s[n >> 1] : (s[(n >> 1) - 1] + s[n >> 1]) / 2;
}

describe('wholeNumberMedian', () => {
  it('gives the median and count of the kept values (tiny known answers, odd and even counts)', () => {
    // Source: from memory, median definition: kept 1, 5, 3 → 3; with 8 added → (3 + 5) / 2 = 4.
    const values = new Float32Array([1, 100, 5, 7, 3, 9, 2, 8]);
    expect(wholeNumberMedian(values, new Uint8Array([1, 0, 1, 0, 1, 0, 0, 0]))).toEqual({ median: 3, count: 3 });
    expect(wholeNumberMedian(values, new Uint8Array([1, 0, 1, 0, 2, 0, 0, 1]))).toEqual({ median: 4, count: 4 });
    const keep = new Uint8Array([1, 0, 1, 0, 2, 0, 0, 1]);
    expect(wholeNumberMedian(values, keep, runsOf(keep))).toEqual({ median: 4, count: 4 });
  });

  it('declines (null) values that are not whole numbers in 0…65 535, an empty set, and a middle zero that may be −0', () => {
    // Source: from memory: a 16-bit sample holds 0…65 535; IEEE 754 −0 equals +0 but prints and divides differently.
    const keep = new Uint8Array([1, 1, 1]);
    for (const odd of [2.5, -1, 65_536, NaN, Infinity, -Infinity]) {
      expect(wholeNumberMedian(new Float32Array([1, odd, 3]), keep), String(odd)).toBeNull();
      expect(wholeNumberMedian(new Float32Array([1, odd, 3]), keep, runsOf(keep)), String(odd)).toBeNull();
    }
    expect(wholeNumberMedian(new Float32Array([1, 2, 3]), new Uint8Array(3))).toBeNull();
    expect(wholeNumberMedian(new Float32Array([-0, 0, 0]), keep)).toBeNull();
    expect(wholeNumberMedian(new Float32Array([0, 0, 5, 0]), new Uint8Array([1, 1, 1, 0]))).toEqual({ median: 0, count: 3 });
    // A fraction beyond the first block of values still declines.
    const long = new Float32Array(40_000).fill(7);
    long[39_999] = 7.5;
    const all = new Uint8Array(40_000).fill(1);
    expect(wholeNumberMedian(long, all)).toBeNull();
    expect(wholeNumberMedian(long, all, runsOf(all))).toBeNull();
  });

  it('equals a sort-based median on small seeded sets with many ties', () => {
    // Source: from memory, median definition; demo data: seeded whole numbers from a narrow range (ties).
    for (const n of [1, 2, 3, 10, 11, 1000, 1001]) {
      const rnd = lcg(n);
      const values = Float32Array.from({ length: n }, () => Math.floor(rnd() * 7) * 3);
      const keep = new Uint8Array(n).fill(1);
      expect(wholeNumberMedian(values, keep)?.median).toBe(sortMedian(Array.from(values)));
    }
  });

  it('gives the same median as maskedMedian on seeded images, by mask and by runs, odd and even counts', () => {
    // Source: maskedMedian (radix selection, and Hoare selection below 65 536 values) as reference (demo data:
    // seeded 16-bit noise around a background level with bright outliers and saturated pixels; ties everywhere).
    for (const n of [5_001, 5_002, 200_001, 200_002]) {
      const rnd = lcg(n);
      const values = new Float32Array(n);
      const keep = new Uint8Array(n);
      for (let i = 0; i < n; i++) {
        const u = rnd();
        values[i] = u < 0.05 ? 65_535 : u < 0.2 ? Math.floor(rnd() * 4000) : 100 + Math.floor(rnd() * 12);
        keep[i] = +(rnd() < 0.7);
      }
      // Make the kept count's parity follow n's, so both odd and even counts are checked.
      let count = 0;
      for (let i = 0; i < n; i++) count += keep[i];
      if (count % 2 !== n % 2) keep[keep.indexOf(1)] = 0;
      const expected = maskedMedian(values, keep);
      expect(wholeNumberMedian(values, keep), `n=${n}`).toEqual(expected);
      expect(wholeNumberMedian(values, keep, runsOf(keep)), `n=${n} runs`).toEqual(expected);
    }
  });
});

describe('sampleMedian', () => {
  it('gives the median and count of the samples in the runs (tiny known answers, odd and even counts, none)', () => {
    // Source: from memory, median definition: kept 1, 5, 3 → 3; with 8 added → (3 + 5) / 2 = 4.
    const values = [1, 100, 5, 7, 3, 9, 2, 8];
    const odd = new Uint8Array([1, 0, 1, 0, 1, 0, 0, 0]);
    const even = new Uint8Array([1, 0, 1, 0, 1, 0, 0, 1]);
    for (const samples of [Uint8Array.from(values), Uint16Array.from(values)]) {
      expect(sampleMedian(samples, runsOf(odd))).toEqual({ median: 3, count: 3 });
      expect(sampleMedian(samples, runsOf(even))).toEqual({ median: 4, count: 4 });
      expect(sampleMedian(samples, runsOf(new Uint8Array(8)))).toBeNull();
    }
    // Source: from memory: a 16-bit sample holds 0…65 535; the extremes are counted like any other value.
    expect(sampleMedian(Uint16Array.from([65_535, 0, 65_535]), runsOf(new Uint8Array([1, 1, 1])))).toEqual({ median: 65_535, count: 3 });
    expect(sampleMedian(Uint16Array.from([0, 65_535]), runsOf(new Uint8Array([1, 1])))).toEqual({ median: 32_767.5, count: 2 });
  });

  it('gives what wholeNumberMedian and maskedMedian give for the same values as floats (seeded 2-D images, 8 and 16 bit)', () => {
    // Source: maskedMedian (radix selection) and wholeNumberMedian as references; demo data: seeded noise around a
    // background level with bright outliers and saturated pixels (many ties), masks of random blobs, so runs of every
    // length including 1, 2 and 3 (the counting loop's remainder); odd and even kept counts.
    for (const [seed, width, height, bits] of [[1, 64, 48, 16], [2, 97, 61, 16], [3, 200, 150, 8], [4, 31, 7, 8], [5, 513, 257, 16]] as const) {
      const rnd = lcg(seed);
      const n = width * height;
      const top = bits === 8 ? 255 : 65_535;
      const samples = bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
      for (let i = 0; i < n; i++) {
        const u = rnd();
        samples[i] = u < 0.05 ? top : u < 0.2 ? Math.floor(rnd() * (top + 1)) : Math.min(top, 20 + Math.floor(rnd() * 12));
      }
      for (const parity of [0, 1]) {
        const keep = new Uint8Array(n);
        for (let i = 0; i < n; i++) keep[i] = +(rnd() < (i % width < width / 2 ? 0.9 : 0.3));
        let count = 0;
        for (let i = 0; i < n; i++) count += keep[i];
        if (count % 2 !== parity) keep[keep.indexOf(1)] = 0;
        const runs = maskRuns({ width, height, data: keep }, true);
        const floats = Float32Array.from(samples);
        const expected = maskedMedian(floats, keep);
        const got = sampleMedian(samples, runs);
        expect(got, `seed ${seed} parity ${parity}`).toEqual(expected);
        // Lent counts (all zero) give the same answer and are all zero again after each plane, so they serve the
        // next; counts of another length are not used.
        const lent = new Uint32Array(SAMPLE_COUNTS);
        expect(sampleMedian(samples, runs, lent)).toEqual(expected);
        expect(lent.every((v) => v === 0)).toBe(true);
        expect(sampleMedian(samples, runs, lent)).toEqual(expected);
        expect(lent.every((v) => v === 0)).toBe(true);
        // 16-bit samples that do not start on a 4-byte boundary are counted one at a time: the same answer.
        if (samples instanceof Uint16Array) {
          const shifted = new Uint16Array(new ArrayBuffer(2 * n + 2), 2, n);
          shifted.set(samples);
          expect(sampleMedian(shifted, runs, lent)).toEqual(expected);
          expect(lent.every((v) => v === 0)).toBe(true);
        }
        const short = new Uint32Array(10).fill(3);
        expect(sampleMedian(samples, runs, short)).toEqual(expected);
        expect(short.every((v) => v === 3)).toBe(true);
        expect(got).toEqual(wholeNumberMedian(floats, keep, runs));
        expect(got!.count % 2).toBe(parity);
      }
    }
  });
});
