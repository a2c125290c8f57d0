// Parameter covariance s²·(JᵀJ)⁻¹ at the solution, computed through QR of the column-scaled Jacobian.
import { householderQr, inverseGramFromR } from './least-squares-qr';

/**
 * (JᵀJ)⁻¹ for J (rows × cols, row-major). Columns are scaled to unit norm first so that parameters of very
 * different magnitude do not spoil the factorisation; null when J is rank deficient.
 */
export function inverseNormalMatrix(j: Float64Array, rows: number, cols: number): number[][] | null {
  const scale = new Float64Array(cols);
  for (let k = 0; k < cols; k++) {
    let s = 0;
    for (let i = 0; i < rows; i++) s += j[i * cols + k] ** 2;
    scale[k] = Math.sqrt(s);
    if (!(scale[k] > 0) || !Number.isFinite(scale[k])) return null;
  }
  const scaled = new Float64Array(j.length);
  for (let i = 0; i < rows; i++) for (let k = 0; k < cols; k++) scaled[i * cols + k] = j[i * cols + k] / scale[k];
  const { r } = householderQr(scaled, new Float64Array(rows), rows, cols);
  // Relative pivot test: with unit-norm columns a pivot below 1e-10 of the largest means the columns are
  // dependent up to the rounding error of a finite-difference Jacobian (~1e-11); no standard error is meaningful.
  let largest = 0;
  for (let k = 0; k < cols; k++) largest = Math.max(largest, Math.abs(r[k * cols + k]));
  for (let k = 0; k < cols; k++) if (!(Math.abs(r[k * cols + k]) > 1e-10 * largest)) return null;
  const inv = inverseGramFromR(r, cols);
  if (!inv) return null;
  return Array.from({ length: cols }, (_, a) =>
    Array.from({ length: cols }, (_, b) => inv[a * cols + b] / (scale[a] * scale[b])));
}
