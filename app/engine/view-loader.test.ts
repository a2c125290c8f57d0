// Source: demo data — a 6-frame variant of the demo movie, and the same movie as plain pages. The reference is the
// batch's own time pass over the same file (app/batch/timelapse-pass.ts, the code behind `eggline batch --time K`).
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { PlaneSource } from '../../core/model';
import { axisSampleTimes } from '../../core/pipeline';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { DEMO_MOVIE_PARAMS, planSyntheticMovie, syntheticMovieInfo, syntheticMoviePlaneSource } from '../../core/synth';
import { analyseMovieFile } from '../batch/timelapse-pass';
import { demoMovieFile, demoMoviePlainPages } from '../batch/write-demo';
import { createViewLoader, embryoOverTime } from './view-loader';

const dir = mkdtempSync(join(tmpdir(), 'eggline-view-loader-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };
const batchOptions = { selection: { kind: 'one' as const, index: 3 }, axisPerTime: false, timeStepS: null, tauRangeEl: [0.1, 0.4] as const, baselineFrames: 1 };

describe('the Embryo view\'s stack at a time point of a movie', () => {
  const file = 'short.ome.tif';
  const path = join(dir, file);
  writeFileSync(path, demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 6 }));

  it('is shown in the embryo the batch finds once over time (its axis at --time 3), kept for the next time point', async () => {
    const load = createViewLoader();
    const at3 = await load(path, file, { ...settings, timeIndex: 3 }, { timeStepS: null, axisPerTime: false });
    const batch = await analyseMovieFile(dir, file, settings, null, batchOptions);
    expect(batch!.results).toHaveLength(1);
    expect(at3.detection.axis).toEqual({ ...batch!.results[0].axis, source: 'auto' });
    expect(at3.info.sizeT).toBe(6);
    const at4 = await load(path, file, { ...settings, timeIndex: 4 }, { timeStepS: null, axisPerTime: false });
    expect(at4.detection.axis).toEqual(at3.detection.axis);
    expect(Buffer.from(at4.detection.mask.data).equals(Buffer.from(at3.detection.mask.data))).toBe(true);
    // Another time point's own picture.
    expect(at4.projected.channels[0].data).not.toEqual(at3.projected.channels[0].data);
    // The time point alone (no time options, or the axis found at every time point) finds its own embryo.
    const alone = await load(path, file, { ...settings, timeIndex: 3 });
    const perTime = await load(path, file, { ...settings, timeIndex: 3 }, { timeStepS: null, axisPerTime: true });
    expect(perTime.detection.axis).toEqual(alone.detection.axis);
    expect(alone.detection.axis).not.toEqual(at3.detection.axis);
  });

  it('stops with a message naming the file once its signal is aborted', async () => {
    const load = createViewLoader();
    await expect(load(path, file, settings, { timeStepS: null, axisPerTime: false }, { aborted: true }))
      .rejects.toThrow('short.ome.tif: loading cancelled (another view was asked for)');
  });
});

describe('a stale load of a movie\'s embryo over time', () => {
  // Demo data: a small synthetic movie of 10 frames read from memory (every plane answers at once). Time point 4 is
  // not among the 8 the embryo is found on, so its planes are read only when that time point itself is analysed.
  const movie = planSyntheticMovie({
    embryo: { widthPx: 160, heightPx: 100, pixelSizeUm: 4, sizeZ: 1 }, degradationPerS: 1 / 600, frameIntervalS: 300, frames: 10, framesBeforeOnset: 1,
  }, 3);
  const info = syntheticMovieInfo(movie);
  /** The movie's planes, counting the reads of time point 4 and aborting `signal` at the `abortAtRead`-th read. */
  const counted = (signal: { aborted: boolean }, abortAtRead: number | null): { source: PlaneSource; readsOfT4: () => number } => {
    const inner = syntheticMoviePlaneSource(movie);
    let reads = 0;
    let readsOfT4 = 0;
    const source: PlaneSource = {
      readPlane: (z, c, t, into) => {
        reads += 1;
        if (t === 4) readsOfT4 += 1;
        if (reads === abortAtRead) signal.aborted = true;
        return inner.readPlane(z, c, t, into);
      },
      close: () => inner.close(),
    };
    return { source, readsOfT4: () => readsOfT4 };
  };

  it('stops before the shown time point is analysed once aborted mid-run, and rejects with the view\'s cancel error', async () => {
    expect(axisSampleTimes(10, 8)).not.toContain(4);
    const settings4 = { ...DEFAULT_SETTINGS, timeIndex: 4 };
    // Not aborted: the embryo is found and time point 4's planes are read for its projection.
    const calm = counted({ aborted: false }, null);
    const found = await embryoOverTime(info, calm.source, settings4, 'm.ome.tif', null, { aborted: false });
    expect(found.found).toBe(true);
    expect(calm.readsOfT4()).toBe(info.sizeZ * info.sizeC);
    // Aborted at the third plane read while the embryo is being found: time point 4 is never read, and the load
    // rejects with the view's own message, not the movie analysis's.
    const signal = { aborted: false };
    const stale = counted(signal, 3);
    await expect(embryoOverTime(info, stale.source, settings4, 'm.ome.tif', null, signal))
      .rejects.toThrow(/^m\.ome\.tif: loading cancelled \(another view was asked for\)$/);
    expect(signal.aborted).toBe(true);
    expect(stale.readsOfT4()).toBe(0);
  });
});

describe('a plain multi-page file', () => {
  const file = 'pages.tif';
  const path = join(dir, file);
  writeFileSync(path, demoMoviePlainPages({ ...DEMO_MOVIE_PARAMS, frames: 5 }));

  it('is one Z stack without a time step, and frames with the user\'s times with one (as --time-step)', async () => {
    const load = createViewLoader();
    const asZ = await load(path, file, settings, { timeStepS: null, axisPerTime: false });
    expect([asZ.info.sizeZ, asZ.info.sizeT]).toEqual([5, 1]);
    const frames = await load(path, file, { ...settings, timeIndex: 2 }, { timeStepS: 60, axisPerTime: false });
    expect([frames.info.sizeZ, frames.info.sizeT]).toEqual([1, 5]);
    expect(frames.info.time).toEqual({ timesS: Float64Array.of(0, 60, 120, 180, 240), source: 'user' });
    const batch = await analyseMovieFile(dir, file, settings, null, { ...batchOptions, selection: { kind: 'one', index: 2 }, timeStepS: 60 });
    expect(batch!.results.map((r) => [r.status, r.tIndex, r.tS])).toEqual([['ok', 2, 120]]);
    expect(frames.detection.axis).toEqual({ ...batch!.results[0].axis, source: 'auto' });
  });
});
