// The time analysis of a batch: every file with more than one time point is analysed per time point (axis once per
// movie, or per time point), its results keyed by (file, time point) join the batch's, and each movie is summarised
// (λ(t), τ(x), the model fit) and written as tables, SVG figures and a page. The summary is made from the records and
// results alone, so a merge of parts makes the same one.
import { promises as fs } from 'node:fs';
import { join } from 'node:path';
import { editsForFile, embryoMeasureRow, EMBRYO_MEASURE_COLUMNS, LANDMARK_COLUMNS, normalizeResult, sideCells, SIDE_COLUMNS, summaryBoundary } from '../../core/batch';
import { toCsv, type CsvValue } from '../../core/csv';
import type { ProjectDoc } from '../../core/contract';
import { accumulationFigure, figureSlug, kymographFigure, lambdaOverTimeFigure, type AccumulationFigureInput, type KymographInput, type LambdaPoint } from '../../core/figures';
import {
  resultKey, resultKeyOf, withTimePoint, type Detection, type EmbryoResult, type HandEdits, type MovieRecord, type PlaneSource, type ProjectedStack, type StackInfo,
} from '../../core/model';
import { analyseMovie } from '../../core/pipeline';
import { inputFolderOf, loadImageCorrections } from './correction-images';
import { settingsInForce, timePointsForMovie, type AnalysisSettings } from '../../core/settings';
import { pagesAsTimePointsWithSource, resolveTimeAxis } from '../../core/tiff';
import {
  ACCUMULATION_COLUMNS, accumulationRows, MODEL_FIT_COLUMNS, modelFitRow, parseTimeSelection, summarizeMovie,
} from '../../core/timelapse';
import { writeFileAtomic } from '../project';
import { openStack } from './deps';
import { fileMessage } from './analyse-file';
import { timelapsePage } from './timelapse-page';

import type { MovieFailure, MovieOutcome, TimelapseOptions } from './timelapse-options';
export { DEFAULT_TIMELAPSE_OPTIONS, TIMELAPSE_FILES, type MovieFailure, type MovieOutcome, type TimelapseOptions } from './timelapse-options';

/** The hand edits and settings in force for one file at time point t (null: the file's own): the file's (they apply
 *  to every time point), with that time point's own edits over them. */
function editsAt(doc: ProjectDoc | null, file: string, settings: AnalysisSettings, t: number | null): { handEdits: HandEdits | null; settings: AnalysisSettings } {
  const e = editsForFile(doc, file, undefined, t);
  return { handEdits: e ? { axis: e.axis, landmarks: e.landmarks } : null, settings: settingsInForce(settings, e) };
}

/** Where a file's time points come from, as its warnings name it: the file's own in the project, or --time. */
export const OWN_TIME_ASKED_BY = 'this file\'s time points in the project';

/** Who asked for the time points of `file`: the project's entry for the file when it gives its own, else --time. */
function timeAskedBy(doc: ProjectDoc | null, file: string): string {
  return editsForFile(doc, file, undefined, null)?.time !== undefined ? OWN_TIME_ASKED_BY : '--time';
}

/** The time options for one file: its own time points and time step from the project file (per-file `time`,
 *  `timeStepS`) over the run's (--time, --time-step), as a file's own fit range or dorsal side beats the shared one. */
export function fileTimelapseOptions(doc: ProjectDoc | null, file: string, options: TimelapseOptions): TimelapseOptions {
  const own = editsForFile(doc, file, undefined, null);
  if (!own || (own.time === undefined && own.timeStepS === undefined)) return options;
  return {
    ...options,
    selection: own.time !== undefined ? parseTimeSelection(own.time, `${file}: time`) : options.selection,
    timeStepS: own.timeStepS ?? options.timeStepS,
  };
}

/** The movie's StackInfo and plane source for the time pass: plain multi-page files become frames when the user
 *  gives a time step. */
export function asMovie(opened: { info: StackInfo; source: PlaneSource }, timeStepS: number | null): { info: StackInfo; source: PlaneSource } {
  return timeStepS !== null && opened.info.sizeT === 1 && !opened.info.isOme ? pagesAsTimePointsWithSource(opened.info, opened.source) : opened;
}

/** One movie as analysed: its record (what results.json keeps) and its results per time point, in time order. */
export interface MovieRun {
  readonly record: MovieRecord;
  readonly results: readonly EmbryoResult[];
}

/** A record of a movie with no analysed time points: one that failed (`error`), or whose chosen time points all lie
 *  past its end (no error; `warnings` says so). */
