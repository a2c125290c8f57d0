// The tidy CSV tables a batch writes: one row per observation, units in the column names. Rows are keyed by (file,
// time point): t_index and t_s are the last two columns of embryos.csv, boundaries.csv and profiles.csv (appended, so
// that readers of the older tables by position keep working); t_index is 0 and t_s the file's time (often empty) for a
// file with one time point.
import { embryoResults, resultTimeIndex, type Boundary, type EmbryoResult, type ExponentialFit, type Profile } from '../model';

export { embryoResults };
import { toCsv, type CsvValue } from '../csv';
import { clipMessage, warningsCell } from './messages';

/** The measurement columns of one result (embryos.csv without its time columns; timecourse.csv after file, t_index, t_s). */
export const EMBRYO_MEASURE_COLUMNS = [
  'file', 'status', 'error', 'warnings', 'pixel_size_um', 'pixel_size_source', 'egg_length_um', 'egg_width_um',
  'anterior_x_px', 'anterior_y_px', 'posterior_x_px', 'posterior_y_px', 'axis_source', 'gradient_channel',
  'lambda_um', 'lambda_el', 'lambda_se_um', 'lambda_ci_low_um', 'lambda_ci_high_um',
  'lambda_se_model_um', 'lambda_se_serial_um', 'lambda_se_source', 'residual_lag1', 'fit_weighting',
  'amplitude', 'background', 'r2',
  'fit_start_el', 'fit_end_el', 'boundary_el', 'boundary_width_el', 'boundary_width_10_90_el',
] as const;

/** embryos.csv's columns of each side measured on its own (--edge-side each; empty otherwise): each side's λ, and the
 *  paired difference dorsal − ventral with its SE, 95% interval, which SE was used and the sides' error correlation. */
export const SIDE_COLUMNS = [
  'lambda_dorsal_um', 'lambda_dorsal_el', 'lambda_dorsal_se_um', 'lambda_dorsal_ci_low_um', 'lambda_dorsal_ci_high_um',
  'lambda_ventral_um', 'lambda_ventral_el', 'lambda_ventral_se_um', 'lambda_ventral_ci_low_um', 'lambda_ventral_ci_high_um',
  'lambda_dorsal_minus_ventral_um', 'lambda_dorsal_minus_ventral_el', 'lambda_dorsal_minus_ventral_se_um', 'lambda_dorsal_minus_ventral_se_el',
  'lambda_dorsal_minus_ventral_ci_low_um', 'lambda_dorsal_minus_ventral_ci_high_um', 'lambda_dorsal_minus_ventral_ci_low_el', 'lambda_dorsal_minus_ventral_ci_high_el',
  'lambda_dorsal_minus_ventral_se_source', 'side_error_correlation',
] as const;

/** The key columns added to the per-result tables: time point (0-based) and its time in s (empty when unknown). */
export const TIME_COLUMNS = ['t_index', 't_s'] as const;

/** Columns of embryos.csv, one row per input file (a movie's: its last analysed time point). */
export const EMBRYO_COLUMNS = [...EMBRYO_MEASURE_COLUMNS, ...SIDE_COLUMNS, ...TIME_COLUMNS] as const;

/** Columns of boundaries.csv, one row per file × time point × channel × method. */
export const BOUNDARY_COLUMNS = [
  'file', 'channel', 'method', 'position_el', 'position_um', 'width_el', 'width_10_90_el', 'position_se_el', 'direction', 'note', ...TIME_COLUMNS,
] as const;

/** Columns of profiles.csv (long format), one row per file × time point × channel × bin. */
export const PROFILE_COLUMNS = ['file', 'channel', 'x_el', 'x_um', 'mean', 'sd', 'n', ...TIME_COLUMNS] as const;

/** The t_index and t_s cells of a result. */
function timeCells(r: EmbryoResult): CsvValue[] {
  return [resultTimeIndex(r), r.tS ?? null];
}

/** Columns of landmarks.csv, one row per hand-marked landmark. */
export const LANDMARK_COLUMNS = ['file', 'name', 'x_px', 'y_px', 'x_el', 'x_um', 'off_axis_um'] as const;

/** The summary boundary of one embryo: first boundary channel, its logistic result if present, else its first method. */
export function summaryBoundary(result: EmbryoResult): Boundary | null {
  const first = result.boundaries[0];
  if (first === undefined) return null;
  const sameChannel = result.boundaries.filter((b) => b.channel === first.channel);
  return sameChannel.find((b) => b.method === 'logistic') ?? first;
}

/** One embryos.csv row (cells in EMBRYO_COLUMNS order). */
export function embryoRow(r: EmbryoResult): CsvValue[] {
  return [...embryoMeasureRow(r), ...sideCells(r), ...timeCells(r)];
}

