// The synthesis–diffusion–degradation model's prediction for the local accumulation time, and its test on data.
//
// For a flux source at x = 0 on a half-line, ∂C/∂t = D·C'' − k·C, the local accumulation time is
//   τ(x) = (1 + x/λ)/(2k), λ = √(D/k)
// (Berezhkovskii, Sample & Shvartsman 2010, Biophys. J. 99:L59; formula from memory — the paper's text was not
// reachable to check it, so it was re-derived here and is tested against our own numerical solution):
// the Laplace transform of C is Ĉ(x,s) = j·exp(−x·√((s+k)/D)) / (s·√(D(s+k))), and τ(x) = lim_{s→0} (1/s − Ĉ/C∞);
// to first order in s, s·Ĉ/C∞ = 1 − s/(2k) − s·x/(2kλ), which gives the formula.
// The fit τ(x) = τ₀(1 + x/λ_τ) is a straight line τ = a + b·x with τ₀ = a and λ_τ = a/b; the model says
// τ₀ = 1/(2k) and λ_τ = λ, so k = 1/(2τ₀) and D = k·λ² (λ from the steady-state profile).
import { tQuantile } from '../stats';

/** The model's τ(x) in seconds: (1 + x/λ)/(2k) for x in µm, λ in µm, k in 1/s. */
export function sddAccumulationTimeS(xUm: number, lambdaUm: number, degradationPerS: number): number {
  return (1 + xUm / lambdaUm) / (2 * degradationPerS);
}

/** A value with its two-sided interval (NaN where not resolved). */
export interface Estimate {
  readonly value: number;
  readonly ciLow: number;
  readonly ciHigh: number;
}

/** The steady-state decay length from the profile fit: λ in µm with its standard error. */
export interface SteadyLambda {
  readonly lambdaUm: number;
  readonly lambdaSeUm: number;
}

/** Options of fitAccumulationModel. */
export interface AccumulationModelOptions {
  readonly eggLengthUm: number;
  /** x/EL range of the positions used; default [0.1, 0.4]. */
  readonly rangeEl?: readonly [number, number];
  /** The steady-state λ from the profile, for D = k·λ² and the comparison; null = not known. */
  readonly steady: SteadyLambda | null;
  readonly level?: number;
}

/** Result of the τ(x) model fit, in seconds, 1/s, µm and µm²/s, with intervals at `level`. */
export interface AccumulationModelFit {
  readonly n: number;
  readonly rangeEl: readonly [number, number];
  readonly tau0S: Estimate;
  readonly kPerS: Estimate;
  readonly lambdaTauUm: Estimate;
  readonly lambdaTauEl: Estimate;
  readonly lambdaUm: Estimate;
  readonly lambdaEl: Estimate;
  readonly dUm2PerS: Estimate;
  /** 'agree' when λ_τ − λ is inside its interval, 'differ' when not, 'unresolved' when either is not measured. */
  readonly agreement: 'agree' | 'differ' | 'unresolved';
  /** One paragraph in plain words. */
  readonly reading: string;
  readonly level: number;
}

const NAME = 'fitAccumulationModel';
const NONE: Estimate = Object.freeze({ value: NaN, ciLow: NaN, ciHigh: NaN });

/** Weighted straight line with the covariance of intercept and slope (residual variance from the data). */
function line(x: number[], y: number[], w: number[]): { a: number; b: number; va: number; vb: number; cab: number; dof: number } {
  let sw = 0, sx = 0, sy = 0;
  for (let i = 0; i < x.length; i++) { sw += w[i]; sx += w[i] * x[i]; sy += w[i] * y[i]; }
  const xBar = sx / sw, yBar = sy / sw;
  let sxx = 0, sxy = 0;
  for (let i = 0; i < x.length; i++) { sxx += w[i] * (x[i] - xBar) ** 2; sxy += w[i] * (x[i] - xBar) * (y[i] - yBar); }
  const b = sxy / sxx, a = yBar - b * xBar;
  let rss = 0;
  for (let i = 0; i < x.length; i++) rss += w[i] * (y[i] - a - b * x[i]) ** 2;
  const dof = x.length - 2;
  const s2 = rss / dof;
  const vb = s2 / sxx;
  return { a, b, va: s2 / sw + xBar * xBar * vb, vb, cab: -xBar * vb, dof };
}