function emptyRecord(file: string, error: string | null, warnings: readonly string[], settings: AnalysisSettings, options: TimelapseOptions): MovieRecord {
  return {
    file, timeIndices: [], timesS: null, timeSource: null, fitRangeEl: settings.fitRangeEl, modelRangeEl: options.tauRangeEl,
    baselineFrames: options.baselineFrames, warnings, error,
  };
}

/** What the window follows while a movie is analysed: progress, each time point's projection, cancelling. */
export interface MovieHooks {
  readonly onTimePoint?: (done: number, total: number) => void;
  readonly onProjected?: (k: number, projected: ProjectedStack, total: number) => void;
  /** Told the movie's StackInfo (its time points as the time pass reads them) before any time point is analysed. */
  readonly onInfo?: (info: StackInfo) => void;
  /** Told the embryo found once for the movie (not with axisPerTime), before the first time point is analysed. */
  readonly onDetection?: (detection: Detection) => void;
  readonly signal?: { readonly aborted: boolean } | null;
}

/**
 * An opened movie analysed over time (the batch and the window share this); null when it has one time point. Every
 * result is keyed by its time point and time and normalised as the journal stores results, so tables made from it
 * equal those made from results.json read back.
 */
async function analyseOpenedMovie(
  opened: { info: StackInfo; source: PlaneSource }, file: string, settings: AnalysisSettings, doc: ProjectDoc | null,
  runOptions: TimelapseOptions, hooks: MovieHooks, baseDir: string,
): Promise<MovieRun | null> {
  const options = fileTimelapseOptions(doc, file, runOptions);
  const { info, source } = asMovie(opened, options.timeStepS);
  if (info.sizeT <= 1) return null;
  hooks.onInfo?.(info);
  // One --time over movies of unequal length: each is analysed over the time points it has, with a warning when cut.
  const chosen = timePointsForMovie(options.selection, info.sizeT, file, timeAskedBy(doc, file));
  const cut = chosen.warning === null ? [] : [chosen.warning];
  if (chosen.tIndices.length === 0) return { record: emptyRecord(file, null, cut, settings, options), results: [] };
  const picked = [...chosen.tIndices];
  // The warning comes first in each result's warnings: it says which time point the row is (a cell may be cut).
  const warnings: string[] = [...cut];
  const axis = resolveTimeAxis(info, options.timeStepS, warnings);
  const own = editsAt(doc, file, settings, null);
  const corrections = await loadImageCorrections(settings, baseDir);
  const m = await analyseMovie(info, source, own.settings, {
    corrections,
    fileLabel: file, handEdits: own.handEdits, editsAt: (t) => editsAt(doc, file, settings, t),
    timeIndices: picked, axisPerTime: options.axisPerTime, ...hooks,
  });
  const timesS = axis.timesS ? Float64Array.from(picked, (t) => axis.timesS![t]) : null;
  const results = m.results.map((r, k) => normalizeResult(withTimePoint({ ...r, warnings: [...cut, ...r.warnings] }, picked[k], timesS ? timesS[k] : null)));
  const record: MovieRecord = {
    file, timeIndices: picked, timesS, timeSource: axis.timesS ? axis.source : null, fitRangeEl: own.settings.fitRangeEl, modelRangeEl: options.tauRangeEl,
    baselineFrames: options.baselineFrames, warnings, error: null,
  };
  return { record, results };
}

/** Analyse one file as a movie; null when it has a single time point (or does not open: the main pass reports that).
 *  Never rejects. */
export async function analyseMovieFile(
  folder: string, file: string, settings: AnalysisSettings, doc: ProjectDoc | null, options: TimelapseOptions,
): Promise<MovieRun | null> {
  let opened: Awaited<ReturnType<typeof openStack>> | null = null;
  try {
    opened = await openStack(join(folder, file), file).catch(() => null);
    if (!opened) return null;
    return await analyseOpenedMovie(opened, file, settings, doc, options, {}, folder);
  } catch (e) {
    return { record: emptyRecord(file, fileMessage(file, e), [], settings, options), results: [] };
  } finally {
    await opened?.source.close().catch(() => undefined);
  }
}

/**
 * The window's analysis of one movie at `path` (project key `file`), as the batch analyses it. Rejects with a
 * one-line message naming the file when it does not open, has one time point, or is cancelled (AbortError).
 */
