// The batch command's time analysis: parse its flags; say what the batch's time pass wrote.
import { join } from 'node:path';
import { parseFitRange } from '../../core/batch';
import { parseTimeStepS } from '../../core/settings';
import { parseTimeSelection } from '../../core/timelapse';
import { DEFAULT_TIMELAPSE_OPTIONS, type MovieFailure, type MovieOutcome, type TimelapseOptions } from '../batch/timelapse-options';
import { UsageError, type CliIo } from './usage-error';

/** The time flags as given (strings, or undefined when absent). */
export interface TimelapseFlags {
  readonly time?: string;
  readonly axisPerTime?: boolean;
  readonly timeStep?: string;
  readonly tauRange?: string;
  readonly baselineFrames?: string;
}

function usage(e: unknown): never {
  throw new UsageError((e as Error).message, 'batch');
}

/** Options of the time analysis from the flags; UsageError with a one-line message for bad values. */
export function parseTimelapseFlags(f: TimelapseFlags): TimelapseOptions {
  const selection = f.time !== undefined ? (() => { try { return parseTimeSelection(f.time!); } catch (e) { return usage(e); } })() : DEFAULT_TIMELAPSE_OPTIONS.selection;
  let timeStepS: number | null = null;
  if (f.timeStep !== undefined) {
    try { timeStepS = parseTimeStepS(f.timeStep); } catch (e) { usage(e); }
  }
  let tauRangeEl = DEFAULT_TIMELAPSE_OPTIONS.tauRangeEl;
  if (f.tauRange !== undefined) {
    try { tauRangeEl = parseFitRange(f.tauRange); } catch (e) { usage(new Error((e as Error).message.replace('--fit-range', '--tau-range'))); }
  }
  let baselineFrames = DEFAULT_TIMELAPSE_OPTIONS.baselineFrames;
  if (f.baselineFrames !== undefined) {
    baselineFrames = Number(f.baselineFrames);
    if (!/^\d+$/.test(f.baselineFrames.trim())) throw new UsageError(`--baseline-frames must be a whole number ≥ 0 (got "${f.baselineFrames}")`, 'batch');
  }
  return { selection, axisPerTime: f.axisPerTime === true, timeStepS, tauRangeEl, baselineFrames };
}

/** What the batch's time pass did, for the terminal: failures, warnings, and the tables it wrote. Returns the number
 *  of movies that failed (a movie whose chosen time points all lie past its end is a warning, not a failure). */
export function reportTimelapse(
  pass: { readonly movies: readonly MovieOutcome[]; readonly failures: readonly MovieFailure[] }, outDir: string, io: CliIo,
): number {
  if (pass.movies.length === 0 && pass.failures.length === 0) return 0;
  for (const f of pass.failures) io.stderr.write(f.warningOnly ? `eggline: warning: ${f.error}\n` : `eggline: ${f.error}\n`);
  const named = (file: string, w: string): string => (w.startsWith(`${file}: `) ? w : `${file}: ${w}`);
  for (const m of pass.movies) for (const w of m.summary.warnings) io.stderr.write(`eggline: warning: ${named(m.file, w)}\n`);
  io.stdout.write(pass.movies.length === 0
    ? `No movie was analysed over time (see the warnings above); the time tables hold their headers only, and ${join(outDir, 'timelapse.html')} lists the movies\n`
    : `Time analysis of ${pass.movies.length} movie${pass.movies.length === 1 ? '' : 's'}: timecourse.csv, accumulation.csv, model_fit.csv and ${join(outDir, 'timelapse.html')}\n`);
  return pass.failures.filter((f) => !f.warningOnly).length;
}
