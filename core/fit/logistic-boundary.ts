// A boundary as the midpoint of a logistic step: y = lower + (upper − lower) / (1 + exp((x − x0)/w)), x in x/EL.
// The fit runs on the unsigned parameters (L, U, x0, w) and the result is then put in a fixed form: lower < upper,
// width > 0, and the direction says which side is high.
import { quantile } from '../stats';
import { FitError } from './fit-error';
import { fitNonlinear } from './levenberg-marquardt';
import type { NonlinearFit } from './levenberg-marquardt';
import { halfMaxCrossing } from './crossing';
import { finitePoints } from './profile-input';
import { logistic, logisticStart } from './logistic-start';

/** A fitted logistic boundary (positions and width in x/EL; levels in profile units). */
export interface LogisticBoundary {
  readonly positionEl: number;
  readonly widthEl: number;
  readonly positionSeEl: number;
  /** 'falling' when the profile is high anterior of the boundary. */
  readonly direction: 'rising' | 'falling';
  readonly lower: number;
  readonly upper: number;
  readonly r2: number;
  /** Set when the step is sharper than the bin spacing (position is then the bracketing bins' midpoint). */
  readonly note: string | null;
}

/** Options of fitLogisticBoundary. */
export interface LogisticOptions {
  /** Weight per bin (e.g. n/SD², all > 0), same length as y; default all 1. */
  readonly weights?: Float64Array;
}

const model = ([lower, upper, x0, w]: number[]) => (x: number) => lower + (upper - lower) * logistic((x - x0) / w);
const jacobian = ([lower, upper, x0, w]: number[]) => (x: number) => {
  const s = logistic((x - x0) / w), slope = (upper - lower) * s * (1 - s);
  return [1 - s, s, slope / w, (slope * (x - x0)) / (w * w)];
};

/**
 * Runs fitNonlinear from `start` (already signed) with one LM run; `fallback` as in NonlinearOptions. FitErrors
 * are re-labelled with this module's name.
 */
function fitFrom(x: Float64Array, y: Float64Array, start: number[], weights: Float64Array | undefined, fallback: boolean): NonlinearFit {
  try {
    return fitNonlinear(x, y, model, start, { jacobian, restarts: false, fallback, ...(weights ? { weights } : {}) });
  } catch (e) {
    if (e instanceof FitError) throw new FitError(e.code, e.message.replace(/^fitNonlinear: /, 'fitLogisticBoundary: '));
    throw e;
  }
}

/** Best of a few width starts (1, 3, 10 % of the x span), each signed by the profile's overall direction. */
function widthStartsFit(x: Float64Array, y: Float64Array, x0: number, falling: boolean, weights?: Float64Array): NonlinearFit {
  const low = quantile(y, 0.05), high = quantile(y, 0.95);
  const span = x[x.length - 1] - x[0];
  let best: NonlinearFit | null = null;
  let lastError: unknown = null;
  for (const fraction of [0.01, 0.03, 0.1]) {
    // Falling (high anterior) with w > 0 means the x → −∞ level, "upper", is the high one.
    const w = fraction * span;
    try {
      const fit = fitFrom(x, y, falling ? [low, high, x0, w] : [high, low, x0, w], weights, true);
      if (!best || fit.rss < best.rss) best = fit;
    } catch (e) {
      lastError = e;
    }
  }
  if (best) return best;
  throw lastError;
}

/**
 * One LM run from the variable-projection start (the common case: it lies in the right basin, so one run is
 * enough); only when that fails, the slower search over fixed width starts. `sharpLike` (a two-level step
 * explains ≥ 90 % of the variance) with a failed run from the narrowest start width means the width shrinks
 * towards 0 without a minimum: the error is rethrown at once, as the slow search would end the same way.
 */
function bestFit(x: Float64Array, y: Float64Array, x0: number, falling: boolean, weights: Float64Array | undefined, sharpLike: boolean): NonlinearFit {
  const span = x[x.length - 1] - x[0];
  const start = logisticStart(x, y, weights ?? new Float64Array(x.length).fill(1), x0, span / (x.length - 1), span);
  if (start) {
    try {
      return fitFrom(x, y, start.params.slice(), weights, false);
    } catch (e) {
      if (!(e instanceof FitError) || (sharpLike && start.narrowest)) throw e;
    }
  }
  return widthStartsFit(x, y, x0, falling, weights);
}