function estimate(value: number, se: number, t: number): Estimate {
  return Number.isFinite(value) && Number.isFinite(se) ? { value, ciLow: value - t * se, ciHigh: value + t * se } : { value, ciLow: NaN, ciHigh: NaN };
}

function scaled(e: Estimate, f: number): Estimate {
  return { value: e.value * f, ciLow: e.ciLow * f, ciHigh: e.ciHigh * f };
}

function pick(xUm: ArrayLike<number>, xEl: ArrayLike<number>, tauS: ArrayLike<number>, tauSeS: ArrayLike<number>, range: readonly [number, number]) {
  const x: number[] = [], y: number[] = [], se: number[] = [];
  for (let i = 0; i < tauS.length; i++) {
    if (xEl[i] >= range[0] && xEl[i] <= range[1] && Number.isFinite(tauS[i]) && Number.isFinite(xUm[i])) {
      x.push(xUm[i]); y.push(tauS[i]); se.push(tauSeS[i]);
    }
  }
  return { x, y, se };
}

/**
 * Fits τ(x) = τ₀(1 + x/λ_τ) to accumulation times (s) at positions xUm (µm) whose xEl lies in options.rangeEl,
 * weighted by 1/SE² when every SE is a positive number, and reports k = 1/(2τ₀), λ_τ and D = k·λ² beside the
 * steady-state λ. Intervals: t with n − 2 degrees of freedom; λ_τ by the delta method; k from τ₀'s interval; D on
 * the log scale. Throws RangeError on bad options or fewer than 3 usable positions.
 */
export function fitAccumulationModel(
  xUm: ArrayLike<number>, xEl: ArrayLike<number>, tauS: ArrayLike<number>, tauSeS: ArrayLike<number>,
  options: AccumulationModelOptions,
): AccumulationModelFit {
  const range = options.rangeEl ?? [0.1, 0.4];
  const level = options.level ?? 0.95;
  const el = options.eggLengthUm;
  if (!(el > 0 && Number.isFinite(el))) throw new RangeError(`${NAME}: eggLengthUm must be a positive number, got ${el}`);
  if (!(range[0] < range[1])) throw new RangeError(`${NAME}: rangeEl must be [start, end] with start < end, got [${range.join(', ')}]`);
  if (!(level > 0 && level < 1)) throw new RangeError(`${NAME}: level must be between 0 and 1 (exclusive), got ${level}`);
  if (xUm.length !== tauS.length || xEl.length !== tauS.length || tauSeS.length !== tauS.length) {
    throw new RangeError(`${NAME}: xUm, xEl, tauS and tauSeS differ in length`);
  }
  const { x, y, se } = pick(xUm, xEl, tauS, tauSeS, range);
  if (x.length < 3) throw new RangeError(`${NAME}: only ${x.length} positions with a measured τ in [${range.join(', ')}] x/EL; need at least 3`);
  const weighted = se.every((s) => s > 0 && Number.isFinite(s));
  const fit = line(x, y, weighted ? se.map((s) => 1 / (s * s)) : x.map(() => 1));
  const t = tQuantile(0.5 + level / 2, fit.dof);
  const tau0S = estimate(fit.a, Math.sqrt(fit.va), t);
  const kPerS: Estimate = {
    value: 1 / (2 * fit.a),
    ciLow: tau0S.ciHigh > 0 ? 1 / (2 * tau0S.ciHigh) : NaN,
    ciHigh: tau0S.ciLow > 0 ? 1 / (2 * tau0S.ciLow) : NaN,
  };
  const lt = fit.a / fit.b;
  const ltSe = Math.abs(lt) * Math.sqrt(fit.va / fit.a ** 2 + fit.vb / fit.b ** 2 - (2 * fit.cab) / (fit.a * fit.b));
  const slopeResolved = fit.b - t * Math.sqrt(fit.vb) > 0;
  const lambdaTauUm = slopeResolved ? estimate(lt, ltSe, t) : { value: lt, ciLow: NaN, ciHigh: NaN };
  const steady = options.steady;
  const lambdaUm = steady ? estimate(steady.lambdaUm, steady.lambdaSeUm, t) : NONE;
  const dUm2PerS = steady ? diffusion(kPerS.value, Math.sqrt(fit.va) / fit.a, steady, t) : NONE;
  const { agreement, reading } = readAgreement(lt, ltSe, slopeResolved, steady, t, el, level, kPerS.value);
  return {
    n: x.length, rangeEl: [range[0], range[1]], tau0S, kPerS, lambdaTauUm, lambdaTauEl: scaled(lambdaTauUm, 1 / el),
    lambdaUm, lambdaEl: scaled(lambdaUm, 1 / el), dUm2PerS, agreement, reading, level,
  };
}

