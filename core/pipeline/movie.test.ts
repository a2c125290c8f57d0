import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../settings';
import { planSyntheticMovie, syntheticMovieInfo, syntheticMoviePlaneSource } from '../synth';
import { detectEmbryo } from '../geometry';
import { analyseStack } from './analyse';
import { analyseMovie, axisSampleTimes, projectOverTime } from './movie';

describe('axisSampleTimes', () => {
  it('spreads the sample over the movie and ends at the last time point', () => {
    expect(axisSampleTimes(5, 8)).toEqual([0, 1, 2, 3, 4]);
    expect(axisSampleTimes(100, 4)).toEqual([25, 50, 74, 99]);
  });
});

describe('analyseMovie (demo data: a small synthetic movie)', () => {
  const movie = planSyntheticMovie({
    embryo: { widthPx: 200, heightPx: 140, pixelSizeUm: 3, sizeZ: 1 }, degradationPerS: 1 / 600,
    frameIntervalS: 300, frames: 6, framesBeforeOnset: 1,
  }, 5);
  const info = syntheticMovieInfo(movie);

  it('finds one axis for the movie and labels it automatic at every time point; a hand axis applies to all', async () => {
    const m = await analyseMovie(info, syntheticMoviePlaneSource(movie), DEFAULT_SETTINGS, { fileLabel: 'm.ome.tif', timeIndices: [0, 3, 5] });
    expect(m.results.map((r) => r.status)).toEqual(['ok', 'ok', 'ok']);
    // Each result is keyed by its time point; this synthetic StackInfo states no times, so tS is unknown (null).
    expect(m.results.map((r) => [r.tIndex, r.tS])).toEqual([[0, null], [3, null], [5, null]]);
    const timed = await analyseMovie({ ...info, time: { timesS: movie.timesS, source: 'user' } }, syntheticMoviePlaneSource(movie), DEFAULT_SETTINGS, { fileLabel: 'm.ome.tif', timeIndices: [3, 5] });
    expect(timed.results.map((r) => [r.tIndex, r.tS])).toEqual([[3, 900], [5, 1500]]);
    expect(m.results.every((r) => r.axis!.source === 'auto' && r.axis!.anterior.x === m.movieAxis!.anterior.x)).toBe(true);
    const hand = { anterior: { x: 20, y: 70 }, posterior: { x: 180, y: 70 }, source: 'hand' as const };
    const h = await analyseMovie(info, syntheticMoviePlaneSource(movie), DEFAULT_SETTINGS, { fileLabel: 'm.ome.tif', timeIndices: [1, 2], handEdits: { axis: hand, landmarks: [] } });
    expect(h.movieAxis).toEqual(hand);
    expect(h.results.map((r) => r.axis!.source)).toEqual(['hand', 'hand']);
    const each = await analyseMovie(info, syntheticMoviePlaneSource(movie), DEFAULT_SETTINGS, { fileLabel: 'm.ome.tif', timeIndices: [4, 5], axisPerTime: true });
    expect(each.movieAxis).toBeNull();
    expect(each.results.map((r) => r.status)).toEqual(['ok', 'ok']);
  });

  it('gives at every time point exactly what analysing that time point alone within the movie\'s embryo gives', async () => {
    // The movie path projects the sampled time points once and prepares what depends on the mask once
    // (samplingWithin); the results must not change by a bit (demo data; both background modes, both samplers).
    const times = [0, 1, 2, 3, 4, 5];
    for (const settings of [DEFAULT_SETTINGS, { ...DEFAULT_SETTINGS, profile: { ...DEFAULT_SETTINGS.profile, mode: 'axis' as const } },
      { ...DEFAULT_SETTINGS, background: { mode: 'none' as const, regionPx: null } }]) {
      const m = await analyseMovie(info, syntheticMoviePlaneSource(movie), settings, { fileLabel: 'm.ome.tif', timeIndices: times });
      const source = syntheticMoviePlaneSource(movie);
      const detection = detectEmbryo(await projectOverTime(info, source, settings, axisSampleTimes(info.sizeT, 8)), settings);
      for (const [k, t] of times.entries()) {
        expect(m.results[k]).toEqual(await analyseStack(info, source, { ...settings, timeIndex: t }, { fileLabel: 'm.ome.tif', detection }));
      }
    }
  });

  it('keeps to each time point\'s own hand axis and settings while the others reuse the movie\'s bins', async () => {
    // Time point 2 has its own hand axis, 3 its own fit range, 4 a one-sided band, 5 each side apart: each must equal that time point
    // analysed alone with those edits (demo data), and the time points around them the plain analysis.
    const settings = DEFAULT_SETTINGS;
    const hand = { anterior: { x: 25, y: 72 }, posterior: { x: 178, y: 66 }, source: 'hand' as const };
    const own = (t: number) => ({
      handEdits: t === 2 ? { axis: hand, landmarks: [] } : null,
      settings: t === 3 ? { ...settings, fitRangeEl: [0.15, 0.5] as const }
        : t === 4 || t === 5 ? { ...settings, profile: { ...settings.profile, edgeSide: t === 4 ? 'dorsal' as const : 'each' as const } } : settings,
    });
    const times = [0, 1, 2, 3, 4, 5];
    const m = await analyseMovie(info, syntheticMoviePlaneSource(movie), settings, { fileLabel: 'm.ome.tif', timeIndices: times, editsAt: own });
    const source = syntheticMoviePlaneSource(movie);
    const detection = detectEmbryo(await projectOverTime(info, source, settings, axisSampleTimes(info.sizeT, 8)), settings);
    for (const t of times) {
      const at = own(t);
      expect(m.results[t], `t=${t}`).toEqual(await analyseStack(info, source, { ...at.settings, timeIndex: t }, { fileLabel: 'm.ome.tif', detection, handEdits: at.handEdits }));
    }
    expect(m.results[2].axis).toEqual(hand);
  });

  it('reads each sampled time point once: the axis sample\'s projections serve their own analysis', async () => {
    const source = syntheticMoviePlaneSource(movie);
    const reads = new Map<number, number>();
    const counting = { ...source, readPlane: (z: number, c: number, t: number) => { reads.set(t, (reads.get(t) ?? 0) + 1); return source.readPlane(z, c, t); } };
    await analyseMovie(info, counting, DEFAULT_SETTINGS, { fileLabel: 'm.ome.tif', timeIndices: [0, 1, 2, 3, 4, 5] });
    expect([...reads.values()].every((n) => n === info.sizeZ * info.sizeC)).toBe(true);
    expect(reads.size).toBe(6);
  });

  it('gives every requested time point an error naming the file when a time point is outside the movie', async () => {
    const m = await analyseMovie(info, syntheticMoviePlaneSource(movie), DEFAULT_SETTINGS, { fileLabel: 'm.ome.tif', timeIndices: [2, 9] });
    expect(m.results.map((r) => r.status)).toEqual(['error', 'error']);
    expect(m.results.map((r) => r.tIndex)).toEqual([2, 9]);
    expect(m.results[0].error).toMatch(/^m\.ome\.tif: time point 9 is outside the movie \(T = 6\)/);
  });

  it('reports each analysed time point and its projection, and stops with an error naming the file when cancelled', async () => {
    const done: string[] = [];
    const sizes: number[] = [];
    const m = await analyseMovie(info, syntheticMoviePlaneSource(movie), DEFAULT_SETTINGS, {
      fileLabel: 'm.ome.tif', timeIndices: [0, 2, 4],
      onTimePoint: (d, n) => done.push(`${d}/${n}`), onProjected: (k, p) => sizes.push(k, p.channels[0].width),
    });
    expect(m.results).toHaveLength(3);
    expect(done).toEqual(['1/3', '2/3', '3/3']);
    expect(sizes).toEqual([0, 200, 1, 200, 2, 200]);
    const signal = { aborted: false };
    const run = analyseMovie(info, syntheticMoviePlaneSource(movie), DEFAULT_SETTINGS, {
      fileLabel: 'm.ome.tif', timeIndices: [0, 1, 2, 3], signal, onTimePoint: (d) => { if (d === 2) signal.aborted = true; },
    });
    await expect(run).rejects.toThrow(/^m\.ome\.tif: analysis over time cancelled$/);
  });

  it('lets a cancel from outside through while every read finishes at once (the event loop gets a turn now and then)', async () => {
    // A plane source that answers at once but takes 30 ms of work per plane, as reads and inflates done on this thread do.
    const source = syntheticMoviePlaneSource(movie);
    const busy: typeof source = {
      ...source,
      readPlane: (z, c, t, into) => { const end = Date.now() + 30; while (Date.now() < end) { /* work */ } return source.readPlane(z, c, t, into); },
    };
    const signal = { aborted: false };
    setTimeout(() => { signal.aborted = true; }, 0);
    const run = analyseMovie(info, busy, DEFAULT_SETTINGS, { fileLabel: 'm.ome.tif', timeIndices: Array.from({ length: info.sizeT }, (_, t) => t), signal });
    await expect(run).rejects.toThrow(/^m\.ome\.tif: analysis over time cancelled$/);
  });

  it('stops while the embryo is being found when cancelled then, reading no further sampled time point', async () => {
    // Demo data: the cancel arrives with the first plane read; the sampled time points after the first are never read.
    const source = syntheticMoviePlaneSource(movie);
    const signal = { aborted: false };
    const readTimes = new Set<number>();
    const watched: typeof source = { ...source, readPlane: (z, c, t, into) => { readTimes.add(t); signal.aborted = true; return source.readPlane(z, c, t, into); } };
    const run = analyseMovie(info, watched, DEFAULT_SETTINGS, { fileLabel: 'm.ome.tif', timeIndices: [0, 1, 2], signal });
    await expect(run).rejects.toThrow(/^m\.ome\.tif: analysis over time cancelled$/);
    expect(readTimes.size).toBe(1);
  });
});
