// Local accumulation time of a forming gradient from a movie's profiles.
//
// Definition (Berezhkovskii, Sample & Shvartsman 2010, Biophys. J. 99:L59; the definition and reference are from
// memory, the reference's title, authors and year checked against the publisher's listing):
//   τ(x) = ∫₀^∞ (1 − C(x,t)/C(x,∞)) dt, with t = 0 the onset of production and C(x,0) = 0.
// Estimator (positions are usually coarsened first, coarsenProfiles): the mean of the first `baselineFrames` frames (before production; autofluorescence) is subtracted,
// C(x,∞) is the mean of the last `plateauFrames` frames, and the integral runs by the trapezoid rule from the onset
// (C = 0 there) to the last frame. Uncertainty: first-order propagation of frame-to-frame noise, whose SD is
// estimated per position from the residuals of each frame of the movie's second half against the straight line
// through its two neighbours (robust: 1.4826 × median |residual|, so the curvature of the rise at a few frames does
// not inflate it; the second half because shot noise grows with the signal).
// Bias: when the movie ends before steady state, C(x,∞) is underestimated and τ too; for an exponential approach
// C = C∞(1 − e^{−t/τ}) ended at T the estimate is τ − T·q/(1 − q) with q = e^{−T/τ} (accumulationTruncationBias).
import { tQuantile } from '../stats';

/** Options of localAccumulationTime. */
export interface AccumulationOptions {
  /**
   * Frames at the start, before production begins, whose mean is the baseline subtracted from every frame
   * (autofluorescence, camera offset left after background subtraction); default 1. 0 = the profiles are already
   * zero at the onset.
   */
  readonly baselineFrames?: number;
  /**
   * Onset of production on the movie's clock, s; default: the last baseline frame's time (the first frame's with no
   * baseline frames). Frames after the baseline ones but not after the onset are left out of the integral.
   */
  readonly onsetS?: number;
  /** Frames at the end averaged for C(x,∞); default 3. */
  readonly plateauFrames?: number;
  /**
   * Rise over the last fifth of the movie, relative to C(x,∞), above which a position is flagged as still rising;
   * default 0.03. For an exponential approach that flags movies shorter than about 3.5 τ, where τ is underestimated
   * by about 11% or more (accumulationTruncationBias).
   */
  readonly riseLimit?: number;
  /** Confidence level of the intervals; default 0.95. */
  readonly level?: number;
}

/** τ(x) per position with its uncertainty and the checks that bear on it; NaN where not measurable. */
export interface AccumulationResult {
  readonly tauS: Float64Array;
  readonly tauSeS: Float64Array;
  readonly tauCiLowS: Float64Array;
  readonly tauCiHighS: Float64Array;
  /** C(x,∞) − baseline estimated from the last frames, and the frame-to-frame noise SD, in the profile's units. */
  readonly steadyState: Float64Array;
  readonly noiseSd: Float64Array;
  /** Rise over the last fifth of the movie (straight-line fit through its frames) / C(x,∞). */
  readonly lateRise: Float64Array;
  /** 1 where the last frames still rise by more than riseLimit (and by more than twice the noise), else 0. */
  readonly stillRising: Uint8Array;
  /** Movie length from onset to the last frame, s. */
  readonly movieLengthS: number;
  readonly level: number;
}

const NAME = 'localAccumulationTime';

interface Checked {
  readonly baseline: number; readonly first: number; readonly onsetS: number; readonly plateau: number; readonly riseLimit: number; readonly level: number;
}