/** The SIDE_COLUMNS cells of a result (all empty when the sides were not measured apart). */
export function sideCells(r: EmbryoResult): CsvValue[] {
  const s = r.sides;
  const fitCells = (f: ExponentialFit | null | undefined): CsvValue[] => [f?.lambdaUm, f?.lambdaEl, f?.lambdaSeUm, f?.lambdaCiLowUm, f?.lambdaCiHighUm];
  const d = s?.difference;
  return [
    ...fitCells(s?.dorsalFit), ...fitCells(s?.ventralFit),
    d?.lambdaUm, d?.lambdaEl, d?.seUm, d?.seEl, d?.ciLowUm, d?.ciHighUm, d?.ciLowEl, d?.ciHighEl, d?.seSource, d?.sideCorrelation,
  ];
}

/** The measurement cells of one result (EMBRYO_MEASURE_COLUMNS order). */
export function embryoMeasureRow(r: EmbryoResult): CsvValue[] {
  const fit = r.gradientFit;
  const boundary = summaryBoundary(r);
  return [
    r.file, r.status, r.error === null ? null : clipMessage(r.error), warningsCell(r.warnings), r.pixelSizeUm, r.pixelSizeSource, r.eggLengthUm, r.eggWidthUm,
    r.axis?.anterior.x, r.axis?.anterior.y, r.axis?.posterior.x, r.axis?.posterior.y, r.axis?.source,
    r.gradientChannel, fit?.lambdaUm, fit?.lambdaEl, fit?.lambdaSeUm, fit?.lambdaCiLowUm, fit?.lambdaCiHighUm,
    fit?.lambdaSeModelUm, fit?.lambdaSeSerialUm, fit?.lambdaSeSource, fit?.residualLag1,
    fit ? (fit.weighted ? 'inverse-variance' : 'none') : null,
    fit?.amplitude, fit?.background, fit?.r2, fit?.fitRangeEl[0], fit?.fitRangeEl[1],
    boundary?.positionEl, boundary?.widthEl, width1090El(boundary?.widthEl ?? null),
  ];
}

/** embryos.csv text: one row per file (embryoResults), in the given order. */
export function embryosCsv(results: readonly EmbryoResult[]): string {
  return toCsv(EMBRYO_COLUMNS, embryoResults(results).map(embryoRow));
}

/** The logistic's 10–90% width, the distance over which it goes from 10% to 90% of its step: 2·ln 9·w ≈ 4.394·w. */
export function width1090El(widthEl: number | null): number | null {
  return widthEl === null ? null : 2 * Math.log(9) * widthEl;
}

/** boundaries.csv text: every boundary of every result (every analysed time point of a movie). */
export function boundariesCsv(results: readonly EmbryoResult[]): string {
  const rows = results.flatMap((r) => r.boundaries.map((b): CsvValue[] => [
    r.file, b.channel, b.method, b.positionEl, b.positionUm, b.widthEl, width1090El(b.widthEl), b.positionSeEl, b.direction, b.note, ...timeCells(r),
  ]));
  return toCsv(BOUNDARY_COLUMNS, rows);
}

/** The profiles of one embryo: the gradient channel's, then each boundary channel's not already listed. */
export function embryoProfiles(result: EmbryoResult): Profile[] {
  const all = result.gradientProfile ? [result.gradientProfile, ...result.boundaryProfiles] : [...result.boundaryProfiles];
  return all.filter((p, i) => all.findIndex((q) => q.channel === p.channel) === i);
}

/** profiles.csv text (long format): one row per bin of every profile of every result (every analysed time point of a movie). */
export function profilesCsv(results: readonly EmbryoResult[]): string {
  const rows: CsvValue[][] = [];
  for (const r of results) {
    const [t, tS] = timeCells(r);
    for (const p of embryoProfiles(r)) {
      for (let i = 0; i < p.xEl.length; i += 1) rows.push([r.file, p.channel, p.xEl[i], p.xUm[i], p.mean[i], p.sd[i], p.n[i], t, tS]);
    }
  }
  return toCsv(PROFILE_COLUMNS, rows);
}

/** landmarks.csv text: every landmark of each file's embryo row (embryoResults) with its image position and its projection on the AP axis. */
export function landmarksCsv(results: readonly EmbryoResult[]): string {
  const rows = embryoResults(results).flatMap((r) => r.landmarks.map((l): CsvValue[] => [
    r.file, l.name, l.point.x, l.point.y, l.xEl, l.xUm, l.offAxisUm,
  ]));
  return toCsv(LANDMARK_COLUMNS, rows);
}
