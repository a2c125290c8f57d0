// CSV tables of the cohort step (tidy: one row per observation; units in column names or a unit column).
import { toCsv, type CsvValue } from '../csv';
import type { CohortAnalysis } from '../model';

/** conditions.csv: one row per condition × quantity × unit. */
export function conditionsCsv(a: CohortAnalysis): string {
  return toCsv(
    ['condition', 'dosage', 'quantity', 'unit', 'n', 'mean', 'sd', 'sem', 'ci_low', 'ci_high'],
    a.stats.map((s) => [s.condition, s.dosage, s.quantity, s.unit, s.n, s.mean, s.sd, s.sem, s.ciLow, s.ciHigh]),
  );
}

/** shifts.csv: observed vs predicted shift per position quantity and non-reference condition (x/EL). */
export function shiftsCsv(a: CohortAnalysis): string {
  return toCsv(
    ['quantity', 'condition', 'dosage', 'ln_f', 'observed_shift_el', 'ci_low', 'ci_high', 'predicted_shift_el',
      'predicted_ci_low', 'predicted_ci_high', 'predicted_two_gradient_el', 'ratio', 'ratio_ci_low', 'ratio_ci_high'],
    a.shifts.map((s) => [s.quantity, s.condition, s.dosage, s.lnF, s.observedShiftEl, s.ciLow, s.ciHigh, s.predictedShiftEl,
      s.predictedCiLow, s.predictedCiHigh, s.predictedTwoGradientEl, s.ratio, s.ratioCiLow, s.ratioCiHigh]),
  );
}

/** dosage_fit.csv: regression of position (x/EL) on ln f per quantity, with the predicted slope λ and, when an
 * opposing gradient's decay length is given, the two-gradient slope (else empty). */
export function dosageFitCsv(a: CohortAnalysis): string {
  return toCsv(
    ['quantity', 'slope_el', 'ci_low', 'ci_high', 'intercept_el', 'r2', 'n', 'predicted_slope_el', 'predicted_two_gradient_slope_el'],
    a.dosageFits.map((f) => [f.quantity, f.slopeEl, f.ciLow, f.ciHigh, f.interceptEl, f.r2, f.n, f.predictedSlopeEl, f.predictedTwoGradientSlopeEl]),
  );
}

/** positional_error.csv: mean profile ± SD per condition on the grid, and σx in x/EL and µm (long format). */
export function positionalErrorCsv(a: CohortAnalysis): string {
  const rows: CsvValue[][] = [];
  for (const p of a.profiles) {
    for (let i = 0; i < p.xEl.length; i++) {
      rows.push([p.condition, a.options.normalisation, p.xEl[i], p.n[i], p.mean[i], p.sd[i], p.slopePerEl[i], p.sigmaXEl[i], p.sigmaXUm[i]]);
    }
  }
  return toCsv(['condition', 'normalisation', 'x_el', 'n', 'mean', 'sd', 'slope_per_el', 'sigma_x_el', 'sigma_x_um'], rows);
}