function checkInputs(timesS: ArrayLike<number>, frames: readonly ArrayLike<number>[], options: AccumulationOptions): Checked {
  if (frames.length !== timesS.length) throw new RangeError(`${NAME}: ${timesS.length} times but ${frames.length} frames`);
  for (let i = 0; i < timesS.length; i++) {
    if (!Number.isFinite(timesS[i]) || (i > 0 && !(timesS[i] > timesS[i - 1]))) {
      throw new RangeError(`${NAME}: times must be finite and increasing (time ${i} is ${timesS[i]})`);
    }
    if (frames[i].length !== frames[0].length) throw new RangeError(`${NAME}: frame ${i} has ${frames[i].length} positions, frame 0 has ${frames[0].length}`);
  }
  const baseline = options.baselineFrames ?? 1;
  if (!(Number.isInteger(baseline) && baseline >= 0 && baseline < timesS.length)) {
    throw new RangeError(`${NAME}: baselineFrames must be an integer from 0 to the number of frames − 1, got ${baseline}`);
  }
  const onsetS = options.onsetS ?? timesS[Math.max(0, baseline - 1)];
  if (!Number.isFinite(onsetS)) throw new RangeError(`${NAME}: onsetS must be a finite number, got ${onsetS}`);
  if (baseline > 0 && onsetS < timesS[baseline - 1]) {
    throw new RangeError(`${NAME}: the onset (${onsetS} s) is before the last baseline frame (${timesS[baseline - 1]} s)`);
  }
  let first = baseline;
  while (first < timesS.length && timesS[first] <= onsetS) first++;
  const plateau = options.plateauFrames ?? 3;
  if (!(Number.isInteger(plateau) && plateau >= 1)) throw new RangeError(`${NAME}: plateauFrames must be an integer ≥ 1, got ${plateau}`);
  const usable = timesS.length - first;
  if (usable < plateau + 2) {
    throw new RangeError(`${NAME}: need at least ${plateau + 2} frames after the onset (plateauFrames + 2), got ${usable}`);
  }
  const riseLimit = options.riseLimit ?? 0.03;
  if (!(riseLimit > 0 && Number.isFinite(riseLimit))) throw new RangeError(`${NAME}: riseLimit must be a positive number, got ${riseLimit}`);
  const level = options.level ?? 0.95;
  if (!(level > 0 && level < 1)) throw new RangeError(`${NAME}: level must be between 0 and 1 (exclusive), got ${level}`);
  return { baseline, first, onsetS, plateau, riseLimit, level };
}

/** Trapezoid weights of the points (onset, t_first … t_last); index 0 is the onset (value 0, not noisy). */
export function trapezoidWeights(onsetS: number, timesS: ArrayLike<number>): Float64Array {
  const t = [onsetS, ...Array.from(timesS)];
  const w = new Float64Array(t.length);
  for (let i = 0; i + 1 < t.length; i++) {
    const half = (t[i + 1] - t[i]) / 2;
    w[i] += half;
    w[i + 1] += half;
  }
  return w;
}

/**
 * Robust SD of frame-to-frame noise in one series: residual of each inner frame against the line through its
 * neighbours, divided by √(1 + a² + b²) (the SD of that residual for unit noise), then 1.4826 × median |·|.
 */
export function frameNoiseSd(timesS: ArrayLike<number>, values: ArrayLike<number>): number {
  const scaled: number[] = [];
  for (let i = 1; i + 1 < values.length; i++) {
    const a = (timesS[i + 1] - timesS[i]) / (timesS[i + 1] - timesS[i - 1]);
    const b = 1 - a;
    const e = values[i] - (a * values[i - 1] + b * values[i + 1]);
    scaled.push(Math.abs(e) / Math.sqrt(1 + a * a + b * b));
  }
  if (scaled.length === 0) return NaN;
  scaled.sort((p, q) => p - q);
  const m = scaled.length;
  const med = m % 2 ? scaled[(m - 1) / 2] : (scaled[m / 2 - 1] + scaled[m / 2]) / 2;
  return 1.4826 * med;
}

/**
 * τ (s), its SE for unit noise SD (scale by the noise SD) and C(∞) − baseline of one position's series.
 * `values` are the frames after the onset at `timesS`; `baseline` is subtracted from them and is the mean of
 * `baselineFrames` frames (0 = a known zero), whose noise the SE includes.
 */
export function accumulationOfSeries(
  onsetS: number, timesS: ArrayLike<number>, values: ArrayLike<number>, plateauFrames: number,
  baseline = 0, baselineFrames = 0,
): { tauS: number; seUnitNoise: number; steadyState: number } {
  const n = values.length;
  const w = trapezoidWeights(onsetS, timesS);
  let cInf = 0;
  for (let i = n - plateauFrames; i < n; i++) cInf += values[i] - baseline;
  cInf /= plateauFrames;
  let integral = w[0]; // the onset point: C = 0, so 1 − C/C∞ = 1
  let weighted = 0;
  for (let i = 0; i < n; i++) {
    integral += w[i + 1] * (1 - (values[i] - baseline) / cInf);
    weighted += w[i + 1] * (values[i] - baseline);
  }
  // ∂τ/∂C_i = −w_i/C∞, plus Σw·C/C∞² shared out over the plateau frames that make C∞; each baseline frame moves
  // every C and C∞ alike: ∂τ/∂b = Σw·(C∞ − C)/C∞², shared out over the baseline frames.
  const plateauShare = weighted / (cInf * cInf) / plateauFrames;
  let sumSq = 0;
  for (let i = 0; i < n; i++) {
    const d = -w[i + 1] / cInf + (i >= n - plateauFrames ? plateauShare : 0);
    sumSq += d * d;
  }
  if (baselineFrames > 0) {
    const share = (integral - w[0]) / cInf / baselineFrames;
    sumSq += baselineFrames * share * share;
  }
  return { tauS: integral, seUnitNoise: Math.sqrt(sumSq), steadyState: cInf };
}

