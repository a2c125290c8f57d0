import { describe, it, expect, vi, beforeAll } from 'vitest';
import { API_INVOKE_METHODS } from '../../core/contract';

const mock = vi.hoisted(() => {
  const exposed: [string, unknown][] = [];
  const listeners = new Map<string, Set<(...a: unknown[]) => void>>();
  const invoked: unknown[][] = [];
  const electron = {
    contextBridge: { exposeInMainWorld: (key: string, api: unknown) => { exposed.push([key, api]); } },
    ipcRenderer: {
      invoke: async (...args: unknown[]) => { invoked.push(args); return { ok: true, value: null }; },
      on: (c: string, l: (...a: unknown[]) => void) => { if (!listeners.has(c)) listeners.set(c, new Set()); listeners.get(c)!.add(l); },
      removeListener: (c: string, l: (...a: unknown[]) => void) => { listeners.get(c)?.delete(l); },
    },
    webUtils: { getPathForFile: (f: { name: string }) => `/dropped/${f.name}` },
  };
  return { electron, exposed, listeners, invoked };
});
vi.mock('electron', () => mock.electron);

let api: Record<string, unknown>;
beforeAll(async () => {
  await import('../../app/preload/preload');
  api = mock.exposed[0][1] as Record<string, unknown>;
});

describe('preload (electron mocked)', () => {
  it('exposes exactly one frozen object, window.eggline, with the contract methods and nothing else', () => {
    // Source: Electron security checklist item 20 (do not expose Electron APIs to untrusted content; expose named functions).
    expect(mock.exposed.map(([k]) => k)).toEqual(['eggline']);
    expect(Object.isFrozen(api)).toBe(true);
    expect(Object.keys(api).sort()).toEqual([...API_INVOKE_METHODS, 'onBatchProgress', 'onMenuCommand', 'onMovieProgress', 'pathForDroppedFile'].sort());
    for (const value of Object.values(api)) expect(typeof value).toBe('function');
    expect(Object.values(api)).not.toContain(mock.electron.ipcRenderer);
  });

  it('invokes each method on its fixed eggline: channel', async () => {
    await (api.loadSlice as (r: unknown) => Promise<unknown>)({ path: '/a.tif', z: 1, c: 0, t: 0 });
    await (api.openDemo as () => Promise<unknown>)();
    expect(mock.invoked).toEqual([['eggline:loadSlice', { path: '/a.tif', z: 1, c: 0, t: 0 }], ['eggline:openDemo']]);
  });

  it('passes only the payload to listeners (never the event) and unsubscribes', () => {
    // Source: Electron security checklist item 20 (wrap listeners; never hand the IpcRendererEvent to the page).
    const got: unknown[][] = [];
    const off = (api.onBatchProgress as (l: (...a: unknown[]) => void) => () => void)((...args) => got.push(args));
    const channel = mock.listeners.get('eggline:batch-progress')!;
    for (const l of channel) l({ sender: 'the-event' }, { runId: 'r', done: 1 });
    expect(got).toEqual([[{ runId: 'r', done: 1 }]]);
    off();
    expect(channel.size).toBe(0);
    const offMenu = (api.onMenuCommand as (l: (c: string) => void) => () => void)(() => undefined);
    expect(mock.listeners.get('eggline:menu-command')!.size).toBe(1);
    offMenu();
  });

  it('resolves dropped files to paths through webUtils', () => {
    expect((api.pathForDroppedFile as (f: unknown) => string)({ name: 'e1.tif' })).toBe('/dropped/e1.tif');
  });
});