export async function analyseMovieAtPath(
  path: string, file: string, settings: AnalysisSettings, doc: ProjectDoc | null, options: TimelapseOptions, hooks: MovieHooks,
): Promise<MovieOutcome> {
  const opened = await openStack(path, file);
  try {
    const r = await analyseOpenedMovie(opened, file, settings, doc, options, hooks, inputFolderOf(path, file));
    if (r === null) throw new Error(`${file}: has one time point; the time-lapse view needs a movie`);
    if (r.record.error !== null) throw new Error(r.record.error);
    if (r.record.timeIndices.length === 0) throw new Error(r.record.warnings[0] ?? `${file}: no time point to analyse`);
    return movieOutcomes([r.record], r.results).movies[0];
  } finally {
    await opened.source.close().catch(() => undefined);
  }
}

/** The time pass over a batch's files, one after another: every file with more than one time point analysed as a
 *  movie. Stops before the next movie when `signal` aborts. Never rejects for bad files. */
export async function analyseMovies(
  folder: string, files: readonly string[], settings: AnalysisSettings, doc: ProjectDoc | null, options: TimelapseOptions,
  onMovie?: (file: string, done: number) => void, signal?: AbortSignal,
): Promise<MovieRun[]> {
  const runs: MovieRun[] = [];
  for (const file of files) {
    if (signal?.aborted) break;
    const run = await analyseMovieFile(folder, file, settings, doc, options);
    if (run === null) continue;
    runs.push(run);
    onMovie?.(file, runs.length);
  }
  return runs;
}

/**
 * The batch's results with each movie's time points in place of its main-pass result: results keyed by (file, time
 * point), files in the main pass's order, a movie's time points in time order. A movie that failed keeps its
 * main-pass result; so does one whose chosen time points all lie past its end, with the warning that says so.
 */
export function withMovieResults(main: readonly EmbryoResult[], runs: readonly MovieRun[]): EmbryoResult[] {
  const byFile = new Map(runs.filter((r) => r.record.error === null && r.results.length > 0).map((r) => [r.record.file, r.results]));
  const none = new Map(runs.filter((r) => r.record.error === null && r.record.timeIndices.length === 0).map((r) => [r.record.file, r.record.warnings]));
  return main.flatMap((r) => byFile.get(r.file) ?? (none.has(r.file) ? [{ ...r, warnings: [...none.get(r.file)!.filter((w) => !r.warnings.includes(w)), ...r.warnings] }] : [r]));
}

/**
 * Each movie's summary (λ(t), τ(x), the model fit) made from its record and its results as keyed in `results` — the
 * same on one machine and after a merge of parts, since both start from the same records and results. A movie whose
 * results are missing becomes a failure.
 */
export function movieOutcomes(records: readonly MovieRecord[], results: readonly EmbryoResult[]): { movies: MovieOutcome[]; failures: MovieFailure[] } {
  const byKey = new Map(results.map((r) => [resultKeyOf(r), r]));
  const movies: MovieOutcome[] = [];
  const failures: MovieFailure[] = [];
  for (const rec of records) {
    if (rec.error !== null) { failures.push({ file: rec.file, error: rec.error }); continue; }
    // Chosen time points all past the movie's end: not analysed over time, but nothing failed.
    if (rec.timeIndices.length === 0) { failures.push({ file: rec.file, error: rec.warnings[0] ?? `${rec.file}: no time point analysed over time`, warningOnly: true }); continue; }
    const own = rec.timeIndices.map((t) => byKey.get(resultKey(rec.file, t)));
    if (own.some((r) => r === undefined)) { failures.push({ file: rec.file, error: `${rec.file}: results of some time points are missing` }); continue; }
    const list = own as EmbryoResult[];
    const summary = summarizeMovie(rec.file, rec.timeIndices, rec.timesS, list, {
      fitRangeEl: rec.fitRangeEl, modelRangeEl: rec.modelRangeEl, baselineFrames: rec.baselineFrames,
    });
    movies.push({ file: rec.file, timeIndices: rec.timeIndices, timesS: rec.timesS, timeSource: rec.timeSource ?? null, results: list, summary: { ...summary, warnings: [...rec.warnings, ...summary.warnings] } });
  }
  return { movies, failures };
}

/** t_s of the k-th analysed time point (empty when the times are unknown). */
function timeCell(m: MovieOutcome, k: number): CsvValue {
  return m.timesS ? m.timesS[k] : null;
}