/**
 * Local accumulation time τ(x) in seconds at every position of a movie's profiles. `frames[t][x]` is the
 * background-subtracted signal at time timesS[t] (s) and position x (any fixed grid, e.g. x/EL bins). The mean of
 * the first baselineFrames frames is subtracted first. Positions with a non-finite value in any frame, or whose
 * C(∞) is not above twice its noise, get NaN.
 * Throws RangeError on bad options.
 */
export function localAccumulationTime(
  timesS: ArrayLike<number>, frames: readonly ArrayLike<number>[], options: AccumulationOptions = {},
): AccumulationResult {
  const { baseline, first, onsetS, plateau, riseLimit, level } = checkInputs(timesS, frames, options);
  const allTimes = Float64Array.from(timesS);
  const times = allTimes.subarray(first);
  const positions = frames[0].length;
  const nan = (): Float64Array => new Float64Array(positions).fill(NaN);
  const out = { tauS: nan(), tauSeS: nan(), tauCiLowS: nan(), tauCiHighS: nan(), steadyState: nan(), noiseSd: nan(), lateRise: nan() };
  const stillRising = new Uint8Array(positions);
  const dof = Math.max(1, frames.length - 2);
  const tq = tQuantile(0.5 + level / 2, dof);
  const all = new Float64Array(frames.length);
  for (let x = 0; x < positions; x++) {
    let finite = true;
    for (let t = 0; t < frames.length; t++) { all[t] = frames[t][x]; finite &&= Number.isFinite(all[t]); }
    if (!finite) continue;
    // Noise from the second half of the movie, where the signal and so its shot noise are largest: a conservative
    // SD for the earlier, dimmer frames.
    const half = Math.min(Math.floor(frames.length / 2), frames.length - 3);
    const noise = frameNoiseSd(allTimes.subarray(half), all.subarray(half));
    let base = 0;
    for (let t = 0; t < baseline; t++) base += all[t] / baseline;
    const series = all.subarray(first);
    const { tauS, seUnitNoise, steadyState } = accumulationOfSeries(onsetS, times, series, plateau, base, baseline);
    out.steadyState[x] = steadyState;
    out.noiseSd[x] = noise;
    if (!(steadyState > 2 * noise / Math.sqrt(plateau) && steadyState > 0)) continue;
    const se = seUnitNoise * noise;
    out.tauS[x] = tauS;
    out.tauSeS[x] = se;
    out.tauCiLowS[x] = tauS - tq * se;
    out.tauCiHighS[x] = tauS + tq * se;
    const { rise, seUnitNoise: riseSe } = lateRiseOf(times, series);
    out.lateRise[x] = rise / steadyState;
    stillRising[x] = rise / steadyState > riseLimit && rise > 2 * riseSe * noise ? 1 : 0;
  }
  return { ...out, stillRising, movieLengthS: times[times.length - 1] - onsetS, level };
}

/**
 * Rise over the last fifth of the movie: the least-squares slope through the frames in that window (at least 3)
 * times the window's length, and the standard error of that rise for unit noise.
 */
export function lateRiseOf(timesS: ArrayLike<number>, series: ArrayLike<number>): { rise: number; seUnitNoise: number } {
  const n = series.length;
  const start = timesS[n - 1] - 0.2 * (timesS[n - 1] - timesS[0]);
  let first = n - 1;
  while (first > 0 && (timesS[first - 1] >= start || n - first < 3)) first--;
  let st = 0, sy = 0;
  for (let i = first; i < n; i++) { st += timesS[i]; sy += series[i]; }
  const m = n - first, tBar = st / m, yBar = sy / m;
  let stt = 0, sty = 0;
  for (let i = first; i < n; i++) { stt += (timesS[i] - tBar) ** 2; sty += (timesS[i] - tBar) * (series[i] - yBar); }
  const span = timesS[n - 1] - timesS[first];
  return { rise: (sty / stt) * span, seUnitNoise: span / Math.sqrt(stt) };
}

/**
 * Relative bias (estimate/true − 1) of τ for an exponential approach C = C∞(1 − e^{−t/τ}) when C(∞) is taken as the
 * last value of a movie of length T = movieOverTau·τ: −(T/τ)·q/(1 − q), q = e^{−T/τ} (derived in the header).
 */
export function accumulationTruncationBias(movieOverTau: number): number {
  if (!(movieOverTau > 0)) throw new RangeError(`accumulationTruncationBias: movieOverTau must be positive, got ${movieOverTau}`);
  const q = Math.exp(-movieOverTau);
  return (-movieOverTau * q) / (1 - q);
}
