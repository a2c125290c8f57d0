// Reliability flags of a cohort: per condition, how many embryos have a usable λ (relative SE above a threshold
// flags an imprecise fit), the median λ beside the mean, how often each boundary or landmark was found, and which
// x/EL fit ranges the embryos used (mixed ranges make λ values less comparable).
import type { EmbryoResult } from '../model';
import { positionQuantities } from './dosage-test';
import { observationsOf } from './observations';
import type { ConditionInfo, ConditionReliability, FitRangeUse, Observation } from '../model';

/** Relative SE of λ above which a fit is flagged as imprecise (common practice: 25%). */
export const LAMBDA_RELATIVE_SE_LIMIT = 0.25;

function median(values: readonly number[]): number {
  if (values.length === 0) return NaN;
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Reliability per condition (in the order of `groups`). */
export function conditionReliability(
  groups: readonly { readonly condition: ConditionInfo; readonly embryos: readonly EmbryoResult[] }[], observations: readonly Observation[],
): ConditionReliability[] {
  const quantities = positionQuantities(observations);
  return groups.map(({ condition, embryos }) => {
    const fits = embryos.flatMap((e) => (e.gradientFit && Number.isFinite(e.gradientFit.lambdaEl) ? [e.gradientFit] : []));
    const lambdas = fits.map((f) => f.lambdaEl);
    const obs = embryos.flatMap((e) => observationsOf(e, condition));
    const detected = Object.fromEntries(quantities.map((q) => [q, new Set(obs.filter((o) => o.quantity === q && o.unit === 'EL').map((o) => o.file)).size]));
    return {
      condition: condition.name, embryos: embryos.length, lambdaFitted: fits.length,
      lambdaImprecise: fits.filter((f) => !(f.lambdaSeEl / Math.abs(f.lambdaEl) <= LAMBDA_RELATIVE_SE_LIMIT)).length,
      lambdaMeanEl: lambdas.length ? lambdas.reduce((s, v) => s + v, 0) / lambdas.length : NaN, lambdaMedianEl: median(lambdas), detected,
    };
  });
}

/** Distinct fit ranges of the embryos' λ fits, most used first. */
export function fitRangesUsed(results: readonly EmbryoResult[]): FitRangeUse[] {
  const uses = new Map<string, FitRangeUse>();
  for (const r of results) {
    const f = r.gradientFit;
    if (!f) continue;
    const key = `${f.fitRangeEl[0]},${f.fitRangeEl[1]}`;
    const u = uses.get(key);
    uses.set(key, { startEl: f.fitRangeEl[0], endEl: f.fitRangeEl[1], embryos: (u?.embryos ?? 0) + 1 });
  }
  return [...uses.values()].sort((a, b) => b.embryos - a.embryos);
}

/** Pearson correlation across the reference's embryos between λ (EL) and one position (EL); NaN with < 3 pairs. */
export function lambdaPositionCorrelation(observations: readonly Observation[], reference: string, quantity: string): number {
  const lam = new Map(observations.filter((o) => o.condition === reference && o.kind === 'lambda' && o.unit === 'EL').map((o) => [o.file, o.value]));
  const pairs = observations.filter((o) => o.condition === reference && o.quantity === quantity && o.unit === 'EL' && lam.has(o.file))
    .map((o) => [lam.get(o.file) as number, o.value] as const);
  if (pairs.length < 3) return NaN;
  const mx = pairs.reduce((s, p) => s + p[0], 0) / pairs.length, my = pairs.reduce((s, p) => s + p[1], 0) / pairs.length;
  let sxy = 0, sxx = 0, syy = 0;
  for (const [a, b] of pairs) { sxy += (a - mx) * (b - my); sxx += (a - mx) ** 2; syy += (b - my) ** 2; }
  return sxx > 0 && syy > 0 ? sxy / Math.sqrt(sxx * syy) : NaN;
}
