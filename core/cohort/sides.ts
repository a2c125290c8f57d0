// The dorsal − ventral difference of λ across a cohort (embryos measured with --edge-side each). Each embryo gives one
// paired difference; a condition's mean of them is summarised with the spread between embryos (t interval on n − 1
// dof), which holds whatever made the sides differ within an embryo, and tested against zero (Holm across conditions).
import { notDecayingReasons, tTwoSidedP, holmAdjust } from '../stats';
import type { ConditionInfo, EmbryoResult, Observation, SideDifferenceRow } from '../model';
import { toCsv } from '../csv';
import { describeSample } from './describe';

/** Quantity key of the paired difference λ_dorsal − λ_ventral (conditions.csv's `quantity`). */
export const SIDE_DIFFERENCE_QUANTITY = 'lambda_dorsal_minus_ventral';

/** The embryo's paired difference as observations (EL, and µm when known), when both sides' fits decay. */
export function sideObservations(result: EmbryoResult, condition: string, lnF: number | null): Observation[] {
  const s = result.sides;
  const d = s?.difference;
  if (!s || !d || !s.dorsalFit || !s.ventralFit) return [];
  if (notDecayingReasons(s.dorsalFit).length > 0 || notDecayingReasons(s.ventralFit).length > 0) return [];
  const base = { file: result.file, condition, lnF, quantity: SIDE_DIFFERENCE_QUANTITY, kind: 'side-difference' as const };
  return [
    ...(Number.isFinite(d.lambdaEl) ? [{ ...base, unit: 'EL' as const, value: d.lambdaEl }] : []),
    ...(Number.isFinite(d.lambdaUm) ? [{ ...base, unit: 'um' as const, value: d.lambdaUm }] : []),
  ];
}

/** Per condition with any paired difference: mean, t interval, test of zero and Holm's adjustment across them. */
export function sideDifferences(observations: readonly Observation[], conditions: readonly ConditionInfo[], level = 0.95): SideDifferenceRow[] {
  const of = (c: string, unit: 'EL' | 'um'): number[] => observations
    .filter((o) => o.kind === 'side-difference' && o.condition === c && o.unit === unit).map((o) => o.value);
  const rows = conditions.filter((c) => of(c.name, 'EL').length > 0).map((c) => {
    const el = describeSample(of(c.name, 'EL'), level);
    const umValues = of(c.name, 'um');
    const um = describeSample(umValues, level);
    const p = el.n >= 2 && el.sem > 0 ? tTwoSidedP(el.mean / el.sem, el.n - 1) : NaN;
    return {
      condition: c.name, dosage: c.dosage, n: el.n, meanEl: el.mean, sdEl: el.sd, semEl: el.sem, ciLowEl: el.ciLow, ciHighEl: el.ciHigh,
      nUm: umValues.length, meanUm: um.mean, ciLowUm: um.ciLow, ciHighUm: um.ciHigh, p, pHolm: NaN,
    };
  });
  const adjusted = holmAdjust(rows.map((r) => r.p));
  return rows.map((r, i) => ({ ...r, pHolm: adjusted[i] }));
}

/** Columns of side_differences.csv. */
export const SIDE_DIFFERENCE_COLUMNS = [
  'condition', 'dosage', 'n', 'mean_el', 'sd_el', 'sem_el', 'ci_low_el', 'ci_high_el', 'n_um', 'mean_um', 'ci_low_um', 'ci_high_um', 'p_zero', 'p_zero_holm',
] as const;

/** side_differences.csv text: one row per condition with paired differences; null when no embryo had one. */
export function sideDifferencesCsv(rows: readonly SideDifferenceRow[] | undefined): string | null {
  if (!rows || rows.length === 0) return null;
  return toCsv(SIDE_DIFFERENCE_COLUMNS, rows.map((r) => [
    r.condition, r.dosage, r.n, r.meanEl, r.sdEl, r.semEl, r.ciLowEl, r.ciHighEl, r.nUm, r.meanUm, r.ciLowUm, r.ciHighUm, r.p, r.pHolm,
  ]));
}
