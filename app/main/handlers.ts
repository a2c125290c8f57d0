// The renderer↔app API as plain functions (no electron import), so tests and the browser harness can call them.
// Every handler validates its arguments, checks paths against the allow-list and never throws.
import type { EgglineApi } from '../../core/contract';
import { createPathAllowList } from './allow-list';
import { cancelBatch, runBatch } from './batch-handlers';
import { loadBatchResults, openReport } from './batch-results';
import type { HandlerDeps, ShellContext } from './context';
import { createDefaultEngine } from '../engine/default-engine';
import { openDemo } from './demo';
import { exportFile, svgToPng } from './export-handlers';
import { analyseMovie, cancelMovie } from './movie-handlers';
import { openDropped, openFiles, openFolder, openProjectFile, openRecent } from './open-handlers';
import { saveProject } from './project-handlers';
import { addRecent, readRecent } from './recent';
import { guard, labelOf, withLabel } from './result';
import { loadPreview, loadSlice, loadStack } from './stack-handlers';

export type { HandlerDeps } from './context';

/** Every API method except the two event subscriptions (those live in the preload). */
export type ApiHandlers = Omit<EgglineApi, 'onBatchProgress' | 'onMenuCommand' | 'onMovieProgress' | 'pathForDroppedFile' | 'openRecent' | 'loadPreview'>
  & { openRecent: NonNullable<EgglineApi['openRecent']>; loadPreview: NonNullable<EgglineApi['loadPreview']> };

/** The label a path argument gets in messages (null when it is not a string). */
function labelArg(value: unknown): string | null {
  return typeof value === 'string' && value !== '' ? labelOf(value) : null;
}

/** A new context with an empty allow-list. */
function createContext(deps: HandlerDeps): ShellContext {
  return {
    deps,
    engine: deps.engine ?? createDefaultEngine(),
    allow: createPathAllowList(),
    batches: new Map(),
    movies: new Set(),
    viewLoads: new Set(),
    noteRecent: async (path) => {
      const list = await addRecent(deps.dataDir, path).catch(() => null);
      if (list !== null) deps.onRecentChanged?.(list);
    },
  };
}

/** Show a dialog and run `then` on its answer; null (cancelled) passes through. */
async function afterDialog<T, R>(ask: () => Promise<T | null>, then: (v: T) => Promise<R>): Promise<R | null> {
  const chosen = await ask();
  return chosen === null ? null : then(chosen);
}

/** Build the API handlers over the given shell services. Each call returns a result value and never throws. */
export function createHandlers(deps: HandlerDeps): ApiHandlers {
  const ctx = createContext(deps);
  const d = deps.dialogs;
  const handlers: ApiHandlers = {
    openDemo: () => guard('demo', () => openDemo(ctx)),
    chooseFolder: () => guard(null, () => afterDialog(() => d.chooseFolder(), (f) => withLabel(labelOf(f), () => openFolder(ctx, f)))),
    chooseFiles: () => guard(null, () => afterDialog(() => d.chooseFiles(), async (paths) => {
      const entries = await openFiles(ctx, paths);
      for (const p of paths) await ctx.noteRecent(p);
      return entries;
    })),
    openDropped: (paths) => guard(null, () => openDropped(ctx, paths)),
    recent: () => guard(null, () => readRecent(deps.dataDir)),
    openRecent: (path) => guard(labelArg(path), () => openRecent(ctx, path)),
    loadStack: (path, settings, time) => guard(labelArg(path), () => loadStack(ctx, path, settings, time), 'bad-file'),
    loadPreview: (path) => guard(labelArg(path), () => loadPreview(ctx, path), 'bad-file'),
    loadSlice: (req) => guard(labelArg((req as { path?: unknown } | null)?.path), () => loadSlice(ctx, req), 'bad-file'),
    saveProject: (path, doc) => guard(labelArg(path), () => saveProject(ctx, path, doc), 'io'),
    openProject: () => guard(null, () => afterDialog(() => d.openProjectFile(),
      (p) => withLabel(labelOf(p), () => openProjectFile(ctx, p)))),
    runBatch: (folder, outDir, doc) => guard(null, () => runBatch(ctx, folder, outDir, doc)),
    cancelBatch: async (runId) => guard(null, async () => cancelBatch(ctx, runId)),
    chooseOutputFolder: () => guard(null, () => afterDialog(() => d.chooseOutputFolder(), async (dir) => {
      ctx.allow.allowTree('output', dir);
      return dir;
    })),
    loadBatchResults: (outDir, folder, cohort) => guard(labelArg(outDir), () => loadBatchResults(ctx, outDir, folder, cohort), 'bad-file'),
    openReport: (path) => guard(labelArg(path), () => openReport(ctx, path), 'io'),
    exportFile: (kind, name, content) => guard(labelArg(name), () => exportFile(ctx, kind, name, content), 'io'),
    svgToPng: (svg, scale) => guard(null, () => svgToPng(svg, scale)),
    analyseMovie: (path, file, doc, options) => guard(labelArg(file), () => analyseMovie(ctx, path, file, doc, options), 'bad-file'),
    cancelMovie: async () => guard(null, async () => cancelMovie(ctx)),
  };
  return handlers;
}
