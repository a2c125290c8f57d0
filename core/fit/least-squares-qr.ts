// Householder QR for small dense least-squares problems (rows × cols, cols ≤ ~10), row-major Float64Array.
// QR is used instead of the normal equations because it keeps the full double precision on ill-conditioned
// Jacobians (the condition number is not squared).

/** Upper-triangular R (cols × cols, row-major) and Qᵀb from a Householder factorisation of A. */
export interface QrResult {
  readonly r: Float64Array;
  readonly qtb: Float64Array;
  readonly cols: number;
}

/** Factorises A (rows × cols, row-major, rows ≥ cols) and applies Qᵀ to b; A and b are not modified. */
export function householderQr(a: Float64Array, b: Float64Array, rows: number, cols: number): QrResult {
  const m = Float64Array.from(a);
  const v = Float64Array.from(b);
  for (let k = 0; k < cols; k++) {
    const norm = columnNorm(m, rows, cols, k);
    if (norm === 0) continue;
    const alpha = m[k * cols + k] > 0 ? -norm : norm;
    // Householder vector u = x − alpha·e1, stored in place in column k (rows k..end).
    m[k * cols + k] -= alpha;
    let uu = 0;
    for (let i = k; i < rows; i++) uu += m[i * cols + k] * m[i * cols + k];
    for (let j = k + 1; j < cols; j++) {
      let dot = 0;
      for (let i = k; i < rows; i++) dot += m[i * cols + k] * m[i * cols + j];
      const factor = (2 * dot) / uu;
      for (let i = k; i < rows; i++) m[i * cols + j] -= factor * m[i * cols + k];
    }
    let dot = 0;
    for (let i = k; i < rows; i++) dot += m[i * cols + k] * v[i];
    const factor = (2 * dot) / uu;
    for (let i = k; i < rows; i++) v[i] -= factor * m[i * cols + k];
    m[k * cols + k] = alpha;
    for (let i = k + 1; i < rows; i++) m[i * cols + k] = 0;
  }
  const r = new Float64Array(cols * cols);
  for (let i = 0; i < cols; i++) for (let j = i; j < cols; j++) r[i * cols + j] = m[i * cols + j];
  return { r, qtb: v.slice(0, cols), cols };
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
