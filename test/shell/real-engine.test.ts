import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtemp, mkdir, readdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { ApiResult, BatchProgress, OpenedFolder } from '../../core/contract';
import { createHandlers, type ApiHandlers } from '../../app/main/handlers';
import { writeOmeTiff } from '../../core/tiff';

// End to end through the real decoder, pipeline, batch engine and demo writer, in this thread (demo data: the
// synthetic demo embryos, a subset of 2 to keep the test quick).
let root: string;
let api: ApiHandlers;
let demo: OpenedFolder;
const progress: BatchProgress[] = [];
let outDir: string | null = null;

function value<T>(r: ApiResult<T>): T {
  if (!r.ok) throw new Error(`expected ok, got ${r.error.code}: ${r.error.message}`);
  return r.value;
}

beforeAll(async () => {
  root = await mkdtemp(join(tmpdir(), 'eggline-real-'));
  api = createHandlers({
    dataDir: join(root, 'data'),
    dialogs: { chooseFolder: async () => null, chooseFiles: async () => null, chooseOutputFolder: async () => outDir,
      openProjectFile: async () => null, saveFile: async () => null },
    emitBatchProgress: (p) => { progress.push(p); },
    demoSubset: 2,
    batchJobs: 0,
  });
  demo = value(await api.openDemo());
}, 300_000);
afterAll(async () => { await rm(root, { recursive: true, force: true }); });

