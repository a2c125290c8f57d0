// Benchmark of the time analysis (demo data): a synthetic movie of 2-channel 1024×1024 frames (one slice) written
// twice into a temporary folder, as an uncompressed and as a Deflate-compressed OME-TIFF (frame by frame, so the bench
// holds one frame at a time), then for each file:
//   - the read floor: every plane of each time point read (with the projection's read-ahead) and nothing else, into
//     new arrays (as a single stack is read) and into arrays reused at every time point (as the movie path reads;
//     the lower of the two, and the one the movie is measured against), in two passes over the file: the second,
//     like the movie run after it, reads a file read before, and is the floor the ratios use;
//   - the movie as `eggline batch` analyses it (core/pipeline analyseMovie: embryo found once on 8 sampled time points,
//     then every time point projected, given its own background, sampled and fitted within that embryo), each time
//     point timed apart through the progress calls: median and mean against the floor's median and mean;
//   - the same steps called one by one for the first 50 time points, each step's CPU time apart (planes read into
//     reused arrays, projection with its read, background and sampled values, binning, fits and boundaries);
//   - for comparison (uncompressed file only), the first time points analysed one by one as single stacks within the
//     same embryo (analyseStack with the detection), which re-prepares the sampling at every time point.
// Wall and CPU time of this process (all threads, so Deflate's inflating on libuv's pool counts): on a shared machine
// CPU time is the steadier figure. Peak memory (maximum resident set size) at the end.
// Run: npx tsx bench/timelapse.bench.ts [frames, default 200]   (prints; no assertions)
import { closeSync, mkdtempSync, openSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openStack } from '../app/batch/deps';
import { projectStack, readAhead, reusedPlaneArrays } from '../core/image';
import type { PixelArray, PlaneSource, StackInfo } from '../core/model';
import { analyseMovie, analyseStack, axisSampleTimes, detectEmbryo, projectOverTime } from '../core/pipeline';
import { fitSampledProfiles, sampleProfiles, samplingWithin } from '../core/profile';
import { DEFAULT_SETTINGS } from '../core/settings';
import { movieFrame, planSyntheticMovie } from '../core/synth';
import { writeOmeTiffPieces } from '../core/tiff';

const frames = Number(process.argv[2] ?? 200);
const SINGLE_STACK_FRAMES = Math.min(frames, 20);
const STEP_FRAMES = Math.min(frames, 50);
const SIZE = 1024;
const dir = mkdtempSync(join(tmpdir(), 'eggline-movie-bench-'));

/** Wall and CPU milliseconds of `run`. */
async function timed<T>(run: () => Promise<T>): Promise<{ value: T; wallMs: number; cpuMs: number }> {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = await run();
  const c = process.cpuUsage(c0);
  return { value, wallMs: performance.now() - t0, cpuMs: (c.user + c.system) / 1000 };
}

const median = (v: number[]): number => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];
const mean = (v: number[]): number => v.reduce((a, b) => a + b, 0) / v.length;
const ms = (v: number): string => `${v.toFixed(1)} ms`;
const cpuMs = (): number => { const c = process.cpuUsage(); return (c.user + c.system) / 1000; };

/** Writes the movie frame by frame (two planes, gradient and boundary channel, per frame). */
function writeMovie(path: string, compression: 'none' | 'deflate'): void {
  const movie = planSyntheticMovie({
    embryo: { widthPx: SIZE, heightPx: SIZE, pixelSizeUm: 0.6, sizeZ: 1, angleDeg: 33 },
    degradationPerS: 1 / 1200, frameIntervalS: 10800 / frames, frames, framesBeforeOnset: 1,
  }, 3);
  let frame: { f: number; planes: readonly PixelArray[] } | null = null;
  const planeAt = (n: number) => {
    const f = Math.floor(n / 2);
    if (frame?.f !== f) frame = { f, planes: movieFrame(movie, f).stack.planes };
    return { width: SIZE, height: SIZE, data: frame.planes[n % 2] };
  };
  const fd = openSync(path, 'w');
  try {
    writeOmeTiffPieces(2 * frames, planeAt, {
      sizeZ: 1, sizeC: 2, sizeT: frames, dimensionOrder: 'XYZCT', channelNames: ['gradient', 'boundary'], physicalSizeXUm: 0.6,
      timeIncrementS: 10800 / frames, compression,
    }, (bytes, position) => { writeSync(fd, bytes, 0, bytes.length, position); });
  } finally {
    closeSync(fd);
  }
}

