// Intensity histograms and automatic display ranges.
import type { Plane } from '../../core/model';

/** Smallest and largest finite value of a plane ([0, 0] when it has none). */
export function dataRange(plane: Plane): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (const v of plane.data) { if (v < lo) lo = v; if (v > hi) hi = v; }
  return Number.isFinite(lo) && Number.isFinite(hi) ? [lo, hi] : [0, 0];
}

/** Counts in `bins` equal bins over [lo, hi] (values outside are dropped; hi falls in the last bin). */
export function histogramCounts(plane: Plane, bins: number, lo: number, hi: number): Uint32Array {
  const counts = new Uint32Array(bins);
  const span = hi - lo;
  if (!(span > 0)) { counts[0] = plane.data.length; return counts; }
  for (const v of plane.data) {
    if (!(v >= lo && v <= hi)) continue;
    counts[Math.min(bins - 1, Math.floor(((v - lo) / span) * bins))] += 1;
  }
  return counts;
}

/** Display range that clips `clipFraction` of pixels at each end (common practice: 0.1–0.5 %), from a 4096-bin histogram. */
export function autoDisplayRange(plane: Plane, clipFraction = 0.002): [number, number] {
  const [lo, hi] = dataRange(plane);
  if (hi <= lo) return [lo, lo + 1];
  const bins = 4096;
  const counts = histogramCounts(plane, bins, lo, hi);
  const total = counts.reduce((s, c) => s + c, 0);
  const edge = (from: number, step: number) => {
    let acc = 0;
    for (let b = from; b >= 0 && b < bins; b += step) { acc += counts[b]; if (acc > total * clipFraction) return b; }
    return from;
  };
  const bLo = edge(0, 1), bHi = edge(bins - 1, -1);
  const w = (hi - lo) / bins;
  return bHi > bLo ? [lo + bLo * w, lo + (bHi + 1) * w] : [lo, hi];
}

/** Display range after a key on the low or high handle: arrows step 1% of the data span (Shift: 10%), Home/End jump to
 *  the data's ends; the handles never cross. Null for keys that do not move a handle. */
export function displayRangeAfterKey(
  handle: 'low' | 'high', key: string, shift: boolean,
  range: { low: number; high: number }, data: { lo: number; hi: number },
): { low: number; high: number } | null {
  const span = data.hi - data.lo || 1;
  const step = { ArrowLeft: -1, ArrowDown: -1, ArrowRight: 1, ArrowUp: 1 }[key];
  const current = handle === 'low' ? range.low : range.high;
  let next: number;
  if (step !== undefined) next = current + step * span * (shift ? 0.1 : 0.01);
  else if (key === 'Home') next = data.lo;
  else if (key === 'End') next = data.hi;
  else return null;
  next = Math.min(data.hi, Math.max(data.lo, next));
  return handle === 'low' ? { low: Math.min(next, range.high), high: range.high } : { low: range.low, high: Math.max(next, range.low) };
}