/** D = k·λ² with its interval on the log scale: relative SEs of k (= that of τ₀) and of λ (twice) in quadrature. */
function diffusion(k: number, relSeTau0: number, steady: SteadyLambda, t: number): Estimate {
  const value = k * steady.lambdaUm ** 2;
  const relSe = Math.sqrt(relSeTau0 ** 2 + (2 * steady.lambdaSeUm / steady.lambdaUm) ** 2);
  if (!(value > 0) || !Number.isFinite(relSe)) return { value: k > 0 ? value : NaN, ciLow: NaN, ciHigh: NaN };
  return { value, ciLow: value * Math.exp(-t * relSe), ciHigh: value * Math.exp(t * relSe) };
}

function fmt(v: number): string {
  return Number.isFinite(v) ? v.toPrecision(2) : 'n/a';
}

/** The comparison of λ_τ with λ in words; agreement does not prove the model, which the reading says. */
function readAgreement(
  lt: number, ltSe: number, resolved: boolean, steady: SteadyLambda | null, t: number, el: number, level: number, k: number,
): { agreement: AccumulationModelFit['agreement']; reading: string } {
  const pct = Math.round(level * 100);
  if (!resolved || !steady || !Number.isFinite(steady.lambdaUm) || !Number.isFinite(ltSe)) {
    return {
      agreement: 'unresolved',
      reading: !resolved
        ? `τ(x) does not rise measurably with x over the fitted range, so λ_τ is not resolved and the model is not tested; k = 1/(2τ₀) = ${fmt(k)} /s is then only a rough time scale.`
        : 'The steady-state λ is not known for this movie, so λ_τ cannot be compared with it.',
    };
  }
  const diff = lt - steady.lambdaUm;
  const diffSe = Math.hypot(ltSe, steady.lambdaSeUm);
  const both = `λ_τ = ${fmt(lt / el)} EL (± ${fmt((t * ltSe) / el)}) and the steady-state λ = ${fmt(steady.lambdaUm / el)} EL (± ${fmt((t * steady.lambdaSeUm) / el)})`;
  if (Math.abs(diff) <= t * diffSe) {
    return {
      agreement: 'agree',
      reading: `${both} agree within the ${pct}% interval of their difference: the accumulation times are consistent with synthesis at the anterior pole, diffusion and uniform degradation, with k = ${fmt(k)} /s. Consistency does not prove that model; other mechanisms can give the same τ(x).`,
    };
  }
  const more = diff > 0 ? 'longer' : 'shorter';
  return {
    agreement: 'differ',
    reading: `${both} differ beyond the ${pct}% interval of their difference (λ_τ is ${Math.round(Math.abs(diff / steady.lambdaUm) * 100)}% ${more}): τ(x) does not follow a source at the pole with diffusion and uniform degradation. Check first that the movie starts at the onset of production and reaches steady state (see the warnings); otherwise the source may be spread out, degradation may vary along the axis, or transport may not be simple diffusion.`,
  };
}