/** timecourse.csv: file, t_index, t_s, then every embryos.csv column after `file` (its measurements and each side's). */
export function timecourseCsv(movies: readonly MovieOutcome[]): string {
  const rows = movies.flatMap((m) => m.results.map((r, k) => [m.file, m.timeIndices[k], timeCell(m, k), ...embryoMeasureRow(r).slice(1), ...sideCells(r), m.timesS ? m.timeSource ?? null : null]));
  return toCsv(['file', 't_index', 't_s', ...EMBRYO_MEASURE_COLUMNS.slice(1), ...SIDE_COLUMNS, 'time_source'], rows);
}

/** timecourse_profiles.csv: every channel's profile at every analysed time point (long format). */
export function timecourseProfilesCsv(movies: readonly MovieOutcome[]): string {
  const rows = movies.flatMap((m) => m.results.flatMap((r, k) => [r.gradientProfile, ...r.boundaryProfiles].filter((p) => p !== null)
    .flatMap((p) => Array.from(p!.xEl, (x, i): CsvValue[] => [m.file, m.timeIndices[k], timeCell(m, k), p!.channel, x, p!.xUm[i], p!.mean[i], p!.sd[i], p!.n[i]]))));
  return toCsv(['file', 't_index', 't_s', 'channel', 'x_el', 'x_um', 'mean', 'sd', 'n'], rows);
}

/** timecourse_boundaries.csv: every boundary at every analysed time point. */
export function timecourseBoundariesCsv(movies: readonly MovieOutcome[]): string {
  const rows = movies.flatMap((m) => m.results.flatMap((r, k) => r.boundaries.map((b): CsvValue[] => [
    m.file, m.timeIndices[k], timeCell(m, k), b.channel, b.method, b.positionEl, b.positionUm, b.widthEl, b.positionSeEl, b.direction, b.note,
  ])));
  return toCsv(['file', 't_index', 't_s', 'channel', 'method', 'position_el', 'position_um', 'width_el', 'position_se_el', 'direction', 'note'], rows);
}

/** timecourse_landmarks.csv: every hand-marked landmark at every analysed time point, with its image position and
 *  its projection on that time point's AP axis (the columns of landmarks.csv after `file`). */
export function timecourseLandmarksCsv(movies: readonly MovieOutcome[]): string {
  const rows = movies.flatMap((m) => m.results.flatMap((r, k) => r.landmarks.map((l): CsvValue[] => [
    m.file, m.timeIndices[k], timeCell(m, k), l.name, l.point.x, l.point.y, l.xEl, l.xUm, l.offAxisUm,
  ])));
  return toCsv(['file', 't_index', 't_s', ...LANDMARK_COLUMNS.slice(1)], rows);
}

/** The data of one movie's three figures (λ over time, the kymograph, τ(x) with the model lines). */
export function movieFigureData(m: MovieOutcome): {
  lambda: LambdaPoint[]; steadyLambdaEl: number | undefined; kymograph: KymographInput | null; accumulation: AccumulationFigureInput | null;
} {
  const s = m.summary;
  const times = m.timesS ?? Float64Array.from(m.timeIndices);
  const lambda = s.lambda.map((l) => ({
    tS: l.tS, lambdaEl: l.fit?.lambdaEl ?? NaN,
    ciLowEl: l.fit ? l.fit.lambdaCiLowUm / (l.fit.lambdaUm / l.fit.lambdaEl) : NaN, ciHighEl: l.fit ? l.fit.lambdaCiHighUm / (l.fit.lambdaUm / l.fit.lambdaEl) : NaN,
  }));
  const profiles = m.results.map((r) => r.gradientProfile);
  const first = profiles.find((p) => p !== null) ?? null;
  const boundaryTrack = m.results.map((r) => summaryBoundary(r)?.positionEl ?? NaN);
  const landmarkNames = [...new Set(m.results.flatMap((r) => r.landmarks.map((l) => l.name)))];
  const tracks = [
    ...(boundaryTrack.some(Number.isFinite) ? [{ label: `boundary (channel ${m.results.find((r) => r.boundaries[0])?.boundaries[0].channel ?? '?'})`, kind: 'boundary' as const, xEl: boundaryTrack }] : []),
    ...landmarkNames.map((name) => ({ label: name, kind: 'landmark' as const, xEl: m.results.map((r) => r.landmarks.find((l) => l.name === name)?.xEl ?? NaN) })),
  ];
  const kymograph = first ? { xEl: first.xEl, timesS: times, values: profiles.map((p) => p?.mean ?? first.xEl.map(() => NaN)), tracks } : null;
  const a = s.accumulation;
  const accumulation = a ? {
    xEl: a.xEl, tauS: a.tauS, ciLowS: a.tauCiLowS, ciHighS: a.tauCiHighS,
    fit: s.model ? { tau0S: s.model.tau0S.value, lambdaTauEl: s.model.lambdaTauEl.value, rangeEl: s.model.rangeEl, steadyLambdaEl: s.steadyFit?.lambdaEl ?? NaN } : null,
  } : null;
  return { lambda, steadyLambdaEl: s.steadyFit?.lambdaEl, kymograph, accumulation };
}

