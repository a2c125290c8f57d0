// Order statistics without sorting (Hoare's selection with median-of-three pivots): O(n) on average.

/** Rearrange `a` in place so a[k] is the k-th smallest (0-based) value; returns it. */
export function selectKth(a: Float32Array | Float64Array, k: number): number {
  if (!(k >= 0 && k < a.length)) throw new Error(`k must be in 0..${a.length - 1}, got ${k}`);
  let lo = 0;
  let hi = a.length - 1;
  while (hi > lo) {
    const mid = (lo + hi) >> 1;
    // Median of three as pivot keeps sorted input from the quadratic worst case.
    if (a[mid] < a[lo]) swap(a, mid, lo);
    if (a[hi] < a[lo]) swap(a, hi, lo);
    if (a[hi] < a[mid]) swap(a, hi, mid);
    const pivot = a[mid];
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) { swap(a, i, j); i++; j--; }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return a[k];
  }
  return a[k];
}

function swap(a: Float32Array | Float64Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}

/** Median of the values (mean of the two middle values for an even count); may reorder `a`; NaN when empty. */
export function medianInPlace(a: Float32Array | Float64Array): number {
  const n = a.length;
  if (n === 0) return NaN;
  if (a instanceof Float32Array && n >= 65_536) return middleByBuckets(a);
  const upper = selectKth(a, n >> 1);
  if (n % 2 === 1) return upper;
  let lower = -Infinity;
  for (let i = 0; i < n >> 1; i++) if (a[i] > lower) lower = a[i];
  return (lower + upper) / 2;
}

/**
 * Top 16 bits of the order key of a Float32 bit pattern: an unsigned key with the same order as the (non-NaN)
 * values (all bits flipped for a negative value, only the sign bit for others), found without a branch.
 */
function bucketOf(bits: number): number {
  return (bits >>> 16) ^ (((bits >> 31) & 0x7fff) | 0x8000);
}

/**
 * Median of many Float32 values without moving them: a histogram of the top 16 bits of the order keys finds the
 * bucket(s) holding the middle rank(s), then selection runs on those buckets' few values only. Exact; two passes.
 */
function middleByBuckets(a: Float32Array): number {
  const bits = new Uint32Array(a.buffer, a.byteOffset, a.length);
  // Two count arrays in turn (even and odd positions) break the chain of dependent increments.
  const counts = new Uint32Array(65_536);
  const odd = new Uint32Array(65_536);
  const n = a.length;
  let j = 0;
  for (; j + 1 < n; j += 2) { counts[bucketOf(bits[j])]++; odd[bucketOf(bits[j + 1])]++; }
  if (j < n) counts[bucketOf(bits[j])]++;
  for (let b = 0; b < 65_536; b++) counts[b] += odd[b];
  const hiRank = n >> 1;
  const loRank = n % 2 === 1 ? hiRank : hiRank - 1;
  let b1 = 0;
  let below = 0;
  while (below + counts[b1] <= loRank) below += counts[b1++];
  // Ranks loRank and hiRank are consecutive, so any buckets between theirs are empty.
  let b2 = b1;
  let upTo = below + counts[b1];
  while (upTo <= hiRank) upTo += counts[++b2];
  const members = new Float32Array(upTo - below);
  const span = b2 - b1;
  for (let i = 0, m = 0; i < n; i++) if ((bucketOf(bits[i]) - b1) >>> 0 <= span) members[m++] = a[i];
  const upper = selectKth(members, hiRank - below);
  if (loRank === hiRank) return upper;
  let lower = -Infinity;
  for (let i = 0; i < hiRank - below; i++) if (members[i] > lower) lower = members[i];
  return (lower + upper) / 2;
}

/**
 * Median (as medianInPlace) of the finite values[i] where keep[i] ≠ 0, and how many there are; NaN when none.
 * Large sets (≥ 65 536 values) are not gathered at all: a radix selection on the values' 32-bit order keys (see
 * bucketOf) counts the top 16 bits in one pass, then the low 16 bits of the one or two buckets holding the middle
 * ranks in a second pass, which pins the middle values exactly.
 */