describe('handlers with the real analysis engine', () => {
  it('opens the demo with its project and hand-marked landmarks', () => {
    expect(demo.entries).toHaveLength(2);
    for (const e of demo.entries) expect(e.status).toBe('edited');
    expect(Object.keys(demo.project.files).sort()).toEqual(demo.entries.map((e) => e.name).sort());
  });

  it('loads a demo stack: projected channels and a detected axis', async () => {
    const loaded = value(await api.loadStack(demo.entries[0].path, demo.project.settings));
    expect(loaded.projected.channels).toHaveLength(loaded.info.sizeC);
    expect(loaded.projected.channels[0].data).toBeInstanceOf(Float32Array);
    expect(loaded.detection.eggLengthUm).toBeGreaterThan(0);
    const slice = value(await api.loadSlice({ path: demo.entries[0].path, z: loaded.info.sizeZ - 1, c: 0, t: 0 }));
    expect(slice.data).toHaveLength(loaded.info.sizeX * loaded.info.sizeY);
    const out = await api.loadSlice({ path: demo.entries[0].path, z: loaded.info.sizeZ, c: 0, t: 0 });
    expect(out).toEqual({ ok: false, error: { code: 'bad-argument',
      message: `${demo.entries[0].name.split('/').pop()}: z=${loaded.info.sizeZ} is out of range (the stack has ${loaded.info.sizeZ} slices)` } });
  });

  it('gives the middle slice of the first channel as the preview, the same pixels loadSlice gives', async () => {
    // Demo data; the preview is the decoded slice itself, so it must equal loadSlice of the same plane.
    const path = demo.entries[0].path;
    const preview = value(await api.loadPreview(path));
    const loaded = value(await api.loadStack(path, demo.project.settings));
    expect({ z: preview.z, c: preview.c, sizeZ: preview.sizeZ, sizeC: preview.sizeC })
      .toEqual({ z: Math.floor(loaded.info.sizeZ / 2), c: 0, sizeZ: loaded.info.sizeZ, sizeC: loaded.info.sizeC });
    const slice = value(await api.loadSlice({ path, z: preview.z, c: 0, t: 0 }));
    expect({ width: preview.width, height: preview.height }).toEqual({ width: slice.width, height: slice.height });
    expect(preview.data).toEqual(slice.data);
    const bad = await api.loadPreview(join(root, 'nowhere.tif'));
    expect(bad.ok).toBe(false);
  });

  it('reports a file that is not a TIFF with a one-line message naming it', async () => {
    const bad = join(root, 'not-a-stack.tif');
    await writeFile(bad, 'hello, this is text');
    value(await api.openDropped([bad]));
    const r = await api.loadStack(bad, demo.project.settings);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.code).toBe('bad-file');
      expect(r.error.message.startsWith('not-a-stack.tif: ')).toBe(true);
      expect(r.error.message).not.toContain('\n');
    }
  });

  it('still shows a stack with no embryo, with a placeholder axis and a warning naming the file', async () => {
    // Demo data: a blank 64 × 48 frame, 2 slices, 1 channel, 1.5 µm per pixel.
    const blank = join(root, 'blank.ome.tif');
    const planes = [0, 1].map(() => ({ width: 64, height: 48, data: new Uint16Array(64 * 48).fill(100) }));
    await writeFile(blank, writeOmeTiff(planes, { sizeZ: 2, sizeC: 1, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: ['c1'], physicalSizeXUm: 1.5 }));
    value(await api.openDropped([blank]));
    const loaded = value(await api.loadStack(blank, demo.project.settings));
    expect(loaded.detection.axis.anterior.y).toBe(23.5);
    expect(loaded.detection.warnings[0]).toMatch(/^blank\.ome\.tif: no embryo found automatically \(.+\); the axis shown is a placeholder, set it by hand$/);
  });

  it('runs a batch on the demo folder into a chosen output folder', async () => {
    outDir = join(root, 'results');
    await mkdir(outDir);
    value(await api.chooseOutputFolder());
    const summary = value(await api.runBatch(demo.folder, outDir, demo.project));
    expect(summary).toMatchObject({ ok: 2, failed: 0, cancelled: false, outDir });
    expect(progress.length).toBeGreaterThan(0);
    expect(new Set(progress.map((p) => p.runId))).toEqual(new Set([summary.runId]));
    expect(await readdir(outDir)).toEqual(expect.arrayContaining(['embryos.csv', 'results.json']));
  });

  it('runs the cohort step with the demo samples.csv: conditions, shifts and figures for the window, report.html on disk', async () => {
    outDir = join(root, 'results-cohort');
    await mkdir(outDir);
    value(await api.chooseOutputFolder());
    const summary = value(await api.runBatch(demo.folder, outDir, demo.project));
    expect(summary.cohortError ?? null).toBeNull();
    const c = summary.cohort;
    if (!c) throw new Error('expected a cohort summary');
    // Demo data: the 2-file subset holds one embryo of dosage 0.5 and one of the reference dosage 1.
    expect(c.conditions.map((r) => [r.name, r.dosage, r.n, r.isReference])).toEqual([['dosage-0.5x', 0.5, 1, false], ['dosage-1x', 1, 1, true]]);
    expect(c.sampleSheetPath).toBe(join(demo.folder, 'samples.csv'));
    expect(c.reportPath).toBe(join(outDir, 'report.html'));
    expect(new Set(c.shifts.map((s) => s.condition))).toEqual(new Set(['dosage-0.5x']));
    // Threshold model sign rule: f < 1 moves the boundary anterior.
    expect(c.shifts.every((s) => s.observedShiftEl < 0)).toBe(true);
    expect(c.figures.map((f) => f.name)).toEqual(expect.arrayContaining(['cohort-profiles', 'lambda-by-condition', 'positional-error']));
    const files = await readdir(outDir);
    expect(files).toEqual(expect.arrayContaining(['report.html', 'conditions.csv', 'shifts.csv', 'dosage_fit.csv', ...c.figures.map((f) => `${f.name}.svg`)]));
  });

  it('reports a malformed sample sheet as a one-line cohort error; the batch tables are still written', async () => {
    outDir = join(root, 'results-bad-sheet');
    await mkdir(outDir);
    value(await api.chooseOutputFolder());
    await writeFile(join(demo.folder, 'samples.csv'), 'file,group\nx.tif,a\n');
    const summary = value(await api.runBatch(demo.folder, outDir, demo.project));
    expect(summary.ok).toBe(2);
    expect(summary.cohort).toBeNull();
    expect(summary.cohortError).toBe('samples.csv: missing column "condition" (the header needs file, condition; dosage is optional)');
    expect(await readdir(outDir)).toEqual(expect.arrayContaining(['embryos.csv', 'results.json']));
  });
});
