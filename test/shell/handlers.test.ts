import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import { mkdtemp, mkdir, readFile, readdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { ApiResult, BatchProgress, ExportKind, ProjectDoc } from '../../core/contract';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { createHandlers, type ApiHandlers, type HandlerDeps } from '../../app/main/handlers';
import { createFakeEngine } from './fake-engine';

// All files here are demo data: invented names and bytes in temp folders.
let root: string;
let dataDir: string;
let images: string;
let answers: { folder: string | null; files: string[] | null; out: string | null; project: string | null; save: string | null };
let progress: BatchProgress[];
let engine: ReturnType<typeof createFakeEngine>;
let api: ApiHandlers;

function deps(extra: Partial<HandlerDeps> = {}): HandlerDeps {
  return {
    dataDir,
    dialogs: {
      chooseFolder: async () => answers.folder,
      chooseFiles: async () => answers.files,
      chooseOutputFolder: async () => answers.out,
      openProjectFile: async () => answers.project,
      saveFile: async (_name: string, _kind: ExportKind) => answers.save,
    },
    emitBatchProgress: (p) => { progress.push(p); },
    engine,
    batchJobs: 1,
    ...extra,
  };
}

function value<T>(r: ApiResult<T>): T {
  if (!r.ok) throw new Error(`expected ok, got ${r.error.code}: ${r.error.message}`);
  return r.value;
}

function error<T>(r: ApiResult<T>): { code: string; message: string } {
  if (r.ok) throw new Error('expected a failure');
  return r.error;
}

beforeEach(async () => {
  root = await mkdtemp(join(tmpdir(), 'eggline-shell-'));
  dataDir = join(root, 'data');
  images = join(root, 'images');
  await mkdir(join(images, 'sub'), { recursive: true });
  for (const f of ['b.tif', 'a.ome.tif', 'sub/c.tiff', 'notes.txt', '.hidden.tif']) await writeFile(join(images, f), 'II*\0');
  answers = { folder: images, files: null, out: null, project: null, save: null };
  progress = [];
  engine = createFakeEngine();
  api = createHandlers(deps());
});
afterEach(async () => { await rm(root, { recursive: true, force: true }); });

describe('opening folders', () => {
  it('lists stack files recursively in batch order with a fresh project', async () => {
    const opened = value(await api.chooseFolder());
    expect(opened?.entries.map((e) => [e.name, e.status])).toEqual([['a.ome.tif', 'new'], ['b.tif', 'new'], ['sub/c.tiff', 'new']]);
    expect(opened?.projectPath).toBe(join(images, 'eggline-project.json'));
    expect(opened?.project.folder).toBe(images);
    expect(opened?.project.settings).toEqual(DEFAULT_SETTINGS);
  });

  it('returns null when the dialog is cancelled', async () => {
    answers.folder = null;
    expect(value(await api.chooseFolder())).toBeNull();
  });

  it('marks files with hand edits as edited and reports edited files missing from the folder', async () => {
    const doc: ProjectDoc = { schema: 'eggline-project', version: 1, folder: '.', settings: DEFAULT_SETTINGS, files: {
      'b.tif': { axis: { anterior: { x: 1, y: 1 }, posterior: { x: 9, y: 1 }, source: 'hand' }, landmarks: [], fitRangeEl: null },
      'gone.tif': { axis: null, landmarks: [], fitRangeEl: [0.2, 0.4] },
    } };
    await writeFile(join(images, 'eggline-project.json'), JSON.stringify(doc));
    const entries = value(await api.chooseFolder())?.entries ?? [];
    expect(entries.map((e) => [e.name, e.status, e.message])).toEqual([
      ['a.ome.tif', 'new', null], ['b.tif', 'edited', null], ['sub/c.tiff', 'new', null],
      ['gone.tif', 'error', 'gone.tif: in the project but missing from the folder'],
    ]);
  });

  it('refuses a corrupt project with a clear one-line error instead of replacing it', async () => {
    await writeFile(join(images, 'eggline-project.json'), '{"schema": "eggline-project", "version": 1,\n "files": ');
    const e = error(await api.chooseFolder());
    expect(e.code).toBe('bad-file');
    expect(e.message).toMatch(/^eggline-project\.json: not valid JSON \(.*\)$/);
    expect(await readFile(join(images, 'eggline-project.json'), 'utf8')).toContain('"files": ');
  });
});

describe('path allow-list', () => {
  const settings = DEFAULT_SETTINGS;

  it('refuses paths that did not come from a dialog, drop, project or the demo', async () => {
    const e = error(await api.loadStack(join(images, 'a.ome.tif'), settings));
    expect(e).toEqual({ code: 'not-allowed', message: 'a.ome.tif: not opened through a dialog, a drop, a project or the demo; open it first' });
    expect(engine.calls).toEqual([]);
  });

  it('allows files under a chosen folder but not outside it, even through ..', async () => {
    value(await api.chooseFolder());
    expect(value(await api.loadStack(join(images, 'sub', 'c.tiff'), settings)).path).toBe(join(images, 'sub', 'c.tiff'));
    await writeFile(join(root, 'secret.tif'), 'II*\0');
    expect(error(await api.loadStack(join(images, '..', 'secret.tif'), settings)).code).toBe('not-allowed');
    expect(error(await api.saveProject(join(root, 'elsewhere.json'), (value(await api.chooseFolder()))!.project)).code).toBe('not-allowed');
  });

  it('allows dropped files and the stacks of dropped folders', async () => {
    const entries = value(await api.openDropped([join(images, 'b.tif'), join(images, 'notes.txt'), join(images, 'sub')]));
    expect(entries.map((e) => [e.name, e.status])).toEqual([['b.tif', 'new'], ['notes.txt', 'error'], ['c.tiff', 'new']]);
    expect(entries[1].message).toBe('notes.txt: not a stack (.tif, .tiff, .ome.tif, .btf, or an .ome.zarr folder)');
    expect(value(await api.loadStack(join(images, 'b.tif'), settings)).path).toBe(join(images, 'b.tif'));
    expect(error(await api.loadStack(join(images, 'a.ome.tif'), settings)).code).toBe('not-allowed');
  });

  it('allows files from the open-files dialog', async () => {
    answers.files = [join(images, 'a.ome.tif')];
    expect(value(await api.chooseFiles())?.map((e) => e.name)).toEqual(['a.ome.tif']);
    expect(value(await api.loadSlice({ path: join(images, 'a.ome.tif'), z: 1, c: 0, t: 0 })).data).toEqual(new Float32Array([1, 0]));
  });

  it('refuses batch output folders that were not chosen', async () => {
    const opened = value(await api.chooseFolder())!;
    const e = error(await api.runBatch(images, join(root, 'out'), opened.project));
    expect(e).toEqual({ code: 'not-allowed', message: 'out: not chosen as an output folder; open it first' });
  });
});

describe('argument validation', () => {
  it('rejects wrong types and ranges with exact messages', async () => {
    value(await api.chooseFolder());
    const p = join(images, 'a.ome.tif');
    expect(error(await api.loadStack(42 as unknown as string, DEFAULT_SETTINGS))).toEqual({ code: 'bad-argument', message: 'path must be an absolute path' });
    expect(error(await api.loadStack('a.ome.tif', DEFAULT_SETTINGS)).message).toBe('a.ome.tif: path must be an absolute path');
    expect(error(await api.loadStack(p, { ...DEFAULT_SETTINGS, fitRangeEl: [0.5, 0.5] }))).toEqual(
      { code: 'bad-argument', message: 'a.ome.tif: settings.fitRangeEl must be two numbers [a, b] with 0 ≤ a < b ≤ 1' });
    expect(error(await api.loadSlice({ path: p, z: -1, c: 0, t: 0 })).message).toBe('a.ome.tif: z must be an integer from 0 to 1000000');
    expect(error(await api.loadSlice(null as never)).message).toBe('request must be {path, z, c, t}');
    expect(error(await api.openDropped([] as string[])).message).toBe('paths must be a list of 1 to 10000 absolute paths');
    expect(error(await api.svgToPng('<svg/>', 0)).message).toBe('scale must be a number from 0.1 to 8');
    expect(error(await api.svgToPng('hello', 1)).message).toBe('svg must be an SVG document as text');
    expect(error(await api.exportFile('exe' as ExportKind, 'a.exe', '')).message).toBe('a.exe: kind must be one of svg, png, csv, json');
    expect(error(await api.exportFile('csv', '../x.csv', 'a')).message).toBe('x.csv: suggestedName must be a file name, not a path');
    expect(error(await api.exportFile('png', 'x.png', 'text')).message).toBe('x.png: content must be bytes (Uint8Array) for png');
    expect(error(await api.cancelBatch('')).message).toBe('runId must be a text of 1 to 100 characters');
  });

  it('names the file when analysis fails, and keeps the message on one line', async () => {
    value(await api.chooseFolder());
    await writeFile(join(images, 'empty.tif'), '');
    value(await api.openDropped([join(images, 'empty.tif')]));
    expect(error(await api.loadStack(join(images, 'empty.tif'), DEFAULT_SETTINGS))).toEqual({ code: 'bad-file', message: 'empty.tif: empty file (0 bytes)' });
    await rm(join(images, 'b.tif'));
    expect(error(await api.loadStack(join(images, 'b.tif'), DEFAULT_SETTINGS))).toEqual({ code: 'not-found', message: 'b.tif: not found' });
    expect(error(await api.loadSlice({ path: join(images, 'a.ome.tif'), z: 5, c: 0, t: 0 })).message).toBe('a.ome.tif: slice z=5 is out of range (2 slices)');
  });

  it('never throws, even when a dependency does', async () => {
    const broken = createHandlers(deps({ dialogs: { ...deps().dialogs, chooseFolder: async () => { throw new Error('dialog\nfailed'); } } }));
    expect(error(await broken.chooseFolder())).toEqual({ code: 'internal', message: 'dialog failed' });
  });
});

describe('projects', () => {
  it('saves atomically with a backup and reopens exactly', async () => {
    const opened = value(await api.chooseFolder())!;
    const edited: ProjectDoc = { ...opened.project, settings: { ...DEFAULT_SETTINGS, projection: 'max' }, files: {
      'sub/c.tiff': { axis: { anterior: { x: 3.25, y: 4 }, posterior: { x: 80, y: 5.5 }, source: 'hand' },
        landmarks: [{ name: 'furrow', point: { x: 40, y: 4.5 } }], fitRangeEl: [0.1, 0.45] },
    } };
    expect(value(await api.saveProject(opened.projectPath, opened.project)).savedAt).toMatch(/^\d{4}-\d\d-\d\dT/);
    value(await api.saveProject(opened.projectPath, edited));
    expect((await readdir(images)).filter((n) => n.startsWith('eggline-project'))).toEqual(['eggline-project.json', 'eggline-project.json.bak']);

    // A fresh handler set (as after a restart) sees exactly what was saved.
    answers.project = opened.projectPath;
    const reopened = value(await createHandlers(deps()).openProject())!;
    expect(reopened.project).toEqual(edited);
    expect(reopened.entries.find((e) => e.name === 'sub/c.tiff')?.status).toBe('edited');
  });

  it('rejects an invalid document without touching the file', async () => {
    const opened = value(await api.chooseFolder())!;
    value(await api.saveProject(opened.projectPath, opened.project));
    const before = await readFile(opened.projectPath, 'utf8');
    const bad = { ...opened.project, version: 3 } as unknown as ProjectDoc;
    expect(error(await api.saveProject(opened.projectPath, bad))).toEqual({ code: 'bad-argument',
      message: 'eggline-project.json: project: version is 3, newer than this Eggline reads (2); update Eggline to open it' });
    expect(await readFile(opened.projectPath, 'utf8')).toBe(before);
  });

  it('reports a corrupt project file opened through the dialog', async () => {
    const path = join(root, 'old.json');
    await writeFile(path, JSON.stringify({ schema: 'eggline-project', version: 1, folder: 'images', settings: { profile: { binCount: 1 } } }));
    answers.project = path;
    expect(error(await api.openProject())).toEqual({ code: 'bad-file', message: 'old.json: settings.profile.binCount must be a whole number from 10 to 2000' });
  });
});

describe('recent list and demo', () => {
  it('keeps the last 10 opened paths, newest first, without duplicates', async () => {
    for (let i = 0; i < 12; i++) {
      await mkdir(join(root, `f${i}`));
      answers.folder = join(root, `f${i}`);
      value(await api.chooseFolder());
    }
    answers.folder = join(root, 'f5');
    value(await api.chooseFolder());
    const list = value(await api.recent());
    expect(list).toHaveLength(10);
    expect(list.slice(0, 3)).toEqual([join(root, 'f5'), join(root, 'f11'), join(root, 'f10')]);
    expect(new Set(list).size).toBe(10);
    expect(JSON.parse(await readFile(join(dataDir, 'recent.json'), 'utf8')).paths).toEqual(list);
  });

  it('reopens only paths on the recent list', async () => {
    expect(error(await api.openRecent(images)).code).toBe('not-allowed');
    value(await api.chooseFolder());
    const fresh = createHandlers(deps());
    const again = value(await fresh.openRecent(images));
    expect(again.kind).toBe('folder');
    expect(again.entries).toHaveLength(3);
  });

  it('treats a damaged recent file as empty', async () => {
    await mkdir(dataDir, { recursive: true });
    await writeFile(join(dataDir, 'recent.json'), 'not json');
    expect(value(await api.recent())).toEqual([]);
  });

  it('writes the demo set once into <dataDir>/demo and opens it with its project', async () => {
    const demo = value(await api.openDemo());
    expect(demo.folder).toBe(join(dataDir, 'demo'));
    expect(demo.projectPath).toBe(join(dataDir, 'demo', 'eggline-project.json'));
    expect(demo.project.folder).toBe(join(dataDir, 'demo'));
    expect(demo.entries.map((e) => [e.name, e.status])).toEqual([['dose-1/embryo-01.ome.tif', 'edited'], ['dose-1/embryo-02.ome.tif', 'new']]);
    expect(value(await api.loadStack(demo.entries[1].path, demo.project.settings)).detection.eggLengthUm).toBe(3);
    value(await createHandlers(deps()).openDemo());
    expect(engine.calls.filter((c) => c === 'writeDemoDataSet')).toHaveLength(1);
    expect((await readdir(dataDir)).sort()).toEqual(['demo', 'recent.json']);
    value(await api.saveProject(demo.projectPath, demo.project));
  });

  it('leaves no half-written demo folder when writing fails', async () => {
    const failing = { ...engine, writeDemoDataSet: async (dir: string) => { await mkdir(dir); throw new Error('disk trouble'); } };
    const e = error(await createHandlers(deps({ engine: failing })).openDemo());
    expect(e).toEqual({ code: 'internal', message: 'demo: disk trouble' });
    expect(await readdir(dataDir)).toEqual([]);
  });
});

describe('batches', () => {
  it('runs with the project settings, relabels progress with its run id and cancels', async () => {
    const opened = value(await api.chooseFolder())!;
    answers.out = join(root, 'out');
    await mkdir(answers.out);
    expect(value(await api.chooseOutputFolder())).toBe(answers.out);
    const running = api.runBatch(images, answers.out, opened.project);
    await new Promise((r) => setTimeout(r, 5));
    expect(error(await api.runBatch(images, answers.out, opened.project)).code).toBe('busy');
    const runId = progress[0].runId;
    expect(runId).not.toBe('engine-id');
    expect(value(await api.cancelBatch(runId))).toBeNull();
    const summary = value(await running);
    expect(summary).toMatchObject({ runId, cancelled: true });
    expect(engine.batchOptions[0]).toMatchObject({ folder: images, outDir: answers.out, jobs: 1, settings: opened.project.settings });
    expect(error(await api.cancelBatch(runId)).code).toBe('not-found');
  });
});

describe('batches with a sample sheet', () => {
  it('passes samples.csv from the batch folder to the engine for the cohort step, and null without one', async () => {
    const opened = value(await api.chooseFolder())!;
    answers.out = join(root, 'out');
    await mkdir(answers.out);
    value(await api.chooseOutputFolder());
    value(await api.runBatch(images, answers.out, opened.project));
    expect(engine.batchOptions[0].sampleSheetPath).toBeNull();
    await writeFile(join(images, 'samples.csv'), 'file,condition,dosage\na.ome.tif,ref,1\n');
    value(await api.runBatch(images, answers.out, opened.project));
    expect(engine.batchOptions[1].sampleSheetPath).toBe(join(images, 'samples.csv'));
  });

  it('still refuses a second batch while one runs (the sheet lookup happens before the check)', async () => {
    const opened = value(await api.chooseFolder())!;
    await writeFile(join(images, 'samples.csv'), 'file,condition\n');
    answers.out = join(root, 'out');
    await mkdir(answers.out);
    value(await api.chooseOutputFolder());
    const first = api.runBatch(images, answers.out, opened.project);
    const second = api.runBatch(images, answers.out, opened.project);
    const results = await Promise.all([first, second]);
    expect(results.filter((r) => r.ok)).toHaveLength(1);
    expect(results.map((r) => (r.ok ? 'ok' : r.error.code)).sort()).toEqual(['busy', 'ok']);
  });
});

describe('exports', () => {
  it('writes text through the save dialog, adding the extension', async () => {
    answers.save = join(root, 'profile');
    expect(value(await api.exportFile('csv', 'profile.csv', 'x_el,mean\n0.5,1\n'))).toBe(join(root, 'profile.csv'));
    expect(await readFile(join(root, 'profile.csv'), 'utf8')).toBe('x_el,mean\n0.5,1\n');
    answers.save = null;
    expect(value(await api.exportFile('png', 'a.png', new Uint8Array([1])))).toBeNull();
  });

  it('renders SVG to PNG at the requested scale', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="20" height="10"><rect width="20" height="10" fill="#123456"/></svg>';
    const png = value(await api.svgToPng(svg, 2));
    // Source: PNG specification §5.2 (signature) and §11.2.2 (IHDR width and height, big-endian at bytes 16–23).
    expect([...png.slice(0, 8)]).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    const view = new DataView(png.buffer, png.byteOffset);
    expect([view.getUint32(16), view.getUint32(20)]).toEqual([40, 20]);
  });
});

