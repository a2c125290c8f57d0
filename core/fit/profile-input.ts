// Shared input handling of the boundary finders: checks lengths, keeps the finite points in order.
import { FitError } from './fit-error';

/** The finite (x/EL, value) pairs of a profile, in input order. */
export interface FinitePoints {
  readonly xEl: Float64Array;
  readonly y: Float64Array;
  /** Index of each kept point in the input arrays. */
  readonly index: Int32Array;
}

/**
 * Checks that xEl and y have equal length and drops points where either is NaN/Infinity (empty bins), so that
 * one empty bin does not cost the whole boundary. Throws FitError('bad-input') naming `name` on a length mismatch.
 */
export function finitePoints(xEl: ArrayLike<number>, y: ArrayLike<number>, name: string): FinitePoints {
  if (xEl.length !== y.length) {
    throw new FitError('bad-input', `${name}: xEl and y differ in length (${xEl.length} vs ${y.length})`);
  }
  const xs: number[] = [], ys: number[] = [], kept: number[] = [];
  for (let i = 0; i < y.length; i++) {
    if (Number.isFinite(xEl[i]) && Number.isFinite(y[i])) { xs.push(xEl[i]); ys.push(y[i]); kept.push(i); }
  }
  return { xEl: Float64Array.from(xs), y: Float64Array.from(ys), index: Int32Array.from(kept) };
}

/** Centred moving average over `bins` points (odd, ≥ 1), shrinking the window at the ends. */
export function movingAverage(y: Float64Array, bins: number): Float64Array {
  if (bins <= 1) return Float64Array.from(y);
  const half = Math.floor(bins / 2);
  return y.map((_, i) => {
    const lo = Math.max(0, i - half), hi = Math.min(y.length - 1, i + half);
    let s = 0;
    for (let k = lo; k <= hi; k++) s += y[k];
    return s / (hi - lo + 1);
  });
}
