import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { newProject } from '../project';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { DEMO_MOVIE_PARAMS, DEMO_MOVIE_SEED, movieFrame, planSyntheticMovie } from '../../core/synth';
import { writeOmeTiff } from '../../core/tiff';
import { analyseMovieFile, movieOutcomes, movieTables } from '../batch/timelapse-pass';
import { demoMovieFile } from '../batch/write-demo';
import { buildMovieView, frameShrinkFactor, shrinkPlane } from './movie-view';

describe('frameShrinkFactor and shrinkPlane (known answers by hand)', () => {
  it('shrinks by the smallest whole factor that fits the side limit and the budget', () => {
    expect(frameShrinkFactor(400, 240, 2, 46)).toBe(2); // 400/320 → 2
    expect(frameShrinkFactor(300, 200, 1, 1)).toBe(1);
    // 2 channels × 200 frames = 400 planes within 6 Mi = 6,291,456 floats: f = 8 gives 128² × 400 = 6,553,600 (too many),
    // f = 9 gives ⌈1024/9⌉² × 400 = 114² × 400 = 5,198,400.
    expect(frameShrinkFactor(1024, 1024, 2, 200)).toBe(9);
  });
  it('averages each block, edge blocks over the pixels they hold, and leaves NaN out', () => {
    const p = shrinkPlane({ width: 3, height: 3, data: Float32Array.from([1, 2, 3, 4, 5, 6, 7, 8, NaN]) }, 2);
    expect([p.width, p.height]).toEqual([2, 2]);
    expect(Array.from(p.data)).toEqual([3, 4.5, 7.5, NaN]);
  });
});

// Source: demo data — a short variant of the demo movie (the batch's own analysis of the same file is the reference).
describe('the window\'s movie analysis (a 6-frame variant of the demo movie)', () => {
  const dir = mkdtempSync(join(tmpdir(), 'eggline-movie-view-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const file = 'short.ome.tif';
  const path = join(dir, file);
  writeFileSync(path, demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 6 }));
  const doc = { ...newProject(dir), settings: { ...DEFAULT_SETTINGS, boundaryChannels: [2] } };
  const options = { axisPerTime: false, tauRangeEl: [0.1, 0.4] as const, baselineFrames: 1, timeStepS: null };

  it('gives the batch\'s tables for the file byte for byte, one frame per time point, and progress per time point', async () => {
    const done: number[] = [];
    const view = await buildMovieView(path, file, doc, options, { onTimePoint: (d) => done.push(d) });
    const batch = await analyseMovieFile(dir, file, doc.settings, doc, { ...options, selection: { kind: 'all' } });
    expect(view.tables).toEqual(movieTables(movieOutcomes([batch!.record], batch!.results).movies));
    expect(view.timeIndices).toEqual([0, 1, 2, 3, 4, 5]);
    expect(view.timesS).toEqual([0, 240, 480, 720, 960, 1200]);
    expect(view.timeSource).toBe('ome-increment');
    expect(done).toEqual([1, 2, 3, 4, 5, 6]);
    expect(view.frames.map((f) => [f!.width, f!.height, f!.scale, f!.channels.length])).toEqual(Array(6).fill([200, 120, 2, 2]));
    expect(view.lambda).toHaveLength(6);
    expect(view.kymograph!.values).toHaveLength(6);
  });


  it('analyses the time points the project names for the file (as --time A:B does in the batch), and hands over the movie\'s embryo', async () => {
    const own = { ...doc, files: { [file]: { axis: null, landmarks: [], fitRangeEl: null, time: '2:4' } } };
    const view = await buildMovieView(path, file, own, options);
    const batch = await analyseMovieFile(dir, file, doc.settings, doc, { ...options, selection: { kind: 'range', first: 2, last: 4 } });
    expect(view.timeIndices).toEqual([2, 3, 4]);
    expect(view.sizeT).toBe(6);
    expect(view.tables).toEqual(movieTables(movieOutcomes([batch!.record], batch!.results).movies));
    expect(view.detection!.mask.width).toBe(400);
    expect(view.detection!.axis).toEqual(view.results[0].axis);
    const perTime = await buildMovieView(path, file, own, { ...options, axisPerTime: true });
    expect(perTime.detection).toBeNull();
  });
});

// Source: demo data — the same 4-frame movie written without any time values (no DeltaT, no TimeIncrement).
describe('a movie whose file gives no times', () => {
  const dir = mkdtempSync(join(tmpdir(), 'eggline-movie-view-step-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const file = 'untimed.ome.tif';
  const params = { ...DEMO_MOVIE_PARAMS, frames: 4 };
  const movie = planSyntheticMovie(params, DEMO_MOVIE_SEED);
  const frames = Array.from(movie.timesS, (_, t) => movieFrame(movie, t));
  const planes = frames.flatMap((f) => f.stack.planes.map((data) => ({ width: f.stack.sizeX, height: f.stack.sizeY, data })));
  writeFileSync(join(dir, file), writeOmeTiff(planes, {
    sizeZ: movie.embryo.sizeZ, sizeC: frames[0].channelNames.length, sizeT: 4, dimensionOrder: 'XYZCT', channelNames: frames[0].channelNames,
    physicalSizeXUm: frames[0].pixelSizeUm, physicalSizeZUm: movie.embryo.zStepUm,
  }));
  const doc = { ...newProject(dir), settings: { ...DEFAULT_SETTINGS, boundaryChannels: [2] } };
  const options = { axisPerTime: false, tauRangeEl: [0.1, 0.4] as const, baselineFrames: 1, timeStepS: null };

  it('has unknown times without a time step, and the user\'s times with the file\'s own time step in the project (as --time-step)', async () => {
    const plain = await buildMovieView(join(dir, file), file, doc, options);
    expect(plain.timesS).toBeNull();
    expect(plain.timeSource).toBeNull();
    const own = { ...doc, files: { [file]: { axis: null, landmarks: [], fitRangeEl: null, timeStepS: 90 } } };
    const stepped = await buildMovieView(join(dir, file), file, own, options);
    expect(stepped.timesS).toEqual([0, 90, 180, 270]);
    expect(stepped.timeSource).toBe('user');
    const batch = await analyseMovieFile(dir, file, doc.settings, doc, { ...options, timeStepS: 90, selection: { kind: 'all' } });
    expect(stepped.tables).toEqual(movieTables(movieOutcomes([batch!.record], batch!.results).movies));
  });
});
