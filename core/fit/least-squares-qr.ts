// Householder QR for small dense least-squares problems (rows × cols, cols ≤ ~10), row-major Float64Array.
// QR is used instead of the normal equations because it keeps the full double precision on ill-conditioned
// Jacobians (the condition number is not squared).

/** Upper-triangular R (cols × cols, row-major) and Qᵀb from a Householder factorisation of A. */
export interface QrResult {
  readonly r: Float64Array;
  readonly qtb: Float64Array;
  readonly cols: number;
}

// Working copies of A and b, kept between calls: allocating a typed array larger than a few values is slow
// (an off-heap buffer each time) and the fits factorise hundreds of times per call. Safe because the
// factorisation is synchronous and calls nothing that could re-enter it.
let scratchA = new Float64Array(0);
let scratchB = new Float64Array(0);

/** Factorises A (rows × cols, row-major, rows ≥ cols) and applies Qᵀ to b; A and b are not modified. */
export function householderQr(a: Float64Array, b: Float64Array, rows: number, cols: number): QrResult {
  if (scratchA.length < rows * cols) scratchA = new Float64Array(rows * cols);
  if (scratchB.length < rows) scratchB = new Float64Array(rows);
  const m = scratchA, v = scratchB;
  m.set(a.subarray(0, rows * cols));
  v.set(b.subarray(0, rows));
  for (let k = 0; k < cols; k++) reflectColumn(m, v, rows, cols, k);
  const r = new Float64Array(cols * cols);
  for (let i = 0; i < cols; i++) for (let j = i; j < cols; j++) r[i * cols + j] = m[i * cols + j];
  return { r, qtb: v.slice(0, cols), cols };
}

/**
 * One Householder step in place: zeroes column k of m (rows × cols) below the diagonal and applies the same
 * reflection to the later columns and to v. Loops step through a column by `cols` (index i·cols + k).
 */
function reflectColumn(m: Float64Array, v: Float64Array, rows: number, cols: number, k: number): void {
  const norm = columnNorm(m, rows, cols, k);
  if (norm === 0) return;
  const diag = k * cols + k, end = rows * cols;
  const alpha = m[diag] > 0 ? -norm : norm;
  // Householder vector u = x − alpha·e1, stored in place in column k (rows k..end).
  m[diag] -= alpha;
  let uu = 0;
  for (let p = diag; p < end; p += cols) uu += m[p] * m[p];
  for (let j = k + 1; j < cols; j++) {
    let dot = 0;
    for (let p = diag, q = diag - k + j; p < end; p += cols, q += cols) dot += m[p] * m[q];
    const factor = (2 * dot) / uu;
    for (let p = diag, q = diag - k + j; p < end; p += cols, q += cols) m[q] -= factor * m[p];
  }
  let dot = 0;
  for (let p = diag, i = k; i < rows; p += cols, i++) dot += m[p] * v[i];
  const factor = (2 * dot) / uu;
  for (let p = diag, i = k; i < rows; p += cols, i++) v[i] -= factor * m[p];
  m[diag] = alpha;
  for (let p = diag + cols; p < end; p += cols) m[p] = 0;
}

/** Euclidean norm of column k from row k down, scaled by the largest entry so squares cannot overflow. */
function columnNorm(m: Float64Array, rows: number, cols: number, k: number): number {
  let largest = 0;
  for (let i = k; i < rows; i++) largest = Math.max(largest, Math.abs(m[i * cols + k]));
  if (largest === 0 || !Number.isFinite(largest)) return largest;
  let s = 0;
  for (let i = k; i < rows; i++) s += (m[i * cols + k] / largest) ** 2;
  return largest * Math.sqrt(s);
}

/** Solves R x = c by back substitution; returns null when R has a zero (or non-finite) pivot. */
export function solveUpperTriangular(r: Float64Array, c: Float64Array, cols: number): Float64Array | null {
  const x = new Float64Array(cols);
  for (let i = cols - 1; i >= 0; i--) {
    let s = c[i];
    for (let j = i + 1; j < cols; j++) s -= r[i * cols + j] * x[j];
    const pivot = r[i * cols + i];
    if (pivot === 0 || !Number.isFinite(pivot)) return null;
    x[i] = s / pivot;
  }
  return x;
}

/**
 * Least-squares solution of min ‖A x − b‖ (A rows × cols, row-major); null when A is rank deficient
 * (a pivot of R below 1e-14 of the largest, i.e. dependent columns up to rounding).
 */
export function solveLeastSquares(a: Float64Array, b: Float64Array, rows: number, cols: number): Float64Array | null {
  const { r, qtb } = householderQr(a, b, rows, cols);
  let largest = 0;
  for (let k = 0; k < cols; k++) largest = Math.max(largest, Math.abs(r[k * cols + k]));
  for (let k = 0; k < cols; k++) if (!(Math.abs(r[k * cols + k]) > 1e-14 * largest)) return null;
  return solveUpperTriangular(r, qtb, cols);
}

/** (RᵀR)⁻¹ = R⁻¹R⁻ᵀ for an upper-triangular R (cols × cols); null when R is singular. */
export function inverseGramFromR(r: Float64Array, cols: number): Float64Array | null {
  const rInv = new Float64Array(cols * cols);
  for (let j = 0; j < cols; j++) {
    const e = new Float64Array(cols);
    e[j] = 1;
    const column = solveUpperTriangular(r, e, cols);
    if (!column) return null;
    for (let i = 0; i < cols; i++) rInv[i * cols + j] = column[i];
  }
  const out = new Float64Array(cols * cols);
  for (let i = 0; i < cols; i++) {
    for (let j = 0; j < cols; j++) {
      let s = 0;
      for (let k = 0; k < cols; k++) s += rInv[i * cols + k] * rInv[j * cols + k];
      out[i * cols + j] = s;
    }
  }
  return out;
}
