// Movies over time in the window: one analysis at a time, off the main thread when the app gives a runner,
// progress pushed to the window, and cancelling that stops it between time points (or stops the worker).
import type { MovieProgress, MovieRequestOptions, MovieView, ProjectDoc } from '../../core/contract';
import { checkRangeEl } from '../../core/settings';
import { requireAllowed, requireProjectDoc, requireText } from './args';
import type { ShellContext } from './context';
import { buildMovieView } from '../engine/movie-view';
import { ApiFailure, labelOf } from './result';

/** Checked options of a movie request, or a 'bad-argument' failure naming the field. */
export function requireMovieOptions(value: unknown): MovieRequestOptions {
  if (typeof value !== 'object' || value === null) throw new ApiFailure('bad-argument', 'options must be {axisPerTime, tauRangeEl, baselineFrames, timeStepS}');
  const o = value as Record<string, unknown>;
  if (typeof o.axisPerTime !== 'boolean') throw new ApiFailure('bad-argument', 'options.axisPerTime must be true or false');
  const range = o.tauRangeEl;
  if (!Array.isArray(range) || range.length !== 2 || !range.every((v) => typeof v === 'number')) {
    throw new ApiFailure('bad-argument', 'options.tauRangeEl must be [start, end] in x/EL');
  }
  try { checkRangeEl(range as [number, number], 'options.tauRangeEl'); } catch (e) { throw new ApiFailure('bad-argument', (e as Error).message); }
  const frames = o.baselineFrames;
  if (!(typeof frames === 'number' && Number.isInteger(frames) && frames >= 0 && frames <= 1000)) {
    throw new ApiFailure('bad-argument', 'options.baselineFrames must be a whole number from 0 to 1000');
  }
  const step = o.timeStepS;
  if (!(step === null || (typeof step === 'number' && Number.isFinite(step) && step > 0))) {
    throw new ApiFailure('bad-argument', 'options.timeStepS must be a positive number of seconds or null');
  }
  return { axisPerTime: o.axisPerTime, tauRangeEl: [range[0], range[1]], baselineFrames: frames, timeStepS: step };
}

/** Analyse an allowed movie over time for the window; rejects 'busy' while another runs, 'cancelled' when stopped. */
export async function analyseMovie(ctx: ShellContext, pathArg: unknown, fileArg: unknown, docArg: unknown, optionsArg: unknown): Promise<MovieView> {
  const path = requireAllowed(ctx.allow, 'read', pathArg, 'path');
  const file = requireText(fileArg, 'file', 4096);
  const doc: ProjectDoc = requireProjectDoc(docArg);
  const options = requireMovieOptions(optionsArg);
  // Checked and claimed with no await in between: two movies at once would compete for the same core.
  if (ctx.movies.size > 0) throw new ApiFailure('busy', 'a movie is already being analysed; cancel it or wait for it to finish');
  const controller = new AbortController();
  ctx.movies.add(controller);
  const emit = (p: MovieProgress) => ctx.deps.emitMovieProgress?.(p);
  try {
    const run = ctx.deps.runMovieOffThread;
    const view = run
      ? await run(path, file, doc, options, emit, controller.signal)
      : await buildMovieView(path, file, doc, options, { signal: controller.signal, onTimePoint: (done, total) => emit({ file, done, total }) });
    if (controller.signal.aborted) throw new ApiFailure('cancelled', `${labelOf(file)}: analysis over time cancelled`);
    return view;
  } catch (e) {
    if (controller.signal.aborted) throw new ApiFailure('cancelled', `${labelOf(file)}: analysis over time cancelled`);
    throw e;
  } finally {
    ctx.movies.delete(controller);
  }
}

/** Stop the running movie analysis, if any. */
export function cancelMovie(ctx: ShellContext): null {
  for (const c of ctx.movies) c.abort();
  return null;
}
