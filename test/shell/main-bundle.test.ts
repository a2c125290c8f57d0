import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { build } from 'esbuild';
import { writeDemoDataSet } from '../../app/batch/write-demo';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { externalExceptEsmOnly } from '../../scripts/bundle-externals.mjs';

// The built main-process bundle (CommonJS, as scripts/build.mjs makes it) loaded in plain Node with a stand-in
// electron module: checks that the bundle and its external packages load, and that the worker path is right.
const appDir = resolve('test/fixtures/generated/shell/app');
const dist = join(appDir, 'dist');
type Listener = (...args: unknown[]) => Promise<unknown>;
const ipc = new Map<string, Listener>();
const loaded: string[] = [];
let protocolHandler: ((req: { url: string }) => Promise<Response>) | null = null;
let scratch: string;

const fakeElectron = {
  app: { requestSingleInstanceLock: () => true, quit: () => undefined, on: () => undefined, whenReady: () => Promise.resolve(),
    getAppPath: () => appDir, getPath: () => join(scratch, 'user-data'), getVersion: () => '0.0.0' },
  protocol: { registerSchemesAsPrivileged: () => undefined, handle: (_s: string, h: typeof protocolHandler) => { protocolHandler = h; } },
  session: { defaultSession: { setPermissionRequestHandler: () => undefined, setPermissionCheckHandler: () => undefined } },
  ipcMain: { handle: (c: string, h: Listener) => { ipc.set(c, h); }, removeHandler: () => undefined },
  Menu: { buildFromTemplate: (t: unknown) => t, setApplicationMenu: () => undefined },
  dialog: { showErrorBox: (a: string, b: string) => { throw new Error(`${a}: ${b}`); } },
  BrowserWindow: class {
    webContents = { send: () => undefined, on: () => undefined };
    once(): void { /* never shown here */ }
    on(): void { /* never closed here */ }
    isDestroyed(): boolean { return false; }
    async loadURL(url: string): Promise<void> { loaded.push(url); }
  },
};

beforeAll(async () => {
  scratch = await mkdtemp(join(tmpdir(), 'eggline-bundle-'));
  await mkdir(join(dist, 'renderer'), { recursive: true });
  await writeFile(join(dist, 'renderer', 'index.html'), '<!doctype html>');
  const common = { bundle: true, platform: 'node' as const, target: 'node20', logLevel: 'warning' as const };
  // The main bundle is made as scripts/build.mjs makes it: packages external except the ESM-only ones.
  await build({ ...common, entryPoints: [{ in: 'app/main/main.ts', out: 'main' }], outdir: dist, format: 'cjs', outExtension: { '.js': '.cjs' },
    plugins: [externalExceptEsmOnly] });
  await build({ ...common, packages: 'external', entryPoints: [{ in: 'app/workers/analysis-worker.ts', out: 'analysis-worker' }], outdir: dist, format: 'esm',
    outExtension: { '.js': '.mjs' }, banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" } });
  const require = createRequire(import.meta.url);
  const Module = require('node:module') as { _load: (req: string, ...rest: unknown[]) => unknown };
  const original = Module._load;
  Module._load = function load(this: unknown, req: string, ...rest: unknown[]) {
    return req === 'electron' ? fakeElectron : original.call(this, req, ...rest);
  };
  try {
    require(join(dist, 'main.cjs'));
  } finally {
    Module._load = original;
  }
  for (let i = 0; i < 100 && loaded.length === 0; i++) await new Promise((r) => setTimeout(r, 20));
}, 300_000);
afterAll(async () => { await rm(scratch, { recursive: true, force: true }); });

describe('main-process bundle (stand-in electron)', () => {
  it('starts: loads the page, serves it and answers IPC from the page', async () => {
    expect(loaded).toEqual(['eggline://app/index.html']);
    expect((await protocolHandler!({ url: 'eggline://app/index.html' })).status).toBe(200);
    const fromPage = { senderFrame: { url: 'eggline://app/index.html', parent: null } };
    expect(await ipc.get('eggline:recent')!(fromPage)).toEqual({ ok: true, value: [] });
  });

  it('analyses a dropped demo stack in the built worker thread', async () => {
    const stack = (await writeDemoDataSet(join(scratch, 'demo'), { subset: 1 })).files[0];
    const fromPage = { senderFrame: { url: 'eggline://app/index.html', parent: null } };
    expect(await ipc.get('eggline:openDropped')!(fromPage, [stack])).toMatchObject({ ok: true });
    const r = await ipc.get('eggline:loadStack')!(fromPage, stack, DEFAULT_SETTINGS) as { ok: boolean; value: { detection: { eggLengthUm: number } } };
    expect(r.ok).toBe(true);
    expect(r.value.detection.eggLengthUm).toBeGreaterThan(0);
    const slice = await ipc.get('eggline:loadSlice')!(fromPage, { path: stack, z: 0, c: 0, t: 0 }) as { ok: boolean; value: { data: Float32Array } };
    expect(slice.ok).toBe(true);
    expect(slice.value.data).toBeInstanceOf(Float32Array);
  });
});
