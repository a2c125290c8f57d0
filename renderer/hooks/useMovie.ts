// Runs a movie's analysis over time through the API, follows its progress events and keeps the outcome while the
// user moves between views (the analysis itself runs in the app, off the window's thread). Asking again while one
// runs cancels that one and starts the new one when it has stopped.
import { useEffect, useRef, useState } from 'react';
import type { EgglineApi, MovieProgress, MovieRequestOptions, MovieView, ProjectDoc } from '../../core/contract';

/** The time-lapse view's state: what runs or ran, for which file, and its outcome. */
export interface MovieState {
  readonly status: 'idle' | 'running' | 'done' | 'error' | 'cancelled';
  /** Project key of the file the state belongs to. */
  readonly file: string | null;
  readonly done: number;
  readonly total: number;
  readonly view: MovieView | null;
  readonly error: string | null;
  /** What the analysis was made from (settings, the file's hand edits, options), to tell when it is out of date. */
  readonly basis: string | null;
}

/** Nothing analysed yet. */
export const MOVIE_IDLE: MovieState = { status: 'idle', file: null, done: 0, total: 0, view: null, error: null, basis: null };

/** The defaults of the batch's time flags (--tau-range 0.1,0.4, --baseline-frames 1, axis once per movie). */
export const DEFAULT_MOVIE_OPTIONS: MovieRequestOptions = { axisPerTime: false, tauRangeEl: [0.1, 0.4], baselineFrames: 1, timeStepS: null };

/** Fold a progress event into the state (pure): only the running file's events count. */
export function applyMovieProgress(s: MovieState, p: MovieProgress): MovieState {
  return s.status === 'running' && p.file === s.file ? { ...s, done: p.done, total: p.total } : s;
}

/** Fold the API's answer into the state (pure); an answer for a file no longer running is dropped. */
export function applyMovieAnswer(s: MovieState, file: string, r: { ok: true; value: MovieView } | { ok: false; error: { code: string; message: string } }): MovieState {
  if (s.status !== 'running' || s.file !== file) return s;
  if (r.ok) return { ...s, status: 'done', view: r.value, done: r.value.timeIndices.length, total: r.value.timeIndices.length };
  return { ...s, status: r.error.code === 'cancelled' ? 'cancelled' : 'error', error: r.error.message };
}

/** The movie view of `file` when the state holds one (null otherwise). */
export function movieViewOf(s: MovieState, file: string | null): MovieView | null {
  return file !== null && s.view !== null && s.view.file === file ? s.view : null;
}

/** One analysis request. */
interface MovieRequest {
  readonly path: string;
  readonly file: string;
  readonly doc: ProjectDoc;
  readonly options: MovieRequestOptions;
  readonly basis: string;
}

/** Movie state plus commands: analyse a file (again), cancel; and the run options, kept across tab changes. */
export function useMovie(api: EgglineApi | null) {
  const [state, setState] = useState<MovieState>(MOVIE_IDLE);
  const [options, setOptions] = useState<MovieRequestOptions>(DEFAULT_MOVIE_OPTIONS);
  const running = useRef(false);
  const queued = useRef<MovieRequest | null>(null);
  useEffect(() => (api === null ? undefined : api.onMovieProgress((p) => setState((s) => applyMovieProgress(s, p)))), [api]);
  const run = async (req: MovieRequest): Promise<void> => {
    if (api === null) return;
    running.current = true;
    // While it runs the earlier outcome stays on screen (marked out of date), so the view does not go blank.
    setState((s) => (s.file === req.file && s.view !== null
      ? { ...MOVIE_IDLE, status: 'running', file: req.file, basis: s.basis, view: s.view }
      : { ...MOVIE_IDLE, status: 'running', file: req.file, basis: req.basis }));
    const r = await api.analyseMovie(req.path, req.file, req.doc, req.options);
    running.current = false;
    const next = queued.current;
    queued.current = null;
    if (next !== null) { void run(next); return; }
    setState((s) => {
      const out = applyMovieAnswer(s, req.file, r);
      // A cancelled or failed rerun keeps nothing: its earlier outcome no longer matches what was asked.
      return out.status === 'done' ? { ...out, basis: req.basis } : { ...out, view: null };
    });
  };
  /** Analyse `file` (at `path`) with the project's settings and hand edits; `basis` names what it is made from. A
   *  request while another runs cancels that one and runs when it has stopped. */
  const analyse = async (path: string, file: string, doc: ProjectDoc, opts: MovieRequestOptions, basis: string): Promise<void> => {
    if (api === null) return;
    const req = { path, file, doc, options: opts, basis };
    if (running.current) { queued.current = req; await api.cancelMovie(); return; }
    await run(req);
  };
  const cancel = async (): Promise<void> => {
    queued.current = null;
    if (api !== null) await api.cancelMovie();
  };
  return { movie: state, analyse, cancel, options, setOptions };
}
