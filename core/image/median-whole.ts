// Median of whole-number pixel values (8- and 16-bit samples projected without averaging) by one counting pass.
import type { MaskRuns } from './runs';
import { countSamples, type RunCounter } from './run-counter';

/** Values are counted in blocks of this many; a block holding a value that is not a whole number 0…65 535 ends the count. */
const BLOCK = 16_384;

/**
 * Counts of values[i] for the pixels with keep[i] ≠ 0 (runs null) or for the pixels of the runs (given), into counts
 * (4 lanes × 65 536 slots, value v of the pixel's lane j at 4·v + j); false as soon as one counted value is not a
 * whole number in 0…65 535 (then the counts are partial). `v & 0xffff` equals v exactly for those values, and
 * differs for fractions, negatives, larger values, NaN and ±∞. Four lanes: background pixels repeat a few values, and
 * increments of one counter in a row wait for each other (integer counts, so the lanes' sums are exact).
 */
function countWhole(values: Float32Array, keep: Uint8Array, runs: MaskRuns | null, counts: Uint32Array): boolean {
  if (runs) {
    // A run at a time; a long run is counted in blocks, so a bad value ends the count soon.
    for (let r = 0; r < runs.count; r++) {
      for (let from = runs.start[r], end = runs.end[r]; from < end; from += BLOCK) {
        if (countRange(values, from, Math.min(end, from + BLOCK), counts) !== 0) return false;
      }
    }
    return true;
  }
  const n = Math.min(values.length, keep.length);
  for (let start = 0; start < n; start += BLOCK) {
    if (countWhereKept(values, keep, start, Math.min(n, start + BLOCK), counts) !== 0) return false;
  }
  return true;
}

/** countWhole over values[from..end): nonzero when a value was not a whole number 0…65 535. */
function countRange(values: Float32Array, from: number, end: number, counts: Uint32Array): number {
  let bad = 0;
  let i = from;
  for (; i + 3 < end; i += 4) {
    const v0 = values[i];
    const v1 = values[i + 1];
    const v2 = values[i + 2];
    const v3 = values[i + 3];
    const u0 = v0 & 0xffff;
    const u1 = v1 & 0xffff;
    const u2 = v2 & 0xffff;
    const u3 = v3 & 0xffff;
    bad |= +(u0 !== v0) | +(u1 !== v1) | +(u2 !== v2) | +(u3 !== v3);
    counts[u0 << 2]++;
    counts[(u1 << 2) | 1]++;
    counts[(u2 << 2) | 2]++;
    counts[(u3 << 2) | 3]++;
  }
  for (; i < end; i++) {
    const v = values[i];
    const u = v & 0xffff;
    bad |= +(u !== v);
    counts[u << 2]++;
  }
  return bad;
}

/** countWhole over the kept pixels of [start, end): nonzero when a value was not a whole number 0…65 535. */
function countWhereKept(values: Float32Array, keep: Uint8Array, start: number, end: number, counts: Uint32Array): number {
  let bad = 0;
  for (let i = start; i < end; i++) {
    if (keep[i] === 0) continue;
    const v = values[i];
    const u = v & 0xffff;
    bad |= +(u !== v);
    counts[(u << 2) | (i & 3)]++;
  }
  return bad;
}

/** The four lanes of countWhole's counts added up per value (65 536 slots). */
function laneTotals(counts: Uint32Array): Uint32Array {
  const out = new Uint32Array(65_536);
  for (let v = 0; v < 65_536; v++) out[v] = counts[4 * v] + counts[4 * v + 1] + counts[4 * v + 2] + counts[4 * v + 3];
  return out;
}

/** The value (slot) of 0-based rank `rank` among the counted values. */
function valueAtRank(counts: Uint32Array, rank: number): number {
  let slot = 0;
  let seen = counts[0];
  while (seen <= rank) seen += counts[++slot];
  return slot;
}

/** True when one of the kept values is −0 (which `& 0xffff` counts as 0); the runs, when given, are keep's. */
function hasNegativeZero(values: Float32Array, keep: Uint8Array): boolean {
  for (let i = 0; i < Math.min(values.length, keep.length); i++) if (keep[i] !== 0 && Object.is(values[i], -0)) return true;
  return false;
}