/** Reads every plane of time point t with the projection's read-ahead (z outer, channel inner), into `arrays` when given. */
function readTimePoint(info: StackInfo, source: PlaneSource, t: number, arrays: ReturnType<typeof reusedPlaneArrays> | null): Promise<void> {
  const order: { z: number; c: number }[] = [];
  for (let z = 0; z < info.sizeZ; z++) for (let c = 0; c < info.sizeC; c++) order.push({ z, c });
  const into = (i: number) => arrays?.at(info.sizeZ === 1 ? order[i].c : i % 2, info.sampleType, info.sizeX * info.sizeY);
  return readAhead(order.length, (i) => source.readPlane(order[i].z, order[i].c, t, into(i)), () => undefined);
}

/** All figures of one file. */
async function measure(label: string, path: string, singleStacks: boolean): Promise<void> {
  const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };
  const { info, source } = await openStack(path, label);
  // The read floor, new arrays and reused arrays alternating per time point (the machine's speed drifts), in two
  // passes over the movie: the first reads the file just written (its pages may have left the cache, and the code is
  // not yet compiled), the second is the like-for-like floor of the movie run, which reads a file it has read before.
  const arrays = reusedPlaneArrays();
  const floorPass = async () => {
    const fresh = { wall: [] as number[], cpu: [] as number[] };
    const reused = { wall: [] as number[], cpu: [] as number[] };
    for (let t = 0; t < frames; t++) {
      const order = t % 2 === 0 ? [reused, fresh] : [fresh, reused];
      for (const into of order) {
        const r = await timed(() => readTimePoint(info, source, t, into === reused ? arrays : null));
        into.wall.push(r.wallMs);
        into.cpu.push(r.cpuMs);
      }
    }
    return { fresh, reused };
  };
  const firstPass = await floorPass();
  const { fresh, reused } = await floorPass();

  const once = await timed(async () => detectEmbryo(await projectOverTime(info, source, settings, axisSampleTimes(info.sizeT, 8)), settings));
  const detection = once.value;
  // The movie, with each time point's own CPU and wall time from the progress calls (the first from the moment the
  // embryo is found), for a median per time point beside the mean.
  const marks: { cpu: number; wall: number }[] = [];
  const mark = () => { marks.push({ cpu: cpuMs(), wall: performance.now() }); };
  const movie = await timed(() => analyseMovie(info, source, settings, { fileLabel: label, timeIndices: Array.from({ length: frames }, (_, t) => t), onDetection: mark, onTimePoint: mark }));
  // The first time point also prepares what depends on the mask alone (once per movie), so it is reported apart.
  const allCpu = marks.slice(1).map((m, k) => m.cpu - marks[k].cpu);
  const allWall = marks.slice(1).map((m, k) => m.wall - marks[k].wall);
  const tpCpu = allCpu.slice(1);
  const tpWall = allWall.slice(1);
  const failed = movie.value.results.filter((r) => r.status !== 'ok').length;

  // The movie path's steps one by one (as analyseMovie runs them after the embryo is found), CPU time of each.
  const stepCpu = { read: 0, project: 0, background: 0, bins: 0, fits: 0 };
  const prepare = samplingWithin(detection);
  const buffers = Array.from({ length: info.sizeC }, () => new Float32Array(info.sizeX * info.sizeY));
  const planeArrays = reusedPlaneArrays();
  // The first preparation makes what depends on the mask alone (once per movie, not per time point).
  prepare(await projectStack(info, source, settings, null, buffers, planeArrays), settings);
  for (let t = 0; t < STEP_FRAMES; t++) {
    const at = { ...settings, timeIndex: t };
    let c0 = cpuMs();
    await readTimePoint(info, source, t, arrays);
    let c1 = cpuMs(); stepCpu.read += c1 - c0; c0 = c1;
    const projected = await projectStack(info, source, at, null, buffers, planeArrays);
    c1 = cpuMs(); stepCpu.project += c1 - c0; c0 = c1;
    const prepared = prepare(projected, at);
    c1 = cpuMs(); stepCpu.background += c1 - c0; c0 = c1;
    const sampled = sampleProfiles(prepared, detection.axis, at);
    c1 = cpuMs(); stepCpu.bins += c1 - c0; c0 = c1;
    fitSampledProfiles(sampled, prepared, at, []);
    c1 = cpuMs(); stepCpu.fits += c1 - c0;
  }
  const single = singleStacks ? await timed(async () => {
    for (let t = 0; t < SINGLE_STACK_FRAMES; t++) await analyseStack(info, source, { ...settings, timeIndex: t }, { fileLabel: label, detection });
  }) : null;
  await source.close();

  const perWall = (movie.wallMs - once.wallMs) / frames;
  const perCpu = (movie.cpuMs - once.cpuMs) / frames;
  const floor = { median: median(reused.cpu), mean: mean(reused.cpu), wallMedian: median(reused.wall), wallMean: mean(reused.wall) };
  console.log(`\n${label}:`);
  console.log(`  read floor per time point, first pass over the file just written, into reused arrays: median ${ms(median(firstPass.reused.cpu))} CPU, mean ${ms(mean(firstPass.reused.cpu))} CPU (${ms(mean(firstPass.reused.wall))} wall); into new arrays: median ${ms(median(firstPass.fresh.cpu))}, mean ${ms(mean(firstPass.fresh.cpu))} CPU`);
  console.log(`  read floor per time point, second pass (the floor used below), planes into reused arrays (${frames} time points): median ${ms(floor.median)} CPU, ${ms(floor.wallMedian)} wall; mean ${ms(floor.mean)} CPU, ${ms(floor.wallMean)} wall`);
  console.log(`  read floor per time point, second pass, planes into new arrays: median ${ms(median(fresh.cpu))} CPU, ${ms(median(fresh.wall))} wall; mean ${ms(mean(fresh.cpu))} CPU, ${ms(mean(fresh.wall))} wall`);
  console.log(`  embryo and axis found once on 8 sampled time points: ${ms(once.wallMs)} wall, ${ms(once.cpuMs)} CPU`);
  console.log(`  whole movie (analyseMovie, as the batch runs it): ${(movie.wallMs / 1000).toFixed(2)} s wall, ${(movie.cpuMs / 1000).toFixed(2)} s CPU${failed ? ` — ${failed} time points failed` : ''}`);
  console.log(`  first time point, with the once-per-movie preparation of the sampling (edge band, far pixels): ${ms(allCpu[0])} CPU, ${ms(allWall[0])} wall`);
  console.log(`  every later time point, timed one by one: median ${ms(median(tpCpu))} CPU = ${(median(tpCpu) / floor.median).toFixed(2)}× the floor's median (aim ≤ 1.5×); mean ${ms(mean(tpCpu))} CPU = ${(mean(tpCpu) / floor.mean).toFixed(2)}× the floor's mean; wall median ${ms(median(tpWall))} = ${(median(tpWall) / floor.wallMedian).toFixed(2)}× the floor's, mean ${ms(mean(tpWall))} = ${(mean(tpWall) / floor.wallMean).toFixed(2)}×`);
  console.log(`  per time point from the whole movie less a separate embryo search (mean): ${ms(perWall)} wall, ${ms(perCpu)} CPU = ${(perCpu / floor.mean).toFixed(2)}× the floor's mean CPU`);
  const step = (v: number): string => ms(v / STEP_FRAMES);
  console.log(`  its steps one by one, mean CPU per time point (first ${STEP_FRAMES}): planes read alone ${step(stepCpu.read)}; projection (read again + conversion) ${step(stepCpu.project)}; background medians + sampled values ${step(stepCpu.background)}; binning ${step(stepCpu.bins)}; fits and boundaries ${step(stepCpu.fits)}`);
  if (single) console.log(`  first ${SINGLE_STACK_FRAMES} time points as single stacks in the same embryo (sampling prepared at each): ${ms(single.wallMs / SINGLE_STACK_FRAMES)} wall, ${ms(single.cpuMs / SINGLE_STACK_FRAMES)} CPU per time point`);
}

try {
  const files = [
    { label: 'uncompressed', path: join(dir, 'movie.ome.tif'), compression: 'none' as const },
    { label: 'Deflate', path: join(dir, 'movie-deflate.ome.tif'), compression: 'deflate' as const },
  ];
  for (const f of files) {
    const written = await timed(async () => writeMovie(f.path, f.compression));
    console.log(`wrote ${frames} frames × 2 channels × ${SIZE}² uint16 (${f.label}) in ${(written.wallMs / 1000).toFixed(1)} s`);
  }
  for (const f of files) await measure(f.label, f.path, f.compression === 'none');
  console.log(`\npeak memory (maximum resident set size): ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MiB`);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
