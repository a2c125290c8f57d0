// λ(t): the exponential gradient fit of core/fit applied to each time point's profile of a movie.
import { FitError, fitExponentialDecay } from '../fit';
import type { ExponentialFit, Profile } from '../model';

/** One time point's gradient profile and the egg length it was measured with (µm). */
export interface TimePointProfile {
  readonly tS: number;
  readonly profile: Profile;
  readonly eggLengthUm: number;
}

/** The fit at one time point, or the reason there is none. */
export interface LambdaAtTime {
  readonly tS: number;
  readonly fit: ExponentialFit | null;
  readonly error: string | null;
}

/**
 * Fits A·exp(−x/λ) + B to every time point's profile over fitRangeEl (x/EL). A time point whose fit fails (an
 * early frame with no gradient yet, say) gets fit = null and the fitter's one-line message; others go on.
 */
export function fitLambdaSeries(points: readonly TimePointProfile[], fitRangeEl: readonly [number, number]): LambdaAtTime[] {
  return points.map(({ tS, profile, eggLengthUm }) => {
    try {
      const fit = fitExponentialDecay(profile.xUm, profile.mean, { eggLengthUm, fitRangeEl, xEl: profile.xEl });
      return { tS, fit, error: null };
    } catch (e) {
      if (e instanceof FitError) return { tS, fit: null, error: e.message };
      throw e;
    }
  });
}

/**
 * The first time from which every later fitted λ (EL) stays within `tolerance` (relative) of the median of the
 * last `lastFrames` fitted values: when the gradient's shape has formed. NaN when no such time exists.
 */
export function shapeFormedAtS(series: readonly LambdaAtTime[], tolerance = 0.05, lastFrames = 3): number {
  const fitted = series.filter((s) => s.fit !== null);
  if (fitted.length < lastFrames) return NaN;
  const tail = fitted.slice(-lastFrames).map((s) => s.fit!.lambdaEl).sort((a, b) => a - b);
  const ref = tail[Math.floor((tail.length - 1) / 2)];
  let formed = NaN;
  for (let i = series.length - 1; i >= 0; i--) {
    const f = series[i].fit;
    if (!f || Math.abs(f.lambdaEl / ref - 1) > tolerance) break;
    formed = series[i].tS;
  }
  return formed;
}