/**
 * The median (mean of the two middle values for an even count) of the values at the kept pixels (keep[i] ≠ 0) and
 * their count, when every such value is a whole number in 0…65 535; null otherwise (and when there is none), so the
 * caller falls back to maskedMedian. One counting pass over the kept pixels — over `runs` = maskRuns(keep, true)
 * when given (made once for many images), so no pixel outside them is visited — then a walk over 65 536 counts:
 * exact, and the same number maskedMedian gives for the same values (a middle value of 0 is +0 unless a −0 is among
 * them; then it is null too).
 */
export function wholeNumberMedian(values: Float32Array, keep: Uint8Array, runs: MaskRuns | null = null): { median: number; count: number } | null {
  const lanes = new Uint32Array(4 * 65_536);
  if (!countWhole(values, keep, runs, lanes)) return null;
  const counts = laneTotals(lanes);
  let n = 0;
  for (let b = 0; b < 65_536; b++) n += counts[b];
  if (n === 0) return null;
  const hiRank = n >> 1;
  const upper = valueAtRank(counts, hiRank);
  const lower = n % 2 === 1 ? upper : valueAtRank(counts, hiRank - 1);
  if ((lower === 0 || upper === 0) && hasNegativeZero(values, keep)) return null;
  return { median: n % 2 === 1 ? upper : (lower + upper) / 2, count: n };
}

/** The value of 0-based rank `rank` among the samples counted in the four lanes of countSamples: the lanes are
 *  added up only for the values up to it (a background's median lies low, so few of the 65 536 slots are read). */
function sampleAtRank(lanes: Uint32Array, rank: number): number {
  let v = 0;
  let seen = lanes[0] + lanes[65_536] + lanes[131_072] + lanes[196_608];
  while (seen <= rank) {
    v++;
    seen += lanes[v] + lanes[v + 65_536] + lanes[v + 131_072] + lanes[v + 196_608];
  }
  return v;
}

/** Sets the four lanes back to zero, given that they hold `n` counts in all: only the slots up to the largest counted
 *  value are visited (a background's values lie low), not all 262 144. */
function clearCounts(lanes: Uint32Array, n: number): void {
  let left = n;
  for (let v = 0; left > 0 && v < 65_536; v++) {
    left -= lanes[v] + lanes[v + 65_536] + lanes[v + 131_072] + lanes[v + 196_608];
    lanes[v] = 0; lanes[v + 65_536] = 0; lanes[v + 131_072] = 0; lanes[v + 196_608] = 0;
  }
}

/** Length of the counts sampleMedian uses (four lanes of 65 536 values); a scratch array lent to it has this length. */
export const SAMPLE_COUNTS = 4 * 65_536;

/**
 * The median (mean of the two middle values for an even count) and count of decoded 8- or 16-bit samples at the
 * pixels of `runs` (maskRuns of a 0/1 mask, made once for many planes), or null when the runs hold no pixel. One
 * counting pass over the samples themselves — half the bytes of their float copy, and no whole-number test, as every
 * sample is one — then a walk over the counts up to the middle: the same number as wholeNumberMedian and
 * maskedMedian give for the same values as floats (a sample is never −0). `scratch`, an array of SAMPLE_COUNTS
 * zeros, is used for the counts when given, and is all zeros again when this returns.
 */
export function sampleMedian(samples: Uint8Array | Uint16Array, runs: MaskRuns, scratch: Uint32Array | null = null): { median: number; count: number } | null {
  // A caller measuring plane after plane lends its counts, all zero, and gets them back all zero: a new 1 MiB array
  // per plane makes V8 collect garbage more often, and zeroing all of it per plane costs more than clearing the few
  // slots a background's values use.
  const lanes = scratch !== null && scratch.length === SAMPLE_COUNTS ? scratch : new Uint32Array(SAMPLE_COUNTS);
  return medianOfCounted(lanes, countSamples(samples, runs, lanes));
}

/** The median and count of the n samples counted in the lanes, which are then all zero again; null when n is 0. */
function medianOfCounted(lanes: Uint32Array, n: number): { median: number; count: number } | null {
  if (n === 0) return null;
  const hiRank = n >> 1;
  const upper = sampleAtRank(lanes, hiRank);
  const lower = n % 2 === 1 ? upper : sampleAtRank(lanes, hiRank - 1);
  clearCounts(lanes, n);
  return { median: n % 2 === 1 ? upper : (lower + upper) / 2, count: n };
}

/** sampleMedian over the runs of a RunCounter (made once for a series of planes): the same number. */
export function counterMedian(counter: RunCounter, samples: Uint8Array | Uint16Array): { median: number; count: number } | null {
  return medianOfCounted(counter.lanes, counter.count(samples));
}
