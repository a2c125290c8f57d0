// Browser harness: the built renderer in Debian's Chromium (playwright-core, no downloads), served from
// dist/renderer through page.route, with window.eggline built from the REAL app handlers running in this process.
import { existsSync, promises as fs, statSync, readdirSync } from 'node:fs';
import { extname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';
import type { Browser, Page } from 'playwright-core';
import { expect } from 'vitest';
import { analyseFile } from '../../app/batch/analyse-file';
import type { BatchTask } from '../../app/batch/task';
import { createDefaultEngine } from '../../app/engine/default-engine';
import { buildMovieView } from '../../app/engine/movie-view';
import { createHandlers } from '../../app/main/handlers';
import type { ApiHandlers, HandlerDeps } from '../../app/main/handlers';
import { API_INVOKE_METHODS } from '../../core/contract';
import { parseCsv } from '../../core/csv';
import { demoMovieFile } from '../../app/batch/write-demo';
import { newProject, saveProject } from '../../app/project';
import { DEFAULT_SETTINGS, type ProjectDoc } from '../../core/settings';
import { DEMO_MOVIE_FILE } from '../../core/synth';
import type { BatchProgress, ExportKind, MovieProgress, MovieRequestOptions } from '../../core/contract';

/** Repository root and the built renderer. */
export const ROOT = fileURLToPath(new URL('../..', import.meta.url)).replace(/\/$/, '');
export const RENDERER_DIST = join(ROOT, 'dist/renderer');
/** Where screenshots go (gitignored). */
export const ARTIFACTS = join(ROOT, 'test/artifacts/e2e');

const MIME: Record<string, string> = {
  '.html': 'text/html', '.js': 'text/javascript', '.css': 'text/css', '.map': 'application/json', '.svg': 'image/svg+xml', '.png': 'image/png',
};

/** Newest modification time of the files under a folder (ms). */
function newestMtime(dir: string): number {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newestMtime(p) : statSync(p).mtimeMs);
  }
  return t;
}

/** Build the renderer with Vite unless dist/renderer is newer than every renderer and core source. */
export async function ensureRendererBuilt(): Promise<void> {
  const index = join(RENDERER_DIST, 'index.html');
  const built = existsSync(index) ? statSync(index).mtimeMs : 0;
  if (built > Math.max(newestMtime(join(ROOT, 'renderer')), newestMtime(join(ROOT, 'core')))) return;
  const { build } = await import('vite');
  await build({ configFile: join(ROOT, 'renderer/vite.config.ts'), logLevel: 'warn' });
}

/** Dialog answers the test sets before clicking. */
export interface FakeDialogs {
  folder: string | null;
  output: string | null;
  project: string | null;
  /** Folder that save dialogs write into (file name = suggested name). */
  saveDir: string | null;
}

/** A running harness. */
export interface Harness {
  readonly browser: Browser;
  readonly page: Page;
  readonly dialogs: FakeDialogs;
  readonly progress: BatchProgress[];
  /** Movie-analysis progress events, in order. */
  readonly movieProgress: MovieProgress[];
  /** Paths handed to the system's default application (the report), in order. */
  readonly openedPaths: string[];
  /**
   * Make the next batch wait before its file number `afterFiles` (0-based) until the batch is cancelled (or 60 s
   * pass), so a test can press Cancel while the run is surely in the middle. Analysis stays the real one.
   */
  holdBatchUntilCancel(afterFiles: number): void;
  /** The next movie analysis runs as usual but pauses `ms` after each time point (the thread blocked, as a slow
   *  machine would be), so that a test can act while it is under way; the run still checks its cancel signal. */
  slowNextMovie(ms: number): void;
  /** Replace the handlers by a fresh instance over the same data folder (as after an app restart). */
  freshHandlers(): void;
  close(): Promise<void>;
}

