// Shared state of one handler set: dependencies, the path allow-list and running batches.
import type { BatchProgress, ExportKind, MovieProgress, MovieRequestOptions, MovieView, ProjectDoc, StackTimeOptions } from '../../core/contract';
import type { AnalysisSettings } from '../../core/settings';
import type { PathAllowList } from './allow-list';
import type { AnalysisEngine, ViewData } from '../engine/engine';

/** Native dialogs and other shell services the handlers need; main.ts supplies electron-backed versions. */
export interface HandlerDeps {
  /** Folder for app data: demo set, recent list. */
  readonly dataDir: string;
  readonly dialogs: {
    chooseFolder(): Promise<string | null>;
    chooseFiles(): Promise<string[] | null>;
    chooseOutputFolder(): Promise<string | null>;
    openProjectFile(): Promise<string | null>;
    saveFile(suggestedName: string, kind: ExportKind): Promise<string | null>;
  };
  /** Push batch progress to the renderer. */
  emitBatchProgress(p: BatchProgress): void;
  /** Run loadStack's analysis off the main thread (the app passes a worker runner); in-process when absent. */
  readonly runAnalysisOffThread?: (path: string, label: string, settings: AnalysisSettings, time?: StackTimeOptions | null,
    signal?: AbortSignal | null) => Promise<ViewData>;
  /** Decode loadSlice's plane off the main thread (the app passes the worker runner); in-process when absent. */
  readonly readSliceOffThread?: AnalysisEngine['readSlice'];
  /** Read the preview slice off the main thread (the app passes the worker runner's). */
  readonly readPreviewOffThread?: NonNullable<AnalysisEngine['readPreview']>;
  /** Push movie-analysis progress to the renderer. */
  readonly emitMovieProgress?: (p: MovieProgress) => void;
  /** Analyse a movie over time off the main thread (the app passes a worker runner that stops when `signal` aborts);
   *  in-process when absent. */
  readonly runMovieOffThread?: (path: string, file: string, doc: ProjectDoc, options: MovieRequestOptions,
    onProgress: (p: MovieProgress) => void, signal: AbortSignal) => Promise<MovieView>;
  /** The analysis services; the real modules when absent. */
  readonly engine?: AnalysisEngine;
  /** Told when the recent list changes (the app rebuilds its menu). */
  readonly onRecentChanged?: (paths: readonly string[]) => void;
  /** Write only this many demo embryos (spread over the conditions); default: the whole demo set. */
  readonly demoSubset?: number;
  /** Open a file with the system's default application (Electron's shell.openPath: '' on success, else the reason);
   *  absent where there is no desktop (then openReport fails with a message). */
  readonly openPath?: (path: string) => Promise<string>;
  /** Worker count for batches (0 = in this thread); default: cores − 1, at least 1. */
  readonly batchJobs?: number;
}

/** What every handler group shares. */
export interface ShellContext {
  readonly deps: HandlerDeps;
  readonly engine: AnalysisEngine;
  readonly allow: PathAllowList;
  /** Running batches by run id. */
  readonly batches: Map<string, AbortController>;
  /** The running movie analysis (at most one). */
  readonly movies: Set<AbortController>;
  /** Loads of a stack with time options under way (a newer one aborts them). */
  readonly viewLoads: Set<AbortController>;
  /** Record a path in the recent list (failures to write it are ignored: it is a convenience). */
  noteRecent(path: string): Promise<void>;
}
