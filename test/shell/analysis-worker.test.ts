import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { build } from 'esbuild';
import { createAnalysisRunner, type AnalysisRunner } from '../../app/main/analysis-runner';
import { demoMovieFile, writeDemoDataSet } from '../../app/batch/write-demo';
import { newProject } from '../../app/project';
import { DEMO_MOVIE_PARAMS } from '../../core/synth';
import type { MovieProgress } from '../../core/contract';
import { DEFAULT_SETTINGS } from '../../core/settings';

// The real worker bundle (built here the way scripts/build.mjs builds it) analysing one synthetic demo embryo.
const outDir = resolve('test/fixtures/generated/shell');
let dataDir: string;
let stack: string;
let runner: AnalysisRunner;

beforeAll(async () => {
  await mkdir(outDir, { recursive: true });
  await build({
    entryPoints: [{ in: 'app/workers/analysis-worker.ts', out: 'analysis-worker' }], outdir: outDir, bundle: true,
    platform: 'node', target: 'node20', format: 'esm', outExtension: { '.js': '.mjs' }, packages: 'external', logLevel: 'warning',
    banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
  });
  dataDir = await mkdtemp(join(tmpdir(), 'eggline-worker-'));
  stack = (await writeDemoDataSet(dataDir, { subset: 1 })).files[0];
  runner = createAnalysisRunner(join(outDir, 'analysis-worker.mjs'));
}, 300_000);
afterAll(async () => {
  await runner?.close();
  await rm(dataDir, { recursive: true, force: true });
});

describe('analysis worker (built bundle)', () => {
  it('projects and detects a demo stack off the main thread', async () => {
    const view = await runner.run(stack, 'demo.ome.tif', DEFAULT_SETTINGS);
    expect(view.projected.channels.length).toBe(view.info.sizeC);
    expect(view.projected.channels[0].data).toBeInstanceOf(Float32Array);
    expect(view.projected.channels[0].data.length).toBe(view.info.sizeX * view.info.sizeY);
    expect(view.detection.mask.data).toBeInstanceOf(Uint8Array);
    expect(view.detection.eggLengthUm).toBeGreaterThan(0);
  });

  it('decodes one slice and refuses an out-of-range one with an API failure', async () => {
    const slice = await runner.readSlice(stack, 'demo.ome.tif', 0, 1, 0);
    expect(slice.data).toBeInstanceOf(Float32Array);
    expect(slice.data.length).toBe(slice.width * slice.height);
    await expect(runner.readSlice(stack, 'demo.ome.tif', 999, 0, 0)).rejects.toMatchObject({ name: 'ApiFailure', code: 'bad-argument' });
  });

  it('reports a bad file as a TiffError naming it', async () => {
    const bad = join(dataDir, 'bad.tif');
    await writeFile(bad, new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0, 0, 0, 0]));
    await expect(runner.run(bad, 'bad.tif', DEFAULT_SETTINGS)).rejects.toMatchObject({ name: 'TiffError', message: expect.stringMatching(/^bad\.tif: /) });
  });

  it('shows a movie\'s time point in the embryo found over time, twice with the same kept embryo, and stops a load when told', async () => {
    // Source: demo data (a 5-frame variant of the demo movie).
    const movie = join(dataDir, 'steps.ome.tif');
    await writeFile(movie, demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 5 }));
    const time = { timeStepS: null, axisPerTime: false };
    const at1 = await runner.run(movie, 'steps.ome.tif', { ...DEFAULT_SETTINGS, timeIndex: 1 }, time);
    const at3 = await runner.run(movie, 'steps.ome.tif', { ...DEFAULT_SETTINGS, timeIndex: 3 }, time);
    expect(at3.detection.axis).toEqual(at1.detection.axis);
    // The kept mask stays whole in the worker after an answer moved its copy here.
    expect(at3.detection.mask.data.length).toBe(at3.info.sizeX * at3.info.sizeY);
    const stop = new AbortController();
    const stale = runner.run(movie, 'steps.ome.tif', { ...DEFAULT_SETTINGS, timeIndex: 4 }, time, stop.signal);
    stop.abort();
    await expect(stale).rejects.toMatchObject({ name: 'AbortError', message: 'steps.ome.tif: loading cancelled (another view was asked for)' });
    // The worker goes on answering.
    expect((await runner.run(movie, 'steps.ome.tif', { ...DEFAULT_SETTINGS, timeIndex: 2 }, time)).detection.axis).toEqual(at1.detection.axis);
  });

  it('analyses a movie over time with a progress message per time point, and stops when closed', async () => {
    // Source: demo data (a 5-frame variant of the demo movie).
    const movie = join(dataDir, 'movie.ome.tif');
    await writeFile(movie, demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 5 }));
    const doc = { ...newProject(dataDir), settings: { ...DEFAULT_SETTINGS, boundaryChannels: [2] } };
    const options = { axisPerTime: false, tauRangeEl: [0.1, 0.4] as const, baselineFrames: 1, timeStepS: null };
    const progress: MovieProgress[] = [];
    const view = await runner.movie(movie, 'movie.ome.tif', doc, options, (p) => progress.push(p));
    expect(progress.map((p) => `${p.file} ${p.done}/${p.total}`)).toEqual([1, 2, 3, 4, 5].map((d) => `movie.ome.tif ${d}/5`));
    expect(view.timeIndices).toEqual([0, 1, 2, 3, 4]);
    expect(view.frames[4]!.channels[0]).toBeInstanceOf(Float32Array);
    expect(view.tables.timecourse.split('\n')[0]).toMatch(/^file,t_index,t_s,/);
    const stopped = expect(runner.movie(movie, 'movie.ome.tif', doc, options, () => undefined)).rejects.toThrow('movie.ome.tif: cancelled');
    await runner.close();
    await stopped;
  });
});
