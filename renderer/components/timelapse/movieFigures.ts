// The time-lapse view's figures and words, from a MovieView and the shown time point: the same core/figures
// functions the batch's timelapse.html uses, with the shown time point marked. Pure (no DOM), so tests call them.
import type { MovieView } from '../../../core/contract';
import type { Profile } from '../../../core/model';
import { accumulationFigure, kymographFigure, lambdaOverTimeFigure, movieTimeUnit, profileFigure } from '../../../core/figures';
import { fmt } from '../../ui/format';

/** Size of a figure (px); the figures refuse less than 120 on a side, so smaller boxes are drawn at 120 and scaled. */
export interface FigureBox { readonly widthPx: number; readonly heightPx: number }

/** Whole pixels between 120 and 4000 (the figures' own limits). */
function sized(b: FigureBox): FigureBox {
  const clamp = (v: number) => Math.min(4000, Math.max(120, Math.round(v)));
  return { widthPx: clamp(b.widthPx), heightPx: clamp(b.heightPx) };
}

/** Seconds from the first time point of the k-th analysed time point (its index when the times are unknown). */
export function timeOf(view: MovieView, k: number): number {
  return view.timesS ? view.timesS[k] : view.timeIndices[k];
}

/** "t = 12 min · time point 4 of 46" (minutes for movies of 10 min or more; "time unknown" without times), with
 *  "(k of n analysed)" when only some time points were analysed, unless withAnalysed is false (figure titles). */
export function timeLabel(view: MovieView, k: number, withAnalysed = true): string {
  const n = view.timeIndices.length;
  const where = `time point ${view.timeIndices[k] + 1} of ${view.sizeT}${withAnalysed && n < view.sizeT ? ` (${k + 1} of ${n} analysed)` : ''}`;
  if (!view.timesS || n === 0) return `${where} · times unknown`;
  const { unit, perS } = movieTimeUnit(view.timesS[n - 1] - view.timesS[0]);
  return `t = ${fmt(view.timesS[k] * perS, 3)} ${unit} · ${where}`;
}

/** Up to `count` earlier time points before k, evenly spread and always including k − 1, oldest first. */
export function earlierIndices(k: number, count = 10): number[] {
  if (k <= 0) return [];
  if (k <= count) return Array.from({ length: k }, (_, i) => i);
  return Array.from({ length: count }, (_, i) => Math.round(((i + 1) * (k - 1)) / count));
}

/** One intensity range for the whole movie (min(0, lowest mean) … highest mean + SD), so growth reads as growth. */
export function movieIntensityRange(view: MovieView): [number, number] {
  let lo = 0, hi = -Infinity;
  for (const r of view.results) {
    const p = r.gradientProfile;
    if (!p) continue;
    for (let i = 0; i < p.mean.length; i++) {
      if (Number.isFinite(p.mean[i])) lo = Math.min(lo, p.mean[i]);
      const top = p.mean[i] + (Number.isFinite(p.sd[i]) ? p.sd[i] : 0);
      if (Number.isFinite(top)) hi = Math.max(hi, top);
    }
  }
  return Number.isFinite(hi) && hi > lo ? [lo, hi] : [0, 1];
}

/** The profile at time point k with its fit, boundaries and landmarks, earlier time points faded behind; null without one. */
export function profileAt(view: MovieView, k: number, box: FigureBox, title?: string): string | null {
  const r = view.results[k];
  const p = r?.gradientProfile;
  if (!r || !p) return null;
  const earlier = earlierIndices(k).map((j) => view.results[j].gradientProfile).filter((q): q is Profile => q !== null)
    .map((q) => ({ xEl: q.xEl, mean: q.mean }));
  return profileFigure({ profile: p, fit: r.gradientFit, boundaries: r.boundaries, landmarks: r.landmarks, boundaryChannels: r.boundaryProfiles.map((b) => b.channel), earlier },
    { ...sized(box), yDomain: movieIntensityRange(view), title: title ?? `Profile at ${timeLabel(view, k, false)}`, subtitle: '' });
}

/** The kymograph with the shown time point marked; null when no time point has a profile. */
export function kymographAt(view: MovieView, k: number, box: FigureBox): string | null {
  return view.kymograph ? kymographFigure(view.kymograph, { ...sized(box), markTimeS: view.kymograph.timesS[k] }) : null;
}

/** λ over time with its intervals, the steady-state λ, and the shown time point marked. */
export function lambdaAt(view: MovieView, k: number, box: FigureBox): string {
  return lambdaOverTimeFigure(view.lambda, { ...sized(box), steadyLambdaEl: view.steadyLambdaEl ?? undefined, markTimeS: view.lambda[k]?.tS });
}

/** τ(x) with intervals, the fitted line and the model line; null when τ could not be computed (view.note says why). */
export function tauFigure(view: MovieView, box: FigureBox): string | null {
  return view.accumulation ? accumulationFigure(view.accumulation, { ...sized(box), subtitle: 'dots: τ with 95% CI; lines as in the key' }) : null;
}
