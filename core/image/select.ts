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
  if (a instanceof Float32Array && n >= 65_536) {
    const upper = kthByBuckets(a, n >> 1);
    return n % 2 === 1 ? upper : (kthByBuckets(a, (n >> 1) - 1) + upper) / 2;
  }
  const upper = selectKth(a, n >> 1);
  if (n % 2 === 1) return upper;
  let lower = -Infinity;
  for (let i = 0; i < n >> 1; i++) if (a[i] > lower) lower = a[i];
  return (lower + upper) / 2;
}

/** Float32 bit pattern mapped to an unsigned key with the same order as the (non-NaN) values. */
function orderKey(bits: number): number {
  return (bits & 0x80000000 ? ~bits : bits | 0x80000000) >>> 0;
}

/**
 * k-th smallest of many Float32 values without moving them: a histogram of the top 16 bits of the order keys finds
 * the bucket holding rank k, then selection runs on that bucket's few values only. Exact; two linear passes.
 */
function kthByBuckets(a: Float32Array, k: number): number {
  const bits = new Uint32Array(a.buffer, a.byteOffset, a.length);
  const counts = new Uint32Array(65_536);
  for (let i = 0; i < bits.length; i++) counts[orderKey(bits[i]) >>> 16]++;
  let bucket = 0;
  let below = 0;
  while (below + counts[bucket] <= k) below += counts[bucket++];
  const members = new Float32Array(counts[bucket]);
  for (let i = 0, m = 0; i < bits.length; i++) if (orderKey(bits[i]) >>> 16 === bucket) members[m++] = a[i];
  return selectKth(members, k - below);
}
