// Dosage inference at the condition level. Dosage is set per condition, and the embryos of one condition share
// staining, imaging session and stage, so they are not independent replicates of the dose: the primary slope of
// position on ln f is fitted to the condition means (each one observation, t on k − 2 degrees of freedom). Beside it:
// all embryos with HC3 errors, the means weighted by 1/(SEM² + τ²) with a between-condition variance τ², and the
// measured dosage (amplitude ratio to the reference) by York's errors-in-both-variables fit.
import { lackOfFitTest, linearRegression, olsHc3, randomInterceptLine, tTwoSidedP, yorkFit, type SlopeEstimate } from '../stats';
import { positionQuantities } from './dosage-test';
import { meanOf, sdOf } from './stats-local';
import type { DosageFit, MeasuredDosage, Observation, ReferenceLambda, SlopeSummary } from '../model';

/** Mean, SEM and n of one quantity in one condition. */
interface ConditionPoint { readonly condition: string; readonly lnF: number; readonly mean: number; readonly sem: number; readonly n: number }

function summary(e: SlopeEstimate): SlopeSummary {
  return { slope: e.slope, slopeSe: e.slopeSe, intercept: e.intercept, ciLow: e.ciLow, ciHigh: e.ciHigh, dof: e.dof, pSlope: e.pSlope };
}

/** Runs a fit that throws on degenerate input (no spread, too few points); null then. */
function attempt<T>(f: () => T): T | null {
  try {
    return f();
  } catch {
    return null;
  }
}

/** Per-condition mean, SEM and n of the observations (all of one quantity, lnF known), in first-seen order. */
function conditionPoints(obs: readonly Observation[]): ConditionPoint[] {
  const by = new Map<string, Observation[]>();
  for (const o of obs) by.set(o.condition, [...(by.get(o.condition) ?? []), o]);
  return [...by.entries()].map(([condition, list]) => {
    const v = list.map((o) => o.value);
    return { condition, lnF: list[0].lnF as number, mean: meanOf(v), sem: sdOf(v) / Math.sqrt(v.length), n: v.length };
  });
}

/** Straight line through the condition means, one observation each, t on k − 2 dof; null with < 3 dosages. */
export function conditionMeansLine(x: readonly number[], y: readonly number[], level = 0.95): (SlopeSummary & { r2: number }) | null {
  if (x.length < 3 || new Set(x).size < 3) return null;
  const f = linearRegression(x, y, level);
  return {
    slope: f.slope, slopeSe: f.slopeSe, intercept: f.intercept, ciLow: f.slopeCi[0], ciHigh: f.slopeCi[1], dof: f.dof,
    pSlope: tTwoSidedP(f.slope / f.slopeSe, f.dof), r2: f.r2,
  };
}

/** Measured dosage per condition: mean amplitude over the reference's, SE of the log ratio by the delta method. */
export function measuredDosages(observations: readonly Observation[], reference: string, factors: ReadonlyMap<string, number | null>): MeasuredDosage[] {
  const points = conditionPoints(observations.filter((o) => o.kind === 'amplitude').map((o) => ({ ...o, lnF: o.lnF ?? 0 })));
  const ref = points.find((p) => p.condition === reference);
  if (!ref || !(ref.mean > 0)) return [];
  return points.filter((p) => p.mean > 0).map((p) => ({
    condition: p.condition, nominalFactor: factors.get(p.condition) ?? null, amplitudeRatio: p.mean / ref.mean,
    lnRatio: Math.log(p.mean / ref.mean),
    // The reference's own point carries its CV once; the others carry both CVs (their shared part is ignored).
    lnRatioSe: p.condition === reference ? ref.sem / ref.mean : Math.hypot(p.sem / p.mean, ref.sem / ref.mean),
  }));
}

/** York fit of position means on measured ln ratios (errors in both); null without ≥ 3 usable conditions. */
function measuredFit(points: readonly ConditionPoint[], measured: readonly MeasuredDosage[], level: number): SlopeSummary | null {
  const pairs = points.flatMap((p) => {
    const m = measured.find((d) => d.condition === p.condition);
    return m && m.lnRatioSe > 0 && p.sem > 0 ? [{ x: m.lnRatio, y: p.mean, wx: 1 / m.lnRatioSe ** 2, wy: 1 / p.sem ** 2 }] : [];
  });
  if (pairs.length < 3) return null;
  return attempt(() => summary(yorkFit(pairs.map((q) => q.x), pairs.map((q) => q.y), pairs.map((q) => q.wx), pairs.map((q) => q.wy), level)));
}

/** One DosageFit per position quantity with ≥ 3 embryos over ≥ 2 known dosages. */
export function dosageFits(
  observations: readonly Observation[], lambda: ReferenceLambda | null, lambdaPosteriorEl: number | null,
  measured: readonly MeasuredDosage[] = [], level = 0.95,
): DosageFit[] {
  const out: DosageFit[] = [];
  for (const quantity of positionQuantities(observations)) {
    const pts = observations.filter((o) => o.quantity === quantity && o.unit === 'EL' && o.lnF !== null);
    const x = pts.map((o) => o.lnF as number), y = pts.map((o) => o.value);
    if (pts.length < 3 || new Set(x).size < 2) continue;
    const points = conditionPoints(pts);
    const hc3 = attempt(() => olsHc3(x, y, level));
    const means = conditionMeansLine(points.map((p) => p.lnF), points.map((p) => p.mean), level);
    const primary = means ?? (hc3 ? { ...summary(hc3), r2: linearRegression(x, y, level).r2 } : null);
    if (!primary) continue;
    const withSem = points.filter((p) => p.sem > 0);
    const re = withSem.length >= 3 && new Set(withSem.map((p) => p.lnF)).size >= 3
      ? attempt(() => randomInterceptLine(withSem.map((p) => p.lnF), withSem.map((p) => p.mean), withSem.map((p) => p.sem ** 2), level))
      : null;
    const lof = lackOfFitTest(x, y);
    const lam = lambda?.lambdaEl ?? null;
    out.push({
      quantity, method: means ? 'condition-means' : 'embryos-hc3',
      slopeEl: primary.slope, slopeSeEl: primary.slopeSe, ciLow: primary.ciLow, ciHigh: primary.ciHigh,
      interceptEl: primary.intercept, r2: primary.r2, n: pts.length, conditions: points.length, dof: primary.dof, pSlope: primary.pSlope,
      lackOfFit: Number.isFinite(lof.p) ? lof : null,
      embryosHc3: hc3 ? summary(hc3) : null,
      randomIntercept: re ? { ...summary(re), tau2: re.tau2 } : null,
      measured: measuredFit(points, measured, level),
      predictedSlopeEl: lam,
      predictedTwoGradientSlopeEl: lam !== null && lambdaPosteriorEl !== null ? 1 / (1 / lam + 1 / lambdaPosteriorEl) : null,
      localLambdaEl: null, localLambdaSeEl: null,
    });
  }
  return out;
}

/** λ (x/EL) against ln f through the condition means: a formal test that dosage leaves λ unchanged. */
export function lambdaTrend(observations: readonly Observation[], level = 0.95): SlopeSummary | null {
  const pts = observations.filter((o) => o.kind === 'lambda' && o.unit === 'EL' && o.lnF !== null);
  const points = conditionPoints(pts);
  return conditionMeansLine(points.map((p) => p.lnF), points.map((p) => p.mean), level);
}