/** Launch Chromium, wire window.eggline to real handlers and open the app page. */
export async function startHarness(dataDir: string, demoSubset?: number): Promise<Harness> {
  const dialogs: FakeDialogs = { folder: null, output: null, project: null, saveDir: null };
  const progress: BatchProgress[] = [];
  const movieProgress: MovieProgress[] = [];
  const openedPaths: string[] = [];
  let page: Page | null = null;
  // Batch hold (see Harness.holdBatchUntilCancel): the real engine, with the in-process analysis of later files
  // waiting on a promise that the batch's abort signal resolves.
  let hold: { afterFiles: number } | null = null;
  const realEngine = createDefaultEngine();
  const engine: typeof realEngine = {
    ...realEngine,
    runBatch: (options) => {
      const h = hold;
      hold = null;
      if (h === null) return realEngine.runBatch(options);
      const release = new Promise<void>((done) => {
        options.signal?.addEventListener('abort', () => done());
        setTimeout(done, 60_000).unref();
      });
      const held = async (t: BatchTask) => { if (t.index >= h.afterFiles) await release; return analyseFile(t); };
      // analyseInProcess is the batch's own option for in-process analysis (BatchRunOptions is spread into it).
      return realEngine.runBatch(Object.assign({}, options, { analyseInProcess: held }));
    },
  };
  // Movie slow-down (see Harness.slowNextMovie): the in-process movie analysis the handlers would run anyway, with a
  // pause after each time point.
  let slowMs = 0;
  const pause = new Int32Array(new SharedArrayBuffer(4));
  const runMovie = (path: string, file: string, doc: ProjectDoc, options: MovieRequestOptions, emit: (p: MovieProgress) => void, signal: AbortSignal) => {
    const ms = slowMs;
    slowMs = 0;
    return buildMovieView(path, file, doc, options, {
      signal,
      onTimePoint: (done, total) => { emit({ file, done, total }); if (ms > 0) Atomics.wait(pause, 0, 0, ms); },
    });
  };
  const deps: HandlerDeps = {
    runMovieOffThread: runMovie,
    // Batch jobs 0 analyses in this process: the worker script is a build output the test need not depend on.
    dataDir, batchJobs: 0, demoSubset, engine,
    dialogs: {
      chooseFolder: async () => dialogs.folder,
      chooseFiles: async () => null,
      chooseOutputFolder: async () => dialogs.output,
      openProjectFile: async () => dialogs.project,
      saveFile: async (name: string, _kind: ExportKind) => (dialogs.saveDir === null ? null : join(dialogs.saveDir, name)),
    },
    openPath: async (p) => { openedPaths.push(p); return ''; },
    emitBatchProgress: (p) => {
      progress.push(p);
      void page?.evaluate((q) => (window as unknown as { __egglineProgress(p: unknown): void }).__egglineProgress(q), p).catch(() => undefined);
    },
    emitMovieProgress: (p) => {
      movieProgress.push(p);
      void page?.evaluate((q) => (window as unknown as { __egglineMovieProgress(p: unknown): void }).__egglineMovieProgress(q), p).catch(() => undefined);
    },
  };
  const current: { handlers: ApiHandlers } = { handlers: createHandlers(deps) };
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run', '--disable-sync'],
  });
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 }, deviceScaleFactor: 1 });
  page = await context.newPage();
  await page.route('http://app.test/**', async (route) => {
    const rel = decodeURIComponent(new URL(route.request().url()).pathname).replace(/^\/+/, '') || 'index.html';
    const file = resolve(RENDERER_DIST, rel);
    if (!file.startsWith(RENDERER_DIST) || !existsSync(file)) { await route.fulfill({ status: 404, body: 'not found' }); return; }
    await route.fulfill({ status: 200, contentType: MIME[extname(file)] ?? 'application/octet-stream', body: await fs.readFile(file) });
  });
  for (const m of API_INVOKE_METHODS) {
    await page.exposeFunction(`__eggline_${m}`, (...args: unknown[]) => (current.handlers[m] as (...a: unknown[]) => unknown)(...args));
  }
  // A plain script string: a bundled function would carry helpers (e.g. __name) that do not exist in the page.
  await page.addInitScript(`(() => {
    const methods = ${JSON.stringify([...API_INVOKE_METHODS])};
    const progressListeners = new Set();
    const menuListeners = new Set();
    const movieListeners = new Set();
    const api = {
      onMovieProgress: (l) => { movieListeners.add(l); return () => movieListeners.delete(l); },
      onBatchProgress: (l) => { progressListeners.add(l); return () => progressListeners.delete(l); },
      onMenuCommand: (l) => { menuListeners.add(l); return () => menuListeners.delete(l); },
      // Stands in for the preload's webUtils.getPathForFile: a dropped file's path is its name in the folder the
      // test names (a plain browser has no file-system paths).
      pathForDroppedFile: (f) => (window.__egglineDropRoot ? window.__egglineDropRoot + '/' + f.name : ''),
    };
    for (const m of methods) api[m] = (...a) => window['__eggline_' + m](...a);
    window.eggline = Object.freeze(api);
    window.__egglineProgress = (p) => progressListeners.forEach((l) => l(p));
    window.__egglineMenu = (c) => menuListeners.forEach((l) => l(c));
    window.__egglineMovieProgress = (p) => movieListeners.forEach((l) => l(p));
  })();`);
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (msg) => { if (msg.type() === 'error') errors.push(msg.text()); });
  await page.goto('http://app.test/index.html');
  return {
    browser, page, dialogs, progress, movieProgress, openedPaths,
    holdBatchUntilCancel: (afterFiles) => { hold = { afterFiles }; },
    slowNextMovie: (ms) => { slowMs = ms; },
    freshHandlers: () => { current.handlers = createHandlers(deps); },
    close: async () => { await browser.close(); if (errors.length > 0) console.warn(`page errors:\n${errors.join('\n')}`); },
  };
}

