import { describe, it, expect, vi, beforeAll, afterAll, beforeEach } from 'vitest';
import { mkdtemp, mkdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { API_INVOKE_METHODS } from '../../core/contract';

// Electron's binary cannot run here, so main.ts runs against a recording stand-in of the electron module.
const mock = vi.hoisted(() => {
  type Listener = (...args: unknown[]) => unknown;
  const state = {
    appPath: '', userData: '', singleLock: true,
    appListeners: new Map<string, Listener>(),
    windows: [] as { options: Record<string, unknown>; url: string | null; sent: [string, unknown][] }[],
    schemes: [] as unknown[],
    protocolHandlers: new Map<string, (req: { url: string }) => Promise<Response>>(),
    ipc: new Map<string, Listener>(),
    permissionRequest: null as null | Listener,
    permissionCheck: null as null | Listener,
    menuTemplate: null as null | { label?: string; submenu?: { label?: string; accelerator?: string; click?: () => void }[] }[],
    quit: 0,
    contentsListeners: new Map<string, Listener>(),
    openedPaths: [] as string[],
  };
  class BrowserWindow {
    readonly record: (typeof state.windows)[number];
    readonly webContents: { send: (c: string, p: unknown) => void; on: (event: string, l: Listener) => void };
    constructor(options: Record<string, unknown>) {
      this.record = { options, url: null, sent: [] };
      state.windows.push(this.record);
      this.webContents = { send: (c, p) => { this.record.sent.push([c, p]); }, on: (event, l) => { state.contentsListeners.set(event, l); } };
    }
    once(): void { /* ready-to-show never fires here */ }
    on(): void { /* closed never fires here */ }
    isDestroyed(): boolean { return false; }
    async loadURL(url: string): Promise<void> { this.record.url = url; }
  }
  const electron = {
    app: {
      requestSingleInstanceLock: () => state.singleLock,
      quit: () => { state.quit++; },
      on: (event: string, l: Listener) => { state.appListeners.set(event, l); },
      whenReady: () => Promise.resolve(),
      getAppPath: () => state.appPath,
      getPath: () => state.userData,
    },
    protocol: {
      registerSchemesAsPrivileged: (s: unknown[]) => { state.schemes.push(...s); },
      handle: (scheme: string, h: (req: { url: string }) => Promise<Response>) => { state.protocolHandlers.set(scheme, h); },
    },
    session: { defaultSession: {
      setPermissionRequestHandler: (h: Listener) => { state.permissionRequest = h; },
      setPermissionCheckHandler: (h: Listener) => { state.permissionCheck = h; },
    } },
    ipcMain: { handle: (c: string, l: Listener) => { state.ipc.set(c, l); }, removeHandler: (c: string) => { state.ipc.delete(c); } },
    Menu: { buildFromTemplate: (t: typeof state.menuTemplate) => t, setApplicationMenu: (m: typeof state.menuTemplate) => { state.menuTemplate = m; } },
    dialog: { showOpenDialog: async () => ({ canceled: true, filePaths: [] }), showSaveDialog: async () => ({ canceled: true }), showErrorBox: () => undefined },
    BrowserWindow,
    shell: { openPath: async (p: string) => { state.openedPaths.push(p); return ''; } },
  };
  return { state, electron };
});
vi.mock('electron', () => mock.electron);

let root: string;
beforeAll(async () => {
  root = await mkdtemp(join(tmpdir(), 'eggline-main-'));
  mock.state.appPath = root;
  mock.state.userData = join(root, 'user-data');
  await mkdir(join(root, 'dist', 'renderer'), { recursive: true });
  await writeFile(join(root, 'dist', 'renderer', 'index.html'), '<!doctype html>');
  await import('../../app/main/main');
  await vi.waitFor(() => expect(typeof mock.state.windows[0]?.url).toBe('string'));
});
afterAll(async () => { await rm(root, { recursive: true, force: true }); });

describe('main process (electron mocked)', () => {
  it('creates the window with isolation, sandbox, no node and no webview', () => {
    const prefs = mock.state.windows[0].options.webPreferences as Record<string, unknown>;
    // Source: Electron security checklist items 2 (nodeIntegration off), 3 (contextIsolation), 4 (sandbox),
    // 6 (webSecurity left at its default), 8–10 (no insecure content, experimental or Blink features), 12 (webviewTag off).
    expect(prefs).toMatchObject({ contextIsolation: true, sandbox: true, nodeIntegration: false, webviewTag: false });
    for (const key of ['webSecurity', 'allowRunningInsecureContent', 'experimentalFeatures', 'enableBlinkFeatures']) {
      expect(prefs).not.toHaveProperty(key);
    }
    expect(prefs.preload).toBe(join(root, 'dist', 'preload.cjs'));
    expect(mock.state.windows).toHaveLength(1);
  });

  it('loads the page from its own privileged scheme, not file://', async () => {
    // Source: Electron security checklist item 18 (use a custom protocol instead of file://).
    expect(mock.state.windows[0].url).toBe('eggline://app/index.html');
    expect(mock.state.schemes).toEqual([{ scheme: 'eggline', privileges: { standard: true, secure: true, supportFetchAPI: true } }]);
    const serve = mock.state.protocolHandlers.get('eggline')!;
    const page = await serve({ url: 'eggline://app/index.html' });
    expect(page.status).toBe(200);
    // Source: Electron security checklist item 7 (define a Content-Security-Policy); policy text from the Eggline shell specification.
    expect(page.headers.get('content-security-policy')).toBe("default-src 'self'; script-src 'self'; style-src 'self' 'unsafe-inline'; "
      + "img-src 'self' blob: data:; worker-src 'self' blob:; object-src 'none'; base-uri 'none'; frame-src 'none'");
    expect((await serve({ url: 'eggline://app/..%2f..%2fpackage.json' })).status).toBe(403);
  });

  it('denies navigation, redirects, new windows and webviews for every WebContents', () => {
    const listeners = new Map<string, (e: { preventDefault(): void }, url?: string) => void>();
    let openHandler: ((d: { url: string }) => unknown) | null = null;
    const contents = { on: (event: string, l: (e: { preventDefault(): void }) => void) => { listeners.set(event, l); },
      setWindowOpenHandler: (h: (d: { url: string }) => unknown) => { openHandler = h; } };
    mock.state.appListeners.get('web-contents-created')!({}, contents);
    // Source: Electron security checklist items 13 (limit navigation), 14 (limit new windows), 11–12 (webview).
    for (const event of ['will-navigate', 'will-redirect', 'will-attach-webview']) {
      const preventDefault = vi.fn();
      listeners.get(event)!({ preventDefault }, 'https://example.invalid/');
      expect(preventDefault).toHaveBeenCalledOnce();
    }
    expect(openHandler!({ url: 'https://example.invalid/' })).toEqual({ action: 'deny' });
  });

  it('denies every permission request and check', () => {
    // Source: Electron security checklist item 5 (handle session permission requests).
    const callback = vi.fn();
    mock.state.permissionRequest!({}, 'media', callback);
    expect(callback).toHaveBeenCalledWith(false);
    for (const p of ['notifications', 'geolocation', 'clipboard-read']) expect(mock.state.permissionCheck!({}, p)).toBe(false);
  });

  it('registers every API channel behind the sender check', async () => {
    // Source: Electron security checklist item 17 (validate the sender of all IPC messages).
    expect([...mock.state.ipc.keys()].sort()).toEqual(API_INVOKE_METHODS.map((m) => `eggline:${m}`).sort());
    const refused = await mock.state.ipc.get('eggline:recent')!({ senderFrame: { url: 'https://example.invalid/', parent: null } });
    expect(refused).toMatchObject({ ok: false, error: { code: 'not-allowed' } });
    const answered = await mock.state.ipc.get('eggline:recent')!({ senderFrame: { url: 'eggline://app/index.html', parent: null } });
    expect(answered).toEqual({ ok: true, value: [] });
  });

  it('opens a batch report with shell.openPath, only for a report of the open project\'s batch output folder', async () => {
    const images = join(root, 'images');
    const out = join(root, 'out');
    await mkdir(images, { recursive: true });
    await mkdir(out, { recursive: true });
    await writeFile(join(out, 'report.html'), '<!DOCTYPE html>');
    // Demo data: a project that records its last batch's output folder.
    await writeFile(join(images, 'eggline-project.json'), JSON.stringify({ schema: 'eggline-project', version: 1, folder: '.', settings: {}, files: {}, batchOutDir: '../out' }));
    const trusted = { senderFrame: { url: 'eggline://app/index.html', parent: null } };
    const report = join(out, 'report.html');
    expect(await mock.state.ipc.get('eggline:openReport')!(trusted, report)).toMatchObject({ ok: false, error: { code: 'not-allowed' } });
    const dialog = mock.electron.dialog as { showOpenDialog: () => Promise<unknown> };
    const before = dialog.showOpenDialog;
    dialog.showOpenDialog = async () => ({ canceled: false, filePaths: [images] });
    try {
      expect(await mock.state.ipc.get('eggline:chooseFolder')!(trusted)).toMatchObject({ ok: true });
    } finally {
      dialog.showOpenDialog = before;
    }
    expect(await mock.state.ipc.get('eggline:openReport')!(trusted, report)).toEqual({ ok: true, value: null });
    expect(mock.state.openedPaths).toEqual([report]);
    // A page that is not ours gets nothing opened.
    expect(await mock.state.ipc.get('eggline:openReport')!({ senderFrame: { url: 'https://example.invalid/', parent: null } }, report)).toMatchObject({ ok: false });
    expect(mock.state.openedPaths).toHaveLength(1);
  });

  it('builds the menu, whose items send commands to the page', () => {
    const file = mock.state.menuTemplate!.find((m) => m.label === 'File')!;
    const open = file.submenu!.find((i) => i.label === 'Open Folder…')!;
    expect(open.accelerator).toBe('CmdOrCtrl+O');
    open.click!();
    expect(mock.state.windows[0].sent).toContainEqual(['eggline:menu-command', 'open-folder']);
  });

  it('reloads the page after a renderer crash, at most three times', async () => {
    const gone = mock.state.contentsListeners.get('render-process-gone')!;
    const loads: string[] = [];
    const record = mock.state.windows[0];
    const before = record.url;
    gone({}, { reason: 'clean-exit' });
    for (let i = 0; i < 5; i++) {
      record.url = null;
      gone({}, { reason: 'crashed' });
      await Promise.resolve();
      if (record.url !== null) loads.push(record.url);
    }
    expect(loads).toEqual(['eggline://app/index.html', 'eggline://app/index.html', 'eggline://app/index.html']);
    record.url = before;
  });

  it('keeps a single instance and quits when the windows close', () => {
    expect(mock.state.appListeners.has('second-instance')).toBe(true);
    const before = mock.state.quit;
    mock.state.appListeners.get('window-all-closed')!();
    expect(mock.state.quit).toBe(before + 1);
  });
});

describe('second instance (electron mocked)', () => {
  beforeEach(() => { vi.resetModules(); });

  it('quits at once without a window when another instance holds the lock', async () => {
    const windowsBefore = mock.state.windows.length;
    const quitBefore = mock.state.quit;
    mock.state.singleLock = false;
    await import('../../app/main/main');
    expect(mock.state.quit).toBe(quitBefore + 1);
    await new Promise((r) => setTimeout(r, 20));
    expect(mock.state.windows.length).toBe(windowsBefore);
  });
});
