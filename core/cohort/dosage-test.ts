// The dosage test of the threshold model: a boundary set by a fixed threshold T on A·f·exp(−x/λ) sits at
// x_b = λ·ln(A·f/T), so changing the dosage by a factor f shifts it by Δx = λ·ln f (f > 1 → posterior, Δx > 0).
//
// Choice of λ: the mean λ (x/EL) of the REFERENCE condition, SE = its SEM. The prediction asks how far a boundary
// moves from where it sits in the reference; pooling all conditions would assume that dosage leaves λ unchanged,
// which is itself something to check (the λ-by-condition figure shows it).
// Propagation: ln f is known exactly, so the predicted interval is λ's interval scaled by ln f. The ratio
// observed/predicted gets a first-order (delta-method) interval with t at min(Welch dof, n_ref − 1) — it is only
// meaningful when the predicted shift is clearly away from zero.
import { describeSample } from './describe';
import { fiellerInterval, holmAdjust, tTwoSidedP } from '../stats';
import { tQuantileOf } from './stats-local';
import type { ConditionInfo, DosageFit, Observation, ReferenceLambda, ShiftRow } from '../model';
import { welchDifference } from './welch';

/** λ in x/EL measured on the reference condition (mean, SEM, t-CI); null when it has no fitted λ. */
export function referenceLambda(
  observations: readonly Observation[], reference: string, level = 0.95,
): ReferenceLambda | null {
  const values = observations
    .filter((o) => o.condition === reference && o.kind === 'lambda' && o.unit === 'EL')
    .map((o) => o.value);
  if (values.length === 0) return null;
  const s = describeSample(values, level);
  return { condition: reference, n: s.n, lambdaEl: s.mean, seEl: s.sem, ciLowEl: s.ciLow, ciHighEl: s.ciHigh, dof: s.n - 1 };
}

/** Shift predicted by two opposing gradients read as a ratio: Δx = ln f / (1/λ_A + 1/λ_P), all in x/EL. */
export function twoGradientShiftEl(lnF: number, lambdaAnteriorEl: number, lambdaPosteriorEl: number): number {
  return lnF / (1 / lambdaAnteriorEl + 1 / lambdaPosteriorEl);
}

/** Names of the position quantities (boundaries and landmarks, x/EL) in order of first appearance. */
export function positionQuantities(observations: readonly Observation[]): string[] {
  const names: string[] = [];
  for (const o of observations) {
    if ((o.kind === 'boundary' || o.kind === 'landmark') && o.unit === 'EL' && !names.includes(o.quantity)) names.push(o.quantity);
  }
  return names;
}

function valuesOf(observations: readonly Observation[], condition: string, quantity: string): number[] {
  return observations.filter((o) => o.condition === condition && o.quantity === quantity && o.unit === 'EL').map((o) => o.value);
}

/** Observed vs predicted shift for every position quantity and every non-reference condition. */
export function shiftRows(
  observations: readonly Observation[], conditions: readonly ConditionInfo[], reference: string,
  lambda: ReferenceLambda | null, lambdaPosteriorEl: number | null, level = 0.95,
): ShiftRow[] {
  const rows: ShiftRow[] = [];
  for (const quantity of positionQuantities(observations)) {
    const ref = valuesOf(observations, reference, quantity);
    if (ref.length === 0) continue;
    for (const c of conditions) {
      if (c.name === reference) continue;
      const cond = valuesOf(observations, c.name, quantity);
      if (cond.length === 0) continue;
      rows.push(shiftRow(quantity, c, ref, cond, lambda, lambdaPosteriorEl, level));
    }
  }
  // Holm over every condition × position quantity (boundary methods of one channel count as separate tests).
  const holm = holmAdjust(rows.map((r) => r.pRatio ?? NaN));
  return rows.map((r, i) => ({ ...r, pRatioHolm: Number.isFinite(holm[i]) ? holm[i] : null }));
}

