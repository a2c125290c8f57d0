// Rows of the time-analysis tables (accumulation.csv, model_fit.csv); the caller writes them as CSV. NaN = empty cell.
import type { Estimate } from './accumulation-model';
import type { MovieSummary } from './summary';

/** A table cell: number (NaN → empty), text, or empty. */
export type Cell = string | number | null;

/** Columns of accumulation.csv: one row per movie × x/EL bin. */
export const ACCUMULATION_COLUMNS = [
  'file', 'x_el', 'x_um', 'tau_s', 'tau_ci_low_s', 'tau_ci_high_s', 'tau_se_s', 'steady_state', 'noise_sd', 'late_rise', 'still_rising',
] as const;

/** Columns of model_fit.csv: one row per movie. */
export const MODEL_FIT_COLUMNS = [
  'file', 'fit_start_el', 'fit_end_el', 'n',
  'tau0_s', 'tau0_ci_low_s', 'tau0_ci_high_s', 'k_per_s', 'k_ci_low_per_s', 'k_ci_high_per_s',
  'd_um2_per_s', 'd_ci_low_um2_per_s', 'd_ci_high_um2_per_s',
  'lambda_tau_el', 'lambda_tau_ci_low_el', 'lambda_tau_ci_high_el', 'lambda_el', 'lambda_ci_low_el', 'lambda_ci_high_el',
  'agreement', 'reading', 'note',
] as const;

/** accumulation.csv rows of one movie (none when τ(x) was not computed). */
export function accumulationRows(s: MovieSummary): Cell[][] {
  const a = s.accumulation;
  if (!a) return [];
  return Array.from(a.xEl, (x, i): Cell[] => [
    s.file, x, a.xUm[i], a.tauS[i], a.tauCiLowS[i], a.tauCiHighS[i], a.tauSeS[i], a.steadyState[i], a.noiseSd[i], a.lateRise[i], a.stillRising[i],
  ]);
}

const triple = (e: Estimate): Cell[] => [e.value, e.ciLow, e.ciHigh];

/** The model_fit.csv row of one movie; empty numbers and the reason in `note` when there is no fit. */
export function modelFitRow(s: MovieSummary): Cell[] {
  const m = s.model;
  if (!m) return [s.file, ...Array.from({ length: MODEL_FIT_COLUMNS.length - 4 }, () => null), 'unresolved', null, s.note];
  return [
    s.file, m.rangeEl[0], m.rangeEl[1], m.n, ...triple(m.tau0S), ...triple(m.kPerS),
    ...(s.accumulation && Number.isFinite(s.accumulation.xUm[0]) ? triple(m.dUm2PerS) : [null, null, null]),
    ...triple(m.lambdaTauEl), ...triple(m.lambdaEl), m.agreement, m.reading, s.note,
  ];
}
