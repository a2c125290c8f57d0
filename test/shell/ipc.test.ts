import { describe, it, expect, vi } from 'vitest';
import { API_INVOKE_METHODS } from '../../core/contract';
import { registerIpc, isTrustedSender, type IpcEventLike, type IpcMainLike } from '../../app/main/ipc';
import type { ApiHandlers } from '../../app/main/handlers';

vi.mock('electron', () => ({}));

/** A recording ipcMain. */
function fakeIpcMain(): IpcMainLike & { listeners: Map<string, (e: IpcEventLike, ...a: unknown[]) => unknown> } {
  const listeners = new Map<string, (e: IpcEventLike, ...a: unknown[]) => unknown>();
  return { listeners, handle: (c, l) => { listeners.set(c, l); }, removeHandler: (c) => { listeners.delete(c); } };
}

const mainFrame = (url: string): IpcEventLike => ({ senderFrame: { url, parent: null } });

function fakeHandlers(): ApiHandlers {
  const h = Object.fromEntries(API_INVOKE_METHODS.map((m) => [m, vi.fn(async (...args: unknown[]) => ({ ok: true, value: { m, args } }))]));
  return h as unknown as ApiHandlers;
}

describe('registerIpc', () => {
  it('registers every contract method on an eggline: channel and removes them again', () => {
    // Source: Electron security checklist item 17 (validate the sender of all IPC messages); channel prefix as in
    // the preload/main split described in the shared notes.
    const ipc = fakeIpcMain();
    const dispose = registerIpc(ipc, fakeHandlers());
    expect([...ipc.listeners.keys()].sort()).toEqual(API_INVOKE_METHODS.map((m) => `eggline:${m}`).sort());
    dispose();
    expect(ipc.listeners.size).toBe(0);
  });

  it('passes calls from our own main frame through', async () => {
    const ipc = fakeIpcMain();
    const handlers = fakeHandlers();
    registerIpc(ipc, handlers);
    const r = await ipc.listeners.get('eggline:loadStack')!(mainFrame('eggline://app/index.html'), '/a.tif', { x: 1 });
    expect(r).toEqual({ ok: true, value: { m: 'loadStack', args: ['/a.tif', { x: 1 }] } });
  });

  it.each([
    ['another scheme', mainFrame('https://app/index.html')],
    ['file://', mainFrame('file:///work/dist/renderer/index.html')],
    ['another host', mainFrame('eggline://evil/index.html')],
    ['a subframe', { senderFrame: { url: 'eggline://app/index.html', parent: { url: 'eggline://app/index.html' } } }],
    ['a destroyed frame', { senderFrame: null }],
    ['an unparsable url', mainFrame('not a url')],
  ] as [string, IpcEventLike][])('refuses calls from %s without calling the handler', async (_name, event) => {
    // Source: Electron security checklist item 17: check senderFrame.url and that the sender is the main frame.
    const ipc = fakeIpcMain();
    const handlers = fakeHandlers();
    registerIpc(ipc, handlers);
    expect(isTrustedSender(event)).toBe(false);
    const r = await ipc.listeners.get('eggline:openDemo')!(event);
    expect(r).toEqual({ ok: false, error: { code: 'not-allowed', message: 'call refused: it did not come from the Eggline window' } });
    expect(handlers.openDemo).not.toHaveBeenCalled();
  });

  it('turns a throwing handler into an error value', async () => {
    // Source: Electron ipcMain docs (errors thrown in handle reach the renderer with only their message), from memory.
    const ipc = fakeIpcMain();
    const handlers = { ...fakeHandlers(), recent: async () => { throw new Error('boom'); } } as unknown as ApiHandlers;
    registerIpc(ipc, handlers);
    expect(await ipc.listeners.get('eggline:recent')!(mainFrame('eggline://app/'))).toEqual({ ok: false, error: { code: 'internal', message: 'boom' } });
  });
});
