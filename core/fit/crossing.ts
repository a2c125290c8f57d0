// Boundaries as level crossings of a profile: half-way between its robust minimum and maximum, or at a chosen
// fraction of that range, or at an absolute level. x/EL positions are linearly interpolated between bin centres.
import { quantile } from '../stats';
import { FitError } from './fit-error';
import { finitePoints, movingAverage } from './profile-input';

/** Where a profile crosses a level (positionEl null, with a note, when it never does). */
export interface CrossingResult {
  readonly positionEl: number | null;
  /** 'falling' when the profile is higher anterior (smaller x/EL) of the crossing. */
  readonly direction: 'rising' | 'falling' | null;
  /** The level crossed (profile units). */
  readonly level: number;
  /** How many crossings there were; the one nearest the steepest change is reported. */
  readonly crossings: number;
  readonly note: string | null;
}

/** Options of the crossing finders. */
export interface CrossingOptions {
  /** Width of a centred moving average applied first (odd, ≥ 1; 1 = none). @default 1 */
  readonly smoothBins?: number;
}

/** Robust range ends: the 5th and 95th percentiles, so single hot or dead bins do not set the level. */
const LOW_QUANTILE = 0.05;
const HIGH_QUANTILE = 0.95;

/** A threshold as a fraction of the robust range (0..1) or an absolute level in profile units. */
export type Threshold = number | { readonly absolute: number };

function checkSmoothing(options: CrossingOptions, name: string): number {
  const bins = options.smoothBins ?? 1;
  if (!(Number.isInteger(bins) && bins >= 1 && bins % 2 === 1)) {
    throw new FitError('bad-input', `${name}: smoothBins must be an odd integer ≥ 1, got ${bins}`);
  }
  return bins;
}

/** Linear interpolation of the x where the segment (x0, y0)–(x1, y1) meets `level`. */
function interpolate(x0: number, y0: number, x1: number, y1: number, level: number): number {
  return y1 === y0 ? (x0 + x1) / 2 : x0 + ((level - y0) * (x1 - x0)) / (y1 - y0);
}

/** All crossings of `level` with the segment index each lies on (a point exactly at the level counts once). */
function findCrossings(x: Float64Array, y: Float64Array, level: number): { x: number; segment: number; falling: boolean }[] {
  const out: { x: number; segment: number; falling: boolean }[] = [];
  for (let i = 0; i + 1 < y.length; i++) {
    const a = y[i] - level, b = y[i + 1] - level;
    // Half-open test (a ≥ 0 > b or a < 0 ≤ b) so a bin sitting exactly on the level is not counted twice.
    if ((a >= 0 && b < 0) || (a < 0 && b >= 0)) {
      out.push({ x: interpolate(x[i], y[i], x[i + 1], y[i + 1], level), segment: i, falling: b < a });
    }
  }
  return out;
}

/** Bins of the light smoothing (centred moving average) the steepest change is read from. */
export const STEEPEST_SMOOTH_BINS = 3;

/**
 * Index of the segment with the largest absolute change between neighbouring bins of the profile after a light
 * 3-bin moving average, so that one noisy bin (a hot pixel cluster, a nucleus on a bin edge) does not pass for the
 * boundary's edge when there are several crossings.
 */
export function steepestSegment(y: Float64Array): number {
  const s = movingAverage(y, STEEPEST_SMOOTH_BINS);
  let best = 0;
  for (let i = 1; i + 1 < s.length; i++) if (Math.abs(s[i + 1] - s[i]) > Math.abs(s[best + 1] - s[best])) best = i;
  return best;
}

/**
 * Where the profile crosses `threshold` (a fraction of its robust range, or { absolute }). Non-finite bins are
 * skipped. With several crossings the one nearest the steepest change of the lightly smoothed profile is reported.
 */
export function thresholdCrossing(
  xEl: ArrayLike<number>, y: ArrayLike<number>, threshold: Threshold, options: CrossingOptions = {},
): CrossingResult {
  const name = 'thresholdCrossing';
  const bins = checkSmoothing(options, name);
  const absolute = typeof threshold === 'object' ? threshold.absolute : null;
  if (absolute === null ? !(typeof threshold === 'number' && threshold > 0 && threshold < 1) : !Number.isFinite(absolute)) {
    throw new FitError('bad-input', `${name}: threshold must be a fraction between 0 and 1 (exclusive) or { absolute: number }, got ${JSON.stringify(threshold)}`);
  }
  const points = finitePoints(xEl, y, name);
  if (points.y.length < 2) {
    return { positionEl: null, direction: null, level: NaN, crossings: 0, note: 'fewer than 2 finite bins in the profile' };
  }
  const smooth = movingAverage(points.y, bins);
  const low = quantile(smooth, LOW_QUANTILE), high = quantile(smooth, HIGH_QUANTILE);
  const level = absolute ?? low + (threshold as number) * (high - low);
  const crossings = high > low || absolute !== null ? findCrossings(points.xEl, smooth, level) : [];
  if (crossings.length === 0) {
    return { positionEl: null, direction: null, level, crossings: 0, note: `the profile never crosses the level ${level.toPrecision(4)}` };
  }
  const steepest = steepestSegment(smooth);
  const chosen = crossings.reduce((a, c) => (Math.abs(c.segment - steepest) < Math.abs(a.segment - steepest) ? c : a));
  return {
    positionEl: chosen.x, direction: chosen.falling ? 'falling' : 'rising', level, crossings: crossings.length,
    note: crossings.length > 1 ? `${crossings.length} crossings; the one nearest the steepest change is reported` : null,
  };
}

/** The half-maximum crossing: the threshold half-way between the robust minimum and maximum. */
export function halfMaxCrossing(xEl: ArrayLike<number>, y: ArrayLike<number>, options: CrossingOptions = {}): CrossingResult {
  try {
    return thresholdCrossing(xEl, y, 0.5, options);
  } catch (e) {
    if (e instanceof FitError) throw new FitError(e.code, e.message.replace(/^thresholdCrossing: /, 'halfMaxCrossing: '));
    throw e;
  }
}