function shiftRow(
  quantity: string, c: ConditionInfo, ref: readonly number[], cond: readonly number[],
  lambda: ReferenceLambda | null, lambdaPosteriorEl: number | null, level: number,
): ShiftRow {
  const obs = welchDifference(ref, cond, level);
  const lnF = c.factor !== null ? Math.log(c.factor) : null;
  const base = {
    quantity, condition: c.name, dosage: c.dosage, lnF, nReference: ref.length, nCondition: cond.length,
    observedShiftEl: obs.difference, ciLow: obs.ciLow, ciHigh: obs.ciHigh,
  };
  if (lnF === null || lambda === null) {
    return { ...base, predictedShiftEl: null, predictedCiLow: null, predictedCiHigh: null, predictedTwoGradientEl: null, predictedLocalShiftEl: null, ...NO_RATIO, pRatioHolm: null };
  }
  const predicted = lambda.lambdaEl * lnF;
  const ends = [lambda.ciLowEl * lnF, lambda.ciHighEl * lnF].sort((p, q) => p - q);
  const twoGradient = lambdaPosteriorEl !== null ? twoGradientShiftEl(lnF, lambda.lambdaEl, lambdaPosteriorEl) : null;
  const ratio = ratioWithCi(obs.difference, obs.se, obs.dof, predicted, Math.abs(lnF) * lambda.seEl, lambda.dof, level);
  return { ...base, predictedShiftEl: predicted, predictedCiLow: ends[0], predictedCiHigh: ends[1], predictedTwoGradientEl: twoGradient, predictedLocalShiftEl: null, ...ratio, pRatioHolm: null };
}

/** A ratio observed/predicted with its interval and the two-sided p-value of ratio = 1. */
export interface RatioInterval {
  readonly ratio: number | null;
  readonly ratioCiLow: number | null;
  readonly ratioCiHigh: number | null;
  /** Fieller's interval beside the delta method's: null ends when unbounded (g ≥ 1); g null without a ratio. */
  readonly ratioFiellerLow: number | null;
  readonly ratioFiellerHigh: number | null;
  readonly fiellerG: number | null;
  readonly pRatio: number | null;
}

const NO_RATIO: RatioInterval = { ratio: null, ratioCiLow: null, ratioCiHigh: null, ratioFiellerLow: null, ratioFiellerHigh: null, fiellerG: null, pRatio: null };

/** Ratio O/P with a delta-method interval and a t-test of O/P = 1; nulls when P is zero (f = 1). */
export function ratioWithCi(
  observed: number, observedSe: number, observedDof: number,
  predicted: number, predictedSe: number, predictedDof: number, level = 0.95,
): RatioInterval {
  if (!(Math.abs(predicted) > 1e-12)) return NO_RATIO;
  const ratio = observed / predicted;
  // Var(O/P) ≈ (σO/P)² + (O·σP/P²)², written without dividing by O so it stays finite near O = 0.
  const se = Math.sqrt((observedSe / predicted) ** 2 + ((observed * predictedSe) / (predicted * predicted)) ** 2);
  const dof = Math.min(observedDof, predictedDof);
  const t = tQuantileOf(1 - (1 - level) / 2, dof);
  const p = tTwoSidedP((ratio - 1) / se, dof);
  const f = dof > 0 && Number.isFinite(observedSe) && Number.isFinite(predictedSe) ? fiellerInterval(observed, observedSe, predicted, predictedSe, dof, level) : { low: null, high: null, g: NaN };
  return {
    ratio, ratioCiLow: ratio - t * se, ratioCiHigh: ratio + t * se, ratioFiellerLow: f.low, ratioFiellerHigh: f.high,
    fiellerG: Number.isFinite(f.g) ? f.g : null, pRatio: Number.isFinite(p) ? p : null,
  };
}

/** λ_eff / λ_ref: fitted slope over the reference λ (both x/EL), with a delta-method interval that carries the
 *  uncertainty of both (t at min(the fit's dof, n_ref − 1)); nulls when either is missing. */
export function slopeRatio(
  fit: DosageFit, lambda: ReferenceLambda | null, level = 0.95,
): RatioInterval {
  if (lambda === null || !(fit.dof > 0)) return NO_RATIO;
  return ratioWithCi(fit.slopeEl, fit.slopeSeEl, fit.dof, lambda.lambdaEl, lambda.seEl, lambda.dof, level);
}
