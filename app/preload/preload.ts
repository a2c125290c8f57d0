// Preload (sandboxed): exposes exactly one frozen object, window.eggline, implementing the API contract with
// ipcRenderer.invoke on fixed channels. Nothing of Electron itself (ipcRenderer, events) reaches the page.
import { contextBridge, ipcRenderer, webUtils } from 'electron';
import {
  API_CHANNEL_PREFIX, API_EVENT_CHANNELS, API_INVOKE_METHODS, type BatchProgress, type EgglineApi, type MovieProgress,
} from '../../core/contract';

/** A function that forwards its arguments to the main process on the method's fixed channel. */
function invoker(method: string): (...args: unknown[]) => Promise<unknown> {
  const channel = `${API_CHANNEL_PREFIX}${method}`;
  return (...args) => ipcRenderer.invoke(channel, ...args);
}

/** Subscribe to a main → renderer channel, passing only the payload (never the event) to the page's callback. */
function subscribe<T>(channel: string, listener: (value: T) => void): () => void {
  if (typeof listener !== 'function') throw new TypeError('listener must be a function');
  const wrapped = (_event: unknown, value: T): void => listener(value);
  ipcRenderer.on(channel, wrapped);
  return () => { ipcRenderer.removeListener(channel, wrapped); };
}

/** Build the API object exposed as window.eggline. */
export function buildApi(): EgglineApi {
  const methods = Object.fromEntries(API_INVOKE_METHODS.map((m) => [m, invoker(m)]));
  return Object.freeze({
    ...methods,
    onBatchProgress: (listener: (p: BatchProgress) => void) => subscribe(API_EVENT_CHANNELS.batchProgress, listener),
    onMenuCommand: (listener: (command: string) => void) => subscribe(API_EVENT_CHANNELS.menuCommand, listener),
    onMovieProgress: (listener: (p: MovieProgress) => void) => subscribe(API_EVENT_CHANNELS.movieProgress, listener),
    pathForDroppedFile: (file: File) => webUtils.getPathForFile(file),
  }) as unknown as EgglineApi;
}

contextBridge.exposeInMainWorld('eggline', buildApi());
