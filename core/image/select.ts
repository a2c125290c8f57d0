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
  const even = new Uint32Array(65_536);
  const odd = new Uint32Array(65_536);
  const n = a.length;
  let i = 0;
  for (; i + 1 < n; i += 2) { even[bucketOf(bits[i])]++; odd[bucketOf(bits[i + 1])]++; }
  if (i < n) even[bucketOf(bits[i])]++;
  for (let b = 0; b < 65_536; b++) even[b] += odd[b];
  return middleFromBuckets(a, even);
}

/** The median of middleByBuckets once the bucket counts of all n values of `a` are known. */
function middleFromBuckets(a: Float32Array, counts: Uint32Array): number {
  const n = a.length;
  const hiRank = n >> 1;
  const loRank = n % 2 === 1 ? hiRank : hiRank - 1;
  const bits = new Uint32Array(a.buffer, a.byteOffset, n);
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
 * The gathering pass also counts the buckets middleByBuckets needs, so large sets take one pass fewer.
 */
export function maskedMedian(values: Float32Array, keep: Uint8Array): { median: number; count: number } {
  const len = Math.min(values.length, keep.length);
  const kept = new Float32Array(len);
  const bits = new Uint32Array(values.buffer, values.byteOffset, values.length);
  // Two count arrays in turn (even and odd kept values), as in middleByBuckets.
  const counts = new Uint32Array(2 * 65_536);
  let n = 0;
  for (let i = 0; i < len; i++) {
    if (keep[i] === 0) continue;
    const v = values[i];
    // v − v is 0 exactly for finite v and NaN for NaN and ±Infinity.
    if (v - v !== 0) continue;
    counts[((n & 1) << 16) | bucketOf(bits[i])]++;
    kept[n++] = v;
  }
  const sel = kept.subarray(0, n);
  if (n < 65_536) return { median: medianInPlace(sel), count: n };
  const total = counts.subarray(0, 65_536);
  for (let b = 0; b < 65_536; b++) total[b] += counts[65_536 + b];
  return { median: middleFromBuckets(sel, total), count: n };
}