/**
 * startHarness, then (when given) the viewport, and wait until the first demo embryo's axis is drawn: the window is
 * ready for a test.
 */
export async function startReadyHarness(dataDir: string, demoSubset: number, viewport?: { width: number; height: number }): Promise<Harness> {
  const h = await startHarness(dataDir, demoSubset);
  if (viewport) await h.page.setViewportSize(viewport);
  await h.page.getByTestId('handle-anterior').waitFor({ timeout: 90_000 });
  return h;
}

/** Open `folder` through the menu (the fake folder dialog answers it) and make `name` the shown file. */
export async function openFolderAt(h: Harness, folder: string, name: string): Promise<void> {
  h.dialogs.folder = folder;
  await h.page.evaluate(() => (window as unknown as { __egglineMenu(c: string): void }).__egglineMenu('open-folder'));
  await h.page.locator(`[data-testid=folder-entry][data-name="${name}"]`).click({ timeout: 30_000 });
  // A movie's first frame may show no gradient: wait for the file itself, not for an axis.
  await h.page.locator(`[data-testid=folder-entry].current[data-name="${name}"]`).waitFor({ timeout: 60_000 });
}

/** Rows of a CSV file as objects by column name. */
export async function csvFileRows(path: string): Promise<Record<string, string>[]> {
  const [head, ...rows] = parseCsv(await fs.readFile(path, 'utf8'));
  return rows.map((r) => Object.fromEntries(head.map((k, i) => [k, r[i]])));
}

/** The text of the first element with this test id ('' when it has none). */
export async function testIdText(page: Page, testId: string): Promise<string> {
  return (await page.getByTestId(testId).first().textContent()) ?? '';
}

/** Make `out`, let the fake output dialog answer it, and choose it in the Batch tab (waits until the tab shows it). */
export async function chooseBatchOutput(h: Harness, out: string): Promise<string> {
  await fs.mkdir(out);
  h.dialogs.output = out;
  await h.page.getByTestId('tab-batch').click();
  await h.page.getByTestId('batch-choose').click();
  await expect.poll(() => testIdText(h.page, 'batch-out')).toBe(out);
  return out;
}

/**
 * `<scratch>/movie` holding the demo movie (demo data) and a project with the demo's settings (channel 2 holds the
 * boundary); returns the folder and the saved project.
 */
export async function writeDemoMovieFolder(scratch: string): Promise<{ folder: string; doc: ProjectDoc }> {
  const folder = join(scratch, 'movie');
  await fs.mkdir(join(folder, 'timelapse'), { recursive: true });
  await fs.writeFile(join(folder, DEMO_MOVIE_FILE), demoMovieFile());
  const doc = { ...newProject(folder), settings: { ...DEFAULT_SETTINGS, boundaryChannels: [2] } };
  await saveProject(join(folder, 'eggline-project.json'), doc);
  return { folder, doc };
}
