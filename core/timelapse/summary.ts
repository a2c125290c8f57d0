// One movie's time analysis from its per-time-point results: λ(t), τ(x) on coarser bins, the τ(x) model fit against
// the steady-state λ, and the warnings that bear on them.
import { FitError, fitExponentialDecay } from '../fit';
import type { EmbryoResult, ExponentialFit, Profile } from '../model';
import { median } from '../stats';
import { localAccumulationTime, type AccumulationResult } from './accumulation';
import { fitAccumulationModel, type AccumulationModelFit } from './accumulation-model';
import { coarsenProfiles } from './coarsen';
import { fitLambdaSeries, type LambdaAtTime } from './lambda-series';

/** Options of summarizeMovie; defaults in brackets. */
export interface MovieSummaryOptions {
  /** x/EL range of the per-time-point exponential fits. */
  readonly fitRangeEl: readonly [number, number];
  /** x/EL range of the τ(x) model fit [0.1, 0.4]. */
  readonly modelRangeEl?: readonly [number, number];
  /** Width of the bins τ(x) is computed on, x/EL [0.025]. */
  readonly binWidthEl?: number;
  /** Frames before production averaged as the baseline [1]; frames at the end averaged for C(x,∞) [3]. */
  readonly baselineFrames?: number;
  readonly plateauFrames?: number;
  /** Onset of production, s on the movie's clock [the last baseline frame]. */
  readonly onsetS?: number;
}

/** τ(x) on coarse bins, with positions in x/EL and µm (NaN when the pixel size is unknown). */
export interface MovieAccumulation extends AccumulationResult {
  readonly xEl: Float64Array;
  readonly xUm: Float64Array;
}

/** Everything the time analysis of one movie gives; parts that could not be computed are null with a reason. */
export interface MovieSummary {
  readonly file: string;
  readonly timeIndices: readonly number[];
  /** Seconds from the first time point, or null when the times are unknown. */
  readonly timesS: Float64Array | null;
  readonly lambda: readonly LambdaAtTime[];
  /** λ of the mean profile of the last plateauFrames time points: the steady state the movie reached. */
  readonly steadyFit: ExponentialFit | null;
  readonly eggLengthUm: number | null;
  readonly accumulation: MovieAccumulation | null;
  readonly model: AccumulationModelFit | null;
  /** Why accumulation or model is null; null when both were computed. */
  readonly note: string | null;
  readonly warnings: readonly string[];
}

/** Mean of the last `count` profiles bin by bin (same bins). */
function meanProfile(profiles: readonly Profile[], count: number): Profile {
  const tail = profiles.slice(-count);
  const mean = tail[0].mean.map((_, i) => tail.reduce((s, p) => s + p.mean[i], 0) / tail.length);
  return { ...tail[0], mean };
}

function message(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}

/**
 * Summarise a movie from its results per time point (in time order, all of one file). timesS (s from the first
 * analysed time point's clock) may be null when the file and the user gave no times: λ(t) is then still fitted,
 * τ(x) is not. Never throws for bad data: what cannot be computed is null with a note.
 */
export function summarizeMovie(
  file: string, timeIndices: readonly number[], timesS: Float64Array | null, results: readonly EmbryoResult[], options: MovieSummaryOptions,
): MovieSummary {
  const ok = results.every((r) => r.status === 'ok' && r.gradientProfile);
  const lengths = results.map((r) => r.eggLengthUm).filter((v): v is number => v !== null && Number.isFinite(v));
  const eggLengthUm = lengths.length > 0 ? median(lengths) : null;
  const warnings: string[] = [];
  const base = { file, timeIndices, timesS, eggLengthUm, warnings };
  if (!ok) {
    const failed = results.findIndex((r) => r.status !== 'ok' || !r.gradientProfile);
    return { ...base, lambda: [], steadyFit: null, accumulation: null, model: null, note: `time point ${timeIndices[failed]} was not analysed, so the movie is not summarised` };
  }
  const elUm = eggLengthUm ?? 1;
  // Without a pixel size the profiles have no µm positions; x/EL × 1 then stands in, so λ comes out in EL.
  const profiles = results.map((r) => {
    const p = r.gradientProfile!;
    return p.xUm.every(Number.isFinite) ? p : { ...p, xUm: p.xEl.map((v) => v * elUm) };
  });
  const clock = timesS ?? Float64Array.from(timeIndices);
  const lambda = fitLambdaSeries(profiles.map((profile, i) => ({ tS: clock[i], profile, eggLengthUm: eggLengthUm === null ? elUm : results[i].eggLengthUm ?? elUm })), options.fitRangeEl);
  const plateau = options.plateauFrames ?? 3;
  let steadyFit: ExponentialFit | null = null;
  try {
    const p = meanProfile(profiles, Math.min(plateau, profiles.length));
    steadyFit = fitExponentialDecay(p.xUm, p.mean, { eggLengthUm: elUm, fitRangeEl: options.fitRangeEl, xEl: p.xEl });
  } catch (e) {
    if (!(e instanceof FitError)) throw e;
    warnings.push(`no steady-state λ: ${e.message}`);
  }
  if (!timesS) return { ...base, lambda, steadyFit, accumulation: null, model: null, note: 'the times of the time points are unknown (give --time-step S); τ(x) needs them' };
  let accumulation: MovieAccumulation;
  try {
    const coarse = coarsenProfiles(profiles[0].xEl, profiles.map((p) => p.mean), options.binWidthEl ?? 0.025);
    const acc = localAccumulationTime(timesS, coarse.frames, { baselineFrames: options.baselineFrames ?? 1, plateauFrames: plateau, onsetS: options.onsetS });
    accumulation = { ...acc, xEl: coarse.xEl, xUm: coarse.xEl.map((v) => (eggLengthUm !== null ? v * eggLengthUm : NaN)) };
  } catch (e) {
    return { ...base, lambda, steadyFit, accumulation: null, model: null, note: `no τ(x): ${message(e)}` };
  }
  const range = options.modelRangeEl ?? [0.1, 0.4];
  risingWarning(accumulation, range, warnings);
  try {
    const model = fitAccumulationModel(accumulation.xEl.map((v) => v * elUm), accumulation.xEl, accumulation.tauS, accumulation.tauSeS, {
      eggLengthUm: elUm, rangeEl: range, steady: steadyFit ? { lambdaUm: steadyFit.lambdaUm, lambdaSeUm: steadyFit.lambdaSeUm } : null,
    });
    return { ...base, lambda, steadyFit, accumulation, model, note: null };
  } catch (e) {
    return { ...base, lambda, steadyFit, accumulation, model: null, note: `no τ(x) model fit: ${message(e)}` };
  }
}

/** Warns when positions in the model range still rise at the end of the movie, with the range and the largest rise. */
function risingWarning(acc: MovieAccumulation, range: readonly [number, number], warnings: string[]): void {
  const rising = Array.from(acc.xEl).map((x, i) => ({ x, i })).filter(({ x, i }) => x >= range[0] && x <= range[1] && acc.stillRising[i] === 1);
  if (rising.length === 0) return;
  const worst = Math.max(...rising.map(({ i }) => acc.lateRise[i]));
  warnings.push(`the gradient still rises at the end of the movie at x/EL ${rising[0].x.toFixed(2)}–${rising[rising.length - 1].x.toFixed(2)} ` +
    `(by up to ${Math.round(worst * 100)}% over its last fifth): C(x,∞) and τ(x) are underestimated there`);
}