/** The three figures of one movie (SVG text by file-name suffix). */
export function movieFigures(m: MovieOutcome): { name: string; title: string; svg: string }[] {
  const slug = figureSlug(m.file.replace(/\.(ome\.)?tiff?$/i, ''));
  const d = movieFigureData(m);
  const lambda = lambdaOverTimeFigure(d.lambda, { steadyLambdaEl: d.steadyLambdaEl });
  const kymo = d.kymograph ? kymographFigure(d.kymograph) : null;
  const tau = d.accumulation ? accumulationFigure(d.accumulation) : null;
  return [
    { name: `${slug}-lambda.svg`, title: `λ over time — ${m.file}`, svg: lambda },
    ...(kymo ? [{ name: `${slug}-kymograph.svg`, title: `kymograph — ${m.file}`, svg: kymo }] : []),
    ...(tau ? [{ name: `${slug}-tau.svg`, title: `local accumulation time τ(x) — ${m.file}`, svg: tau }] : []),
  ];
}

/** The six tables of the given movies as the batch writes them (CSV text). */
export function movieTables(movies: readonly MovieOutcome[]): { timecourse: string; profiles: string; boundaries: string; landmarks: string; accumulation: string; modelFit: string } {
  return {
    timecourse: timecourseCsv(movies),
    profiles: timecourseProfilesCsv(movies),
    boundaries: timecourseBoundariesCsv(movies),
    landmarks: timecourseLandmarksCsv(movies),
    accumulation: toCsv(ACCUMULATION_COLUMNS, movies.flatMap((m) => accumulationRows(m.summary))),
    modelFit: toCsv(MODEL_FIT_COLUMNS, movies.map((m) => modelFitRow(m.summary))),
  };
}

/** Writes the tables, figures (timelapse/*.svg) and timelapse.html for the analysed movies; returns the paths. */
export async function writeTimelapseOutputs(outDir: string, movies: readonly MovieOutcome[], failures: readonly MovieFailure[]): Promise<string[]> {
  const figureDir = join(outDir, 'timelapse');
  await fs.mkdir(figureDir, { recursive: true });
  const written: string[] = [];
  const put = async (path: string, text: string): Promise<void> => { await writeFileAtomic(path, text); written.push(path); };
  const tables = movieTables(movies);
  await put(join(outDir, 'timecourse.csv'), tables.timecourse);
  await put(join(outDir, 'timecourse_profiles.csv'), tables.profiles);
  await put(join(outDir, 'timecourse_boundaries.csv'), tables.boundaries);
  await put(join(outDir, 'timecourse_landmarks.csv'), tables.landmarks);
  await put(join(outDir, 'accumulation.csv'), tables.accumulation);
  await put(join(outDir, 'model_fit.csv'), tables.modelFit);
  const figures = movies.map((m) => ({ movie: m, figures: movieFigures(m) }));
  for (const { figures: list } of figures) for (const f of list) await put(join(figureDir, f.name), f.svg);
  await put(join(outDir, 'timelapse.html'), timelapsePage(figures, failures, new Date().toISOString()));
  return written;
}

/**
 * The time pass alone over some files (outside a batch): analyse those with more than one time point as movies and
 * write their time-lapse tables, figures and page. Returns null when no file is a movie.
 */
export async function runTimelapsePass(
  folder: string, outDir: string, files: readonly string[], settings: AnalysisSettings, doc: ProjectDoc | null,
  options: TimelapseOptions, onMovie?: (file: string, done: number) => void,
): Promise<{ movies: MovieOutcome[]; failures: MovieFailure[]; written: string[] } | null> {
  const runs = await analyseMovies(folder, files, settings, doc, options, onMovie);
  if (runs.length === 0) return null;
  const { movies, failures } = movieOutcomes(runs.map((r) => r.record), runs.flatMap((r) => r.results));
  return { movies, failures, written: await writeTimelapseOutputs(outDir, movies, failures) };
}
