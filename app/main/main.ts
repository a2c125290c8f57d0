// Electron main process: one hardened window serving the renderer from eggline://app, the API handlers behind
// checked IPC, the menu, and the analysis worker. Everything testable lives in the modules this file wires.
import * as electron from 'electron';
import { join } from 'node:path';
import { API_EVENT_CHANNELS } from '../../core/contract';
import { createAnalysisRunner } from './analysis-runner';
import { createDialogs, type DialogModuleLike } from './dialogs';
import { createHandlers } from './handlers';
import { APP_HOST, APP_SCHEME, registerIpc, type IpcMainLike } from './ipc';
import { buildMenuTemplate } from './menu';
import { serveAppRequest } from './protocol';
import { readRecent } from './recent';
import { denyAllPermissions, hardenWebContents, windowWebPreferences, type WebContentsLike } from './security';

/** The URL of the app's page. */
export const APP_URL = `${APP_SCHEME}://${APP_HOST}/index.html`;

type ElectronModule = typeof electron;

/** Privileges of our scheme: a standard, secure origin (so 'self' in the CSP means it) with fetch. */
function registerScheme(e: ElectronModule): void {
  e.protocol.registerSchemesAsPrivileged([
    { scheme: APP_SCHEME, privileges: { standard: true, secure: true, supportFetchAPI: true } },
  ]);
}

/** Dialogs attached to the window when there is one (so they are modal to it). */
function dialogsFor(e: ElectronModule, getWindow: () => electron.BrowserWindow | null): DialogModuleLike {
  return {
    showOpenDialog: (o) => { const w = getWindow(); return w === null ? e.dialog.showOpenDialog(o) : e.dialog.showOpenDialog(w, o); },
    showSaveDialog: (o) => { const w = getWindow(); return w === null ? e.dialog.showSaveDialog(o) : e.dialog.showSaveDialog(w, o); },
  };
}

/** Most automatic reloads after renderer crashes; beyond that a crash that repeats is left for the user to see. */
const MAX_CRASH_RELOADS = 3;

/** Reload the page when its renderer process dies (edits are autosaved, so the user continues where they were). */
function reloadAfterCrash(window: electron.BrowserWindow): void {
  let reloads = 0;
  window.webContents.on('render-process-gone', (_event, details) => {
    if (details.reason === 'clean-exit' || reloads >= MAX_CRASH_RELOADS || window.isDestroyed()) return;
    reloads += 1;
    void window.loadURL(APP_URL);
  });
}

/** Create the one window, its menu and handlers once the app is ready. */
async function onReady(e: ElectronModule, state: { window: electron.BrowserWindow | null }): Promise<void> {
  const distDir = join(e.app.getAppPath(), 'dist');
  denyAllPermissions(e.session.defaultSession);
  e.protocol.handle(APP_SCHEME, (request) => serveAppRequest(request.url, join(distDir, 'renderer')));
  const dataDir = e.app.getPath('userData');
  const send = (channel: string, payload: unknown): void => {
    const w = state.window;
    if (w !== null && !w.isDestroyed()) w.webContents.send(channel, payload);
  };
  const setMenu = (recent: readonly string[]): void => {
    const about = (): void => {
      void e.dialog.showMessageBox({ type: 'info', title: 'About Eggline', message: `Eggline ${e.app.getVersion()}`,
        detail: 'Measures morphogen gradients along the anterior–posterior axis of embryo images.' });
    };
    const template = buildMenuTemplate((command) => send(API_EVENT_CHANNELS.menuCommand, command), recent, process.platform === 'darwin', about);
    e.Menu.setApplicationMenu(e.Menu.buildFromTemplate(template as electron.MenuItemConstructorOptions[]));
  };
  const runner = createAnalysisRunner(join(distDir, 'analysis-worker.mjs'));
  // Movies get their own worker: cancelling one stops that worker without touching the shown stack's loading, and a
  // long movie is allowed 10 minutes between two time points.
  const movieRunner = createAnalysisRunner(join(distDir, 'analysis-worker.mjs'), 600_000);
  e.app.on('before-quit', () => { void runner.close(); void movieRunner.close(); });
  const handlers = createHandlers({
    dataDir,
    dialogs: createDialogs(dialogsFor(e, () => state.window)),
    emitBatchProgress: (p) => send(API_EVENT_CHANNELS.batchProgress, p),
    runAnalysisOffThread: runner.run,
    readSliceOffThread: runner.readSlice,
    readPreviewOffThread: runner.readPreview,
    emitMovieProgress: (p) => send(API_EVENT_CHANNELS.movieProgress, p),
    runMovieOffThread: (path, file, doc, options, onProgress, signal) => {
      signal.addEventListener('abort', () => { void movieRunner.close(); }, { once: true });
      return movieRunner.movie(path, file, doc, options, onProgress);
    },
    onRecentChanged: setMenu,
    // Reports open in the system's browser, never in the app window; the handler checks the path first.
    openPath: (path) => e.shell.openPath(path),
  });
  registerIpc(e.ipcMain as unknown as IpcMainLike, handlers);
  setMenu(await readRecent(dataDir));
  const window = new e.BrowserWindow({
    width: 1440, height: 900, minWidth: 900, minHeight: 600, show: false, title: 'Eggline', backgroundColor: '#1d2024',
    webPreferences: windowWebPreferences(distDir),
  });
  state.window = window;
  window.once('ready-to-show', () => window.show());
  window.on('closed', () => { state.window = null; });
  reloadAfterCrash(window);
  await window.loadURL(APP_URL);
}

/** Start the shell: single instance, scheme, hardening of every WebContents, then the window. */
export function startShell(e: ElectronModule): void {
  if (!e.app.requestSingleInstanceLock()) {
    e.app.quit();
    return;
  }
  registerScheme(e);
  const state: { window: electron.BrowserWindow | null } = { window: null };
  e.app.on('second-instance', () => {
    if (state.window === null) return;
    if (state.window.isMinimized()) state.window.restore();
    state.window.focus();
  });
  // Every WebContents, including any the page might manage to create, gets the same navigation rules.
  e.app.on('web-contents-created', (_event, contents) => hardenWebContents(contents as unknown as WebContentsLike));
  e.app.on('window-all-closed', () => e.app.quit());
  e.app.whenReady().then(() => onReady(e, state)).catch((err: unknown) => {
    e.dialog.showErrorBox('Eggline could not start', err instanceof Error ? err.message : String(err));
    e.app.quit();
  });
}

startShell(electron);