/**
 * Fits a logistic step to (xEl, y) and returns its midpoint, width and direction. Non-finite bins are skipped.
 * A step sharper than a quarter bin (or one the fit cannot follow, when a two-level step explains ≥ 90 % of
 * the variance) is reported as sharp. Throws FitError when fewer than 5 finite bins remain, the profile never
 * crosses its half-maximum, or the fit fails.
 */
export function fitLogisticBoundary(xEl: ArrayLike<number>, y: ArrayLike<number>, options: LogisticOptions = {}): LogisticBoundary {
  const points = finitePoints(xEl, y, 'fitLogisticBoundary');
  const weights = options.weights ? keptWeights(options.weights, points.index, y.length) : undefined;
  if (points.y.length < 5) {
    throw new FitError('bad-input', `fitLogisticBoundary: need at least 5 finite bins, got ${points.y.length}`);
  }
  const crossing = halfMaxCrossing(points.xEl, points.y);
  if (crossing.positionEl === null) {
    throw new FitError('bad-input', 'fitLogisticBoundary: the profile has no step (it never crosses its half-maximum)');
  }
  const spacing = Math.abs(points.xEl[points.xEl.length - 1] - points.xEl[0]) / (points.xEl.length - 1);
  const step = twoLevelStep(points.xEl, points.y, crossing.positionEl);
  let fit: NonlinearFit;
  try {
    fit = bestFit(points.xEl, points.y, crossing.positionEl, crossing.direction === 'falling', weights, step.r2 >= 0.9);
  } catch (e) {
    if (step.r2 >= 0.9) return { ...step, note: SHARP_NOTE };
    throw e;
  }
  const [l, u, x0, w] = fit.params;
  if (Math.abs(w) < spacing / 4) return { ...step, note: SHARP_NOTE };
  const anterior = w > 0 ? u : l, posterior = w > 0 ? l : u;
  return {
    positionEl: x0, widthEl: Math.abs(w), positionSeEl: fit.se[2],
    direction: anterior > posterior ? 'falling' : 'rising',
    lower: Math.min(l, u), upper: Math.max(l, u), r2: fit.r2, note: null,
  };
}

/** The weights of the kept points; throws FitError('bad-input') on a length mismatch or a bad weight. */
function keptWeights(weights: Float64Array, index: Int32Array, length: number): Float64Array {
  if (weights.length !== length) {
    throw new FitError('bad-input', `fitLogisticBoundary: weights and y differ in length (${weights.length} vs ${length})`);
  }
  const kept = Float64Array.from(index, (i) => weights[i]);
  kept.forEach((w, k) => {
    if (!(w > 0 && Number.isFinite(w))) throw new FitError('bad-input', `fitLogisticBoundary: weights[${index[k]}] must be a positive finite number`);
  });
  return kept;
}

const SHARP_NOTE = 'the step is sharper than the bin spacing; position is the midpoint of the bracketing bins';

/**
 * The two-level step at a crossing between bins i and i+1: position = their midpoint (x0 is not determined
 * inside the bracket), width 0, SE = bracket / √12 (uniform position within it), levels = the mean on each side.
 */
function twoLevelStep(x: Float64Array, y: Float64Array, crossingEl: number): Omit<LogisticBoundary, 'note'> {
  let i = 0;
  while (i + 2 < x.length && x[i + 1] < crossingEl) i++;
  const mean = (a: Float64Array): number => a.reduce((s, v) => s + v, 0) / a.length;
  const anterior = mean(y.subarray(0, i + 1)), posterior = mean(y.subarray(i + 1));
  const all = mean(y);
  let rss = 0, tss = 0;
  y.forEach((v, k) => { rss += (v - (k <= i ? anterior : posterior)) ** 2; tss += (v - all) ** 2; });
  return {
    positionEl: (x[i] + x[i + 1]) / 2, widthEl: 0, positionSeEl: Math.abs(x[i + 1] - x[i]) / Math.sqrt(12),
    direction: anterior > posterior ? 'falling' : 'rising',
    lower: Math.min(anterior, posterior), upper: Math.max(anterior, posterior), r2: tss > 0 ? 1 - rss / tss : NaN,
  };
}
