// The messages between the main process and the analysis worker thread (app/workers/analysis-worker.ts).
import type { MovieRequestOptions, MovieView, ProjectDoc, StackPreview, StackTimeOptions } from '../../core/contract';
import type { AnalysisSettings } from '../../core/settings';
import type { SliceData, ViewData } from './engine';

/** A request to the analysis worker: a whole view (project + detect, at a movie's time point with `time`), one raw
 *  slice, the preview slice, a movie over time, or stopping the view request `target` (no answer of its own). */
export type AnalysisRequest =
  | { readonly id: number; readonly kind: 'view'; readonly path: string; readonly label: string; readonly settings: AnalysisSettings; readonly time?: StackTimeOptions | null }
  | { readonly id: number; readonly kind: 'cancel'; readonly label: string; readonly target: number }
  | { readonly id: number; readonly kind: 'slice'; readonly path: string; readonly label: string; readonly z: number; readonly c: number; readonly t: number }
  | { readonly id: number; readonly kind: 'preview'; readonly path: string; readonly label: string }
  | { readonly id: number; readonly kind: 'movie'; readonly path: string; readonly label: string; readonly doc: ProjectDoc; readonly options: MovieRequestOptions };

/** The worker's answer: the value or the error's name, code and message; `ok: null` is a movie's progress. */
export type AnalysisReply =
  | { readonly id: number; readonly ok: true; readonly value: ViewData | SliceData | StackPreview | MovieView }
  | { readonly id: number; readonly ok: null; readonly progress: { readonly done: number; readonly total: number } }
  | { readonly id: number; readonly ok: false; readonly error: { readonly name: string; readonly code: string | null; readonly message: string } };
