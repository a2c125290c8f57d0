// Starting values for y = A0·exp(−k·(x − xRef)) + B by variable projection: for each trial decay rate k on a
// grid, A0 and B follow from a linear least-squares solve; the k with the smallest residual wins. This needs no
// guess from the user and cannot fail on noisy or rising profiles the way a log-linear fit can.
import { solveLeastSquares } from './least-squares-qr';

/** A starting point (A0 at xRef, k in 1/µm, B) and its weighted sum of squares. */
export interface ExponentialStart {
  readonly a0: number;
  readonly k: number;
  readonly b: number;
  readonly rss: number;
}

/** Linear solve for (A0, B) at a fixed k; null if the two basis columns are dependent. `a` (2n values) and `b` (n)
 *  are working space, overwritten. */
function linearPart(xUm: Float64Array, y: Float64Array, sqrtW: Float64Array, xRef: number, k: number, a: Float64Array, b: Float64Array): ExponentialStart | null {
  const n = xUm.length;
  for (let i = 0; i < n; i++) {
    a[2 * i] = sqrtW[i] * Math.exp(-k * (xUm[i] - xRef));
    a[2 * i + 1] = sqrtW[i];
    b[i] = sqrtW[i] * y[i];
  }
  const solution = solveLeastSquares(a, b, n, 2);
  if (!solution) return null;
  let rss = 0;
  for (let i = 0; i < n; i++) rss += (b[i] - a[2 * i] * solution[0] - a[2 * i + 1] * solution[1]) ** 2;
  return Number.isFinite(rss) ? { a0: solution[0], k, b: solution[1], rss } : null;
}

/**
 * Best start over decay lengths λ = 1/|k| from spanUm/50 to 50·spanUm (log-spaced, 32 per sign), both falling
 * (k > 0) and rising (k < 0). Returns null only if no grid point gives a finite solution.
 */
export function exponentialStart(xUm: Float64Array, y: Float64Array, sqrtW: Float64Array, xRef: number): ExponentialStart | null {
  let span = 0;
  for (let i = 0; i < xUm.length; i++) span = Math.max(span, Math.abs(xUm[i] - xRef));
  if (!(span > 0)) return null;
  let best: ExponentialStart | null = null;
  const steps = 32;
  // One working space for the 64 trial solves (each writes all of it first).
  const a = new Float64Array(2 * xUm.length), b = new Float64Array(xUm.length);
  for (let s = 0; s < steps; s++) {
    const lambda = (span / 50) * 2500 ** (s / (steps - 1));
    for (const sign of [1, -1]) {
      const trial = linearPart(xUm, y, sqrtW, xRef, sign / lambda, a, b);
      if (trial && (!best || trial.rss < best.rss)) best = trial;
    }
  }
  return best;
}
