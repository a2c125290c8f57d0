// Runs a movie's analysis over time through the API, follows its progress events and keeps the outcome while the
// user moves between views (the analysis itself runs in the app, off the window's thread).
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

/** Movie state plus commands: analyse a file, cancel. */
export function useMovie(api: EgglineApi | null) {
  const [state, setState] = useState<MovieState>(MOVIE_IDLE);
  const current = useRef(state);
  current.current = state;
  useEffect(() => (api === null ? undefined : api.onMovieProgress((p) => setState((s) => applyMovieProgress(s, p)))), [api]);
  /** Analyse `file` (at `path`) with the project's settings and hand edits; `basis` names what it is made from. */
  const analyse = async (path: string, file: string, doc: ProjectDoc, options: MovieRequestOptions, basis: string): Promise<void> => {
    if (api === null || current.current.status === 'running') return;
    setState({ ...MOVIE_IDLE, status: 'running', file, basis });
    const r = await api.analyseMovie(path, file, doc, options);
    setState((s) => applyMovieAnswer(s, file, r));
  };
  const cancel = async (): Promise<void> => {
    if (api !== null) await api.cancelMovie();
  };
  return { movie: state, analyse, cancel };
}
