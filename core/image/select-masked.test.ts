import { describe, expect, it } from 'vitest';
import { lowKeyCounts, maskedMedian, medianInPlace } from './select';

/** Reference: median of a sorted copy (mean of the two middle values for an even count). */
function sortMedian(values: number[]): number {
  // Source: from memory, the textbook definition of the sample median.
  const s = [...values].sort((a, b) => a - b);
  const n = s.length;
  if (n === 0) return NaN;
  return n % 2 === 1 ? s[n >> 1] : (s[(n >> 1) - 1] + s[n >> 1]) / 2;
}

/** Seeded linear congruential generator (demo data). */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s / 4294967296; };
}

describe('maskedMedian', () => {
  it('takes the median of the kept finite values only (tiny known answers)', () => {
    // Source: from memory, median definition; kept values 1, 5, 3 → 3; with 8 added → (3 + 5) / 2 = 4.
    const values = new Float32Array([1, 100, 5, NaN, 3, Infinity, -Infinity, 8]);
    expect(maskedMedian(values, new Uint8Array([1, 0, 1, 1, 1, 1, 1, 0]))).toEqual({ median: 3, count: 3 });
    expect(maskedMedian(values, new Uint8Array([1, 0, 1, 0, 2, 0, 0, 1]))).toEqual({ median: 4, count: 4 });
  });

  it('is NaN with a count of 0 when nothing is kept', () => {
    // Source: common practice (the median of an empty set is undefined).
    const r = maskedMedian(new Float32Array([1, 2, 3]), new Uint8Array(3));
    expect(r.count).toBe(0);
    expect(r.median).toBeNaN();
  });

  it('equals a sort-based median on large seeded sets (bucket path), odd and even counts', () => {
    // Source: from memory, median definition; demo data: quantised seeded noise plus bright outliers.
    for (const n of [70_001, 70_002]) {
      const rnd = lcg(n);
      const values = new Float32Array(n);
      const keep = new Uint8Array(n);
      for (let i = 0; i < n; i++) {
        values[i] = Math.round((100 + 10 * (rnd() - 0.5) + (rnd() < 0.1 ? 500 * rnd() : 0)) * 3) / 3;
        keep[i] = rnd() < 0.97 ? 1 : 0;
      }
      values[5] = NaN;
      const kept: number[] = [];
      for (let i = 0; i < n; i++) if (keep[i] && Number.isFinite(values[i])) kept.push(values[i]);
      const r = maskedMedian(values, keep);
      expect(r.count).toBe(kept.length);
      expect(r.median).toBe(sortMedian(kept));
      expect(r.median).toBe(medianInPlace(Float32Array.from(kept)));
    }
  });

  it('agrees with medianInPlace of the gathered values on small sets', () => {
    // Source: from memory, median definition (demo data: seeded uniform values).
    const rnd = lcg(3);
    for (const n of [1, 2, 5, 64, 999]) {
      const values = Float32Array.from({ length: n }, () => rnd() * 50 - 25);
      const keep = Uint8Array.from({ length: n }, () => (rnd() < 0.6 ? 1 : 0));
      const kept = Array.from(values).filter((_, i) => keep[i]);
      expect(maskedMedian(values, keep).median).toBe(kept.length ? sortMedian(kept) : NaN);
    }
  });

  it('pins the middle values exactly on large sets with negatives, infinities and middles in two buckets', () => {
    // Source: from memory, median definition. Demo data: values −3.75 and +0.5 (even count, middle ranks split
    // between the two, far apart in the order) with ±Infinity and NaN that must be left out; then seeded values of
    // both signs spread over many decades.
    const half = 40_000;
    const values = new Float32Array(2 * half + 6);
    values.fill(-3.75, 0, half);
    values.fill(0.5, half, 2 * half);
    values.set([Infinity, -Infinity, NaN, -NaN, Infinity, -Infinity], 2 * half);
    const keep = new Uint8Array(values.length).fill(1);
    expect(maskedMedian(values, keep)).toEqual({ median: (-3.75 + 0.5) / 2, count: 2 * half });
    const rnd = lcg(11);
    for (const n of [70_001, 90_000]) {
      const v = Float32Array.from({ length: n }, () => (rnd() - 0.5) * Math.exp(40 * rnd() - 20));
      const k = Uint8Array.from({ length: n }, () => (rnd() < 0.9 ? 1 : 0));
      const kept = Array.from(v).filter((_, i) => k[i]);
      const r = maskedMedian(v, k);
      expect(r.count).toBe(kept.length);
      expect(r.median).toBe(sortMedian(kept));
    }
  });
});

/** Order-key bucket of a Float32 bit pattern, written plainly: the top 16 bits with all bits flipped for a negative
 *  value and only the sign bit for others. Source: from memory, the usual float radix-sort key. */
function plainBucket(bits: number): number {
  const key = bits >= 0x8000_0000 ? ~bits >>> 0 : (bits | 0x8000_0000) >>> 0;
  return key >>> 16;
}

describe('lowKeyCounts', () => {
  it('counts exactly what a plain loop with a test per pixel counts (random values, masks and buckets)', () => {
    // Source: the plain loop below is the reference (demo data: seeded values of both signs, infinities, NaN,
    // masks with values other than 0 and 1; one bucket and two).
    const rnd = lcg(21);
    for (const n of [1, 7, 1000, 50_003]) {
      const values = Float32Array.from({ length: n }, () => {
        const u = rnd();
        if (u < 0.01) return [NaN, Infinity, -Infinity, -0, 0][Math.floor(rnd() * 5)];
        return (rnd() - 0.3) * (u < 0.5 ? 4 : 400);
      });
      const bits = new Uint32Array(values.buffer);
      const keep = Uint8Array.from({ length: n }, () => (rnd() < 0.7 ? (rnd() < 0.5 ? 1 : 3) : 0));
      for (let t = 0; t < 6; t++) {
        const b1 = plainBucket(bits[Math.floor(rnd() * n)]);
        const b2 = t % 2 === 0 ? b1 : plainBucket(bits[Math.floor(rnd() * n)]);
        const plain = new Uint32Array(2 * 65_536 + 1);
        for (let i = 0; i < n; i++) {
          if (keep[i] === 0) continue;
          const b = plainBucket(bits[i]);
          if (b !== b1 && b !== b2) continue;
          const key = bits[i] >= 0x8000_0000 ? ~bits[i] >>> 0 : (bits[i] | 0x8000_0000) >>> 0;
          plain[(b === b1 ? 0 : 65_536) + (key & 0xffff)]++;
        }
        const fast = lowKeyCounts(bits, keep, n, b1, b2);
        expect(Array.from(fast.subarray(0, 2 * 65_536))).toEqual(Array.from(plain.subarray(0, 2 * 65_536)));
      }
    }
  });
});
