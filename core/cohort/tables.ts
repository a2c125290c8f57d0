// CSV tables of the cohort step (tidy: one row per observation; units in column names or a unit column).
import { toCsv, type CsvValue } from '../csv';
import type { CohortAnalysis, SlopeSummary } from '../model';

/** conditions.csv: one row per condition × quantity × unit; the SD of a position is its positional error, with a
 *  chi-square interval. */
export function conditionsCsv(a: CohortAnalysis): string {
  return toCsv(
    ['condition', 'dosage', 'quantity', 'unit', 'n', 'mean', 'sd', 'sem', 'ci_low', 'ci_high', 'median', 'sd_ci_low', 'sd_ci_high'],
    a.stats.map((s) => [s.condition, s.dosage, s.quantity, s.unit, s.n, s.mean, s.sd, s.sem, s.ciLow, s.ciHigh, s.median, s.sdCiLow, s.sdCiHigh]),
  );
}

/** shifts.csv: observed vs predicted shift per position quantity and non-reference condition (x/EL). */
export function shiftsCsv(a: CohortAnalysis): string {
  return toCsv(
    ['quantity', 'condition', 'dosage', 'ln_f', 'observed_shift_el', 'ci_low', 'ci_high', 'predicted_shift_el',
      'predicted_ci_low', 'predicted_ci_high', 'predicted_two_gradient_el', 'ratio', 'ratio_ci_low', 'ratio_ci_high',
      'p_ratio_1', 'p_ratio_1_holm', 'predicted_local_el', 'ratio_fieller_low', 'ratio_fieller_high', 'fieller_g'],
    a.shifts.map((s) => [s.quantity, s.condition, s.dosage, s.lnF, s.observedShiftEl, s.ciLow, s.ciHigh, s.predictedShiftEl,
      s.predictedCiLow, s.predictedCiHigh, s.predictedTwoGradientEl, s.ratio, s.ratioCiLow, s.ratioCiHigh, s.pRatio, s.pRatioHolm, s.predictedLocalShiftEl,
      s.ratioFiellerLow, s.ratioFiellerHigh, s.fiellerG]),
  );
}

/** Columns of dosage_fit.csv. */
export const DOSAGE_FIT_COLUMNS = [
  'quantity', 'method', 'slope_el', 'slope_se_el', 'ci_low', 'ci_high', 'dof', 'p_slope', 'intercept_el', 'r2', 'n',
  'conditions', 'lack_of_fit_f', 'lack_of_fit_p', 'tau2_el2', 'predicted_slope_el', 'predicted_two_gradient_slope_el',
  'local_lambda_el', 'local_lambda_se_el',
] as const;

/** dosage_fit.csv: per position quantity, the primary regression on ln f (method `condition-means`, or
 * `embryos-hc3` with two dosages) with the lack-of-fit test, then one row per alternative fit: `embryos-hc3`,
 * `random-intercept` and `measured-dosage` (ln of the amplitude ratio, York fit). The predicted slope λ and the
 * two-gradient slope (when an opposing gradient's decay length is given) are on every row of the quantity. */
export function dosageFitCsv(a: CohortAnalysis): string {
  const rows: CsvValue[][] = [];
  for (const f of a.dosageFits) {
    const tail = [f.predictedSlopeEl, f.predictedTwoGradientSlopeEl, f.localLambdaEl, f.localLambdaSeEl];
    rows.push([f.quantity, f.method, f.slopeEl, f.slopeSeEl, f.ciLow, f.ciHigh, f.dof, f.pSlope, f.interceptEl, f.r2, f.n,
      f.conditions, f.lackOfFit?.f, f.lackOfFit?.p, null, ...tail]);
    const alt = (method: string, s: SlopeSummary | null, tau2: number | null = null): void => {
      if (s) rows.push([f.quantity, method, s.slope, s.slopeSe, s.ciLow, s.ciHigh, s.dof, s.pSlope, s.intercept, null, f.n, f.conditions, null, null, tau2, ...tail]);
    };
    if (f.method !== 'embryos-hc3') alt('embryos-hc3', f.embryosHc3);
    alt('random-intercept', f.randomIntercept, f.randomIntercept?.tau2 ?? null);
    alt('measured-dosage', f.measured);
    const adj = f.adjusted;
    if (adj) {
      rows.push([f.quantity, `${ADJUSTED_METHOD}:${adj.covariates.join('+')}`, adj.slope, adj.slopeSe, adj.ciLow, adj.ciHigh, adj.dof, adj.pSlope, adj.intercept, adj.r2,
        adj.n, adj.conditions, null, null, null, ...tail]);
    }
  }
  return toCsv(DOSAGE_FIT_COLUMNS, rows);
}

/** The method of a covariate-adjusted row in dosage_fit.csv, followed by `:` and the covariates joined by `+`. */
export const ADJUSTED_METHOD = 'covariate-adjusted';

/** Columns of covariates.csv. */
export const COVARIATE_COLUMNS = [
  'quantity', 'covariate', 'term', 'kind', 'level', 'base_level', 'coefficient_el', 'se_el', 'ci_low', 'ci_high', 'dof', 'p',
  'mean_value', 'n', 'conditions', 'slope_unadjusted_el', 'slope_adjusted_el', 'slope_adjusted_se_el', 'slope_adjusted_se_means_only_el',
] as const;

/** covariates.csv, or null when no covariate was asked for: per position quantity and term, the coefficient
 *  estimated within conditions (x/EL per unit of the column; per level against the base level), and beside it the
 *  unadjusted and adjusted slopes on ln f. */
export function covariatesCsv(a: CohortAnalysis): string | null {
  if (!a.covariates) return null;
  const rows: CsvValue[][] = [];
  for (const f of a.dosageFits) {
    const adj = f.adjusted;
    if (!adj) continue;
    for (const t of adj.terms) {
      rows.push([f.quantity, t.covariate, t.term, t.kind, t.level, t.baseLevel, t.coefficientEl, t.seEl, t.ciLow, t.ciHigh, t.dof, t.p,
        t.meanValue, adj.n, adj.conditions, f.slopeEl, adj.slope, adj.slopeSe, adj.slopeSeMeansOnly]);
    }
  }
  return toCsv(COVARIATE_COLUMNS, rows);
}

/** positional_error.csv: mean profile ± SD per condition on the grid, and σx in x/EL and µm (long format). */
export function positionalErrorCsv(a: CohortAnalysis): string {
  const rows: CsvValue[][] = [];
  for (const p of a.profiles) {
    for (let i = 0; i < p.xEl.length; i++) {
      rows.push([p.condition, p.normalisation, p.xEl[i], p.n[i], p.mean[i], p.sd[i], p.sdNoise[i], p.sdBetween[i], p.slopePerEl[i],
        p.sigmaXEl[i], p.sigmaXCiLowEl[i], p.sigmaXCiHighEl[i], p.sigmaXUm[i]]);
    }
  }
  return toCsv(['condition', 'normalisation', 'x_el', 'n', 'mean', 'sd', 'sd_noise', 'sd_between', 'slope_per_el', 'sigma_x_el',
    'sigma_x_ci_low_el', 'sigma_x_ci_high_el', 'sigma_x_um'], rows);
}