export function maskedMedian(values: Float32Array, keep: Uint8Array): { median: number; count: number } {
  const len = Math.min(values.length, keep.length);
  const bits = new Uint32Array(values.buffer, values.byteOffset, values.length);
  // Non-finite values are counted too: their buckets (see FIRST_FINITE_BUCKET) hold no finite value, so they are
  // left out below without a test per pixel. The loops are functions of their own (see "Pixel loops in small
  // functions" in DEVELOPERS.md).
  const total = new Uint32Array(65_536);
  countKeptBuckets(bits, keep, len, total);
  const n = countInBuckets(total, FIRST_FINITE_BUCKET, LAST_FINITE_BUCKET);
  if (n === 0) return { median: NaN, count: 0 };
  if (n < 65_536) return { median: medianInPlace(gatherKept(values, keep, len, n)), count: n };
  const hiRank = n >> 1;
  const loRank = n % 2 === 1 ? hiRank : hiRank - 1;
  const found = new Int32Array(3);
  middleBuckets(total, loRank, hiRank, found);
  const b1 = found[0];
  const b2 = found[1];
  const below = found[2];
  const low = lowKeyCounts(bits, keep, len, b1, b2);
  const lower = rankedValue(low, b1, b2, loRank - below);
  if (loRank === hiRank) return { median: lower, count: n };
  return { median: (lower + rankedValue(low, b1, b2, hiRank - below)) / 2, count: n };
}

/**
 * The buckets (bucketOf) of finite Float32 values lie in FIRST_FINITE_BUCKET..LAST_FINITE_BUCKET: −Infinity and
 * negative NaNs fall below, +Infinity and positive NaNs above (their exponent bits are all ones).
 */
const FIRST_FINITE_BUCKET = 0x0080;
const LAST_FINITE_BUCKET = 0xff7f;

/** total[bucketOf(bits[i])] += 1 for every i < len with keep[i] ≠ 0. */
function countKeptBuckets(bits: Uint32Array, keep: Uint8Array, len: number, total: Uint32Array): void {
  for (let i = 0; i < len; i++) if (keep[i] !== 0) total[bucketOf(bits[i])]++;
}

/** Sum of counts[first..last]. */
function countInBuckets(counts: Uint32Array, first: number, last: number): number {
  let n = 0;
  for (let b = first; b <= last; b++) n += counts[b];
  return n;
}

/**
 * The finite bucket b1 holding rank loRank of the counted values, the bucket b2 holding rank hiRank (b1 or the next
 * non-empty one: the ranks are consecutive) and the count below b1, into found = [b1, b2, below].
 */
function middleBuckets(total: Uint32Array, loRank: number, hiRank: number, found: Int32Array): void {
  let b1 = FIRST_FINITE_BUCKET;
  let below = 0;
  while (below + total[b1] <= loRank) below += total[b1++];
  let b2 = b1;
  if (below + total[b1] <= hiRank) { b2 += 1; while (total[b2] === 0) b2++; }
  found[0] = b1;
  found[1] = b2;
  found[2] = below;
}

/** The n finite values[i] with keep[i] ≠ 0, in order. */
function gatherKept(values: Float32Array, keep: Uint8Array, len: number, n: number): Float32Array {
  const out = new Float32Array(n);
  for (let i = 0, k = 0; i < len; i++) if (keep[i] !== 0 && values[i] - values[i] === 0) out[k++] = values[i];
  return out;
}

/**
 * Counts of the low 16 bits of the order keys of the kept values in the finite bucket b1 (slots 0..65 535) and, when
 * b2 ≠ b1, in bucket b2 (slots 65 536..131 071). The low 16 bits of the order key are the value's low 16 bits,
 * all flipped for a negative value. Without a branch per pixel (whether a value falls in b1 or b2 follows no
 * pattern): a pixel that is not kept or lies in another bucket is counted in a spare slot (131 072) instead.
 * Exactly the counts of the plain loop with tests (select-masked.test.ts).
 */
export function lowKeyCounts(bits: Uint32Array, keep: Uint8Array, len: number, b1: number, b2: number): Uint32Array {
  const low = new Uint32Array(2 * 65_536 + 1);
  const spare = 2 * 65_536;
  for (let i = 0; i < len; i++) {
    const v = bits[i];
    const b = bucketOf(v);
    const hit = -(+(keep[i] !== 0) & (+(b === b1) | +(b === b2)));
    const slot = (+(b !== b1) << 16) | ((v & 0xffff) ^ ((v >> 31) & 0xffff));
    low[(slot & hit) | (spare & ~hit)]++;
  }
  return low;
}

/** The value of rank `rank` (0-based) among the values counted by lowKeyCounts (bucket b1 first, then b2). */
function rankedValue(low: Uint32Array, b1: number, b2: number, rank: number): number {
  let slot = 0;
  let seen = low[0];
  while (seen <= rank) seen += low[++slot];
  const key = ((slot < 65_536 ? b1 : b2) << 16 | (slot & 0xffff)) >>> 0;
  // Back from the order key to the float's bits: only the sign bit was flipped for a positive value, all bits for
  // a negative one.
  const out = new Uint32Array([key >= 0x8000_0000 ? key ^ 0x8000_0000 : ~key]);
  return new Float32Array(out.buffer)[0];
}
