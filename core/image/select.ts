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

/** Median of the values (mean of the two middle values for an even count); reorders `a`; NaN when empty. */
export function medianInPlace(a: Float32Array | Float64Array): number {
  const n = a.length;
  if (n === 0) return NaN;
  const upper = selectKth(a, n >> 1);
  if (n % 2 === 1) return upper;
  let lower = -Infinity;
  for (let i = 0; i < n >> 1; i++) if (a[i] > lower) lower = a[i];
  return (lower + upper) / 2;
}
