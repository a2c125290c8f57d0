// The window's security settings, in one place so tests can read them.
import { join } from 'node:path';

/** The Content-Security-Policy sent with every page response. */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'", "script-src 'self'", "style-src 'self' 'unsafe-inline'", "img-src 'self' blob: data:",
  "worker-src 'self' blob:", "object-src 'none'", "base-uri 'none'", "frame-src 'none'",
].join('; ');

/** webPreferences of the main window: isolated, sandboxed, no node, no webview; webSecurity left on. */
export function windowWebPreferences(distDir: string): Readonly<Record<string, unknown>> {
  return Object.freeze({
    preload: join(distDir, 'preload.cjs'),
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    nodeIntegrationInSubFrames: false,
    webviewTag: false,
    spellcheck: false,
  });
}

/** The parts of Electron's WebContents we harden. */
export interface WebContentsLike {
  on(event: 'will-navigate' | 'will-redirect', listener: (e: { preventDefault(): void }, url: string) => void): unknown;
  on(event: 'will-attach-webview', listener: (e: { preventDefault(): void }) => void): unknown;
  setWindowOpenHandler(handler: (details: { url: string }) => { action: 'deny' }): void;
}

/** Deny navigation away from the page, redirects, new windows and webviews for one WebContents. */
export function hardenWebContents(contents: WebContentsLike): void {
  contents.on('will-navigate', (e) => e.preventDefault());
  contents.on('will-redirect', (e) => e.preventDefault());
  contents.on('will-attach-webview', (e) => e.preventDefault());
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
}

/** The parts of Electron's Session we harden. */
export interface SessionLike {
  setPermissionRequestHandler(handler: (wc: unknown, permission: string, callback: (granted: boolean) => void) => void): void;
  setPermissionCheckHandler(handler: (wc: unknown, permission: string) => boolean): void;
}

/** Deny every permission request and check (camera, notifications, …): the app needs none. */
export function denyAllPermissions(session: SessionLike): void {
  session.setPermissionRequestHandler((_wc, _permission, callback) => callback(false));
  session.setPermissionCheckHandler(() => false);
}
