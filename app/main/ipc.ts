// Wiring the handlers to ipcMain: fixed `eggline:` channels, and every call checked to come from our own page's
// main frame before it reaches a handler.
import { API_CHANNEL_PREFIX, API_INVOKE_METHODS, type ApiResult } from '../../core/contract';
import type { ApiHandlers } from './handlers';
import { failureFrom } from './result';

/** The scheme and host the app's page is served from (eggline://app/…). */
export const APP_SCHEME = 'eggline';
export const APP_HOST = 'app';

/** The parts of an IPC event we look at (a structural subset of Electron's IpcMainInvokeEvent). */
export interface IpcEventLike {
  readonly senderFrame: { readonly url: string; readonly parent: unknown } | null;
}

/** The parts of ipcMain we use. */
export interface IpcMainLike {
  handle(channel: string, listener: (event: IpcEventLike, ...args: unknown[]) => unknown): void;
  removeHandler(channel: string): void;
}

/** True when the call comes from the main frame of a page served by our own scheme and host. */
export function isTrustedSender(event: IpcEventLike): boolean {
  const frame = event.senderFrame;
  // A destroyed or navigated frame is null; a subframe has a parent. Neither may call us.
  if (frame === null || frame === undefined || (frame.parent !== null && frame.parent !== undefined)) return false;
  try {
    const url = new URL(frame.url);
    return url.protocol === `${APP_SCHEME}:` && url.host === APP_HOST;
  } catch {
    return false;
  }
}

/** The IPC channel of an API method. */
export function channelOf(method: string): string {
  if (!/^[a-zA-Z]+$/.test(method)) throw new Error(`invalid API method name ${method}`);
  return `${API_CHANNEL_PREFIX}${method}`;
}

const REFUSED: ApiResult<never> = { ok: false, error: { code: 'not-allowed', message: 'call refused: it did not come from the Eggline window' } };

/** Register every handler on its channel behind the sender check; returns a function that removes them. */
export function registerIpc(ipcMain: IpcMainLike, handlers: ApiHandlers): () => void {
  const channels: string[] = [];
  for (const method of API_INVOKE_METHODS) {
    const handler = handlers[method] as (...args: unknown[]) => Promise<ApiResult<unknown>>;
    const channel = channelOf(method);
    ipcMain.handle(channel, async (event, ...args) => {
      if (!isTrustedSender(event)) return REFUSED;
      try {
        return await handler(...args);
      } catch (e) {
        // Handlers do not throw; this is the last line of defence so the renderer still gets a value.
        return failureFrom(e, null);
      }
    });
    channels.push(channel);
  }
  return () => { for (const c of channels) ipcMain.removeHandler(c); };
}
