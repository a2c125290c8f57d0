// The last batch reopens with its project, and its report opens through the main process only for report files of
// the project's batch output folder. All files are demo data in temp folders.
import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import { mkdtemp, mkdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { resultsToJson } from '../../core/batch';
import type { ApiResult } from '../../core/contract';
import type { EmbryoResult } from '../../core/model';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { createHandlers, type ApiHandlers, type HandlerDeps } from '../../app/main/handlers';
import { saveProject } from '../../app/project';
import { createFakeEngine } from './fake-engine';

let root: string;
let images: string;
let out: string;
let opened: string[];
let openAnswer: string;
let api: ApiHandlers;

const value = <T>(r: ApiResult<T>): T => { if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`); return r.value; };
const error = <T>(r: ApiResult<T>) => { if (r.ok) throw new Error('expected a failure'); return r.error; };

function result(file: string, status: 'ok' | 'error'): EmbryoResult {
  return {
    file, status, error: status === 'error' ? `${file}: not a TIFF file` : null, warnings: [], pixelSizeUm: 1, pixelSizeSource: 'ome',
    eggLengthUm: 500, eggWidthUm: 200, axis: null, gradientChannel: 'c1', gradientProfile: null, gradientFit: null,
    boundaryProfiles: [], boundaries: [], landmarks: [], backgrounds: [],
  };
}

beforeEach(async () => {
  root = await mkdtemp(join(tmpdir(), 'eggline-results-'));
  images = join(root, 'images');
  out = join(root, 'out');
  await mkdir(images);
  await mkdir(out);
  await writeFile(join(images, 'a.tif'), 'II*\0');
  await writeFile(join(images, 'b.tif'), 'II*\0');
  await writeFile(join(out, 'results.json'), resultsToJson([result('a.tif', 'ok'), result('b.tif', 'error')]));
  await writeFile(join(out, 'run.json'), JSON.stringify({ runId: 'run-1', cancelled: false }));
  await writeFile(join(out, 'report.html'), '<!DOCTYPE html><title>report</title>');
  await saveProject(join(images, 'eggline-project.json'), {
    schema: 'eggline-project', version: 1, folder: images, settings: DEFAULT_SETTINGS, files: {}, batchOutDir: out,
  });
  opened = [];
  openAnswer = '';
  const deps: HandlerDeps = {
    dataDir: join(root, 'data'),
    dialogs: { chooseFolder: async () => images, chooseFiles: async () => null, chooseOutputFolder: async () => null, openProjectFile: async () => null, saveFile: async () => null },
    emitBatchProgress: () => undefined,
    engine: createFakeEngine(),
    openPath: async (p) => { opened.push(p); return openAnswer; },
  };
  api = createHandlers(deps);
});
afterEach(async () => { await rm(root, { recursive: true, force: true }); });

describe('the last batch of a project', () => {
  it('is recorded in the project file and read back from its output folder', async () => {
    const folder = value(await api.chooseFolder());
    expect(folder?.project.batchOutDir).toBe(out);
    const summary = value(await api.loadBatchResults(out, images));
    expect(summary?.results.map((r) => [r.file, r.status])).toEqual([['a.tif', 'ok'], ['b.tif', 'error']]);
    expect(summary).toMatchObject({ ok: 1, failed: 1, cancelled: false, runId: 'run-1', outDir: out, cohort: null });
  });

  it('is null when the folder has no results, and refused for a folder the project does not name', async () => {
    value(await api.chooseFolder());
    await rm(join(out, 'results.json'));
    expect(value(await api.loadBatchResults(out, images))).toBeNull();
    expect(error(await api.loadBatchResults(root, images)).code).toBe('not-allowed');
  });

  it('reports a damaged results.json in one line naming it', async () => {
    value(await api.chooseFolder());
    await writeFile(join(out, 'results.json'), '{ not json');
    const e = error(await api.loadBatchResults(out, images));
    expect(e.code).toBe('bad-file');
    expect(e.message).toMatch(/results\.json: not valid JSON/);
    expect(e.message).not.toMatch(/\n/);
  });
});

describe('opening the report', () => {
  it('hands report.html of the recorded output folder to the system, and nothing else', async () => {
    // Before the project is open the folder is not allowed.
    expect(error(await api.openReport(join(out, 'report.html'))).code).toBe('not-allowed');
    value(await api.chooseFolder());
    expect(value(await api.openReport(join(out, 'report.html')))).toBeNull();
    expect(opened).toEqual([join(out, 'report.html')]);
    expect(error(await api.openReport(join(out, 'results.json'))).code).toBe('bad-argument');
    expect(error(await api.openReport(join(images, 'a.tif'))).code).toBe('not-allowed');
    expect(error(await api.openReport('relative/report.html')).code).toBe('bad-argument');
    expect(opened).toHaveLength(1);
  });

  it('passes on why the system could not open it', async () => {
    value(await api.chooseFolder());
    openAnswer = 'no application is registered for .html';
    const e = error(await api.openReport(join(out, 'report.html')));
    expect(e).toEqual({ code: 'io', message: 'report.html: could not be opened (no application is registered for .html)' });
  });
});