describe('OME-Zarr folders in the window', () => {
  beforeEach(async () => {
    // Demo data: a store's files (contents do not matter to the listing; the fake engine reads nothing).
    for (const f of ['.zattrs', '.zgroup', '0/.zarray', '0/0.0.0']) {
      await mkdir(join(images, 'sub', 'd.ome.zarr', f, '..'), { recursive: true });
      await writeFile(join(images, 'sub', 'd.ome.zarr', f), '{}');
    }
  });

  it('lists a .zarr folder as one stack and never the files inside it', async () => {
    const opened = value(await api.chooseFolder());
    expect(opened?.entries.map((e) => e.name)).toEqual(['a.ome.tif', 'b.tif', 'sub/c.tiff', 'sub/d.ome.zarr']);
  });

  it('opens a dropped .zarr folder as one loose stack and allows reading it', async () => {
    const store = join(images, 'sub', 'd.ome.zarr');
    const entries = value(await api.openDropped([store]));
    expect(entries.map((e) => [e.name, e.status])).toEqual([['d.ome.zarr', 'new']]);
    // The handler lets the folder through to the engine (the fake engine reads files only, so it then fails).
    await api.loadStack(store, DEFAULT_SETTINGS);
    expect(engine.calls.some((c) => c.startsWith('loadForView d.ome.zarr'))).toBe(true);
  });
});
