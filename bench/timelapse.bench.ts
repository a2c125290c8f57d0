// Benchmark of the time analysis (demo data): a synthetic movie of 2-channel 1024×1024 frames (one slice) written as
// an uncompressed OME-TIFF into a temporary folder, then
//   - the read floor: every plane of each time point read (with the projection's read-ahead) and nothing else;
//   - the movie as `eggline batch` analyses it (core/pipeline analyseMovie: embryo found once on 8 sampled time points,
//     then every time point projected, given its own background, sampled and fitted within that embryo);
//   - the same steps called one by one for the first 50 time points, each step's CPU time apart (projection into
//     reused arrays, background and sampled values, binning, fits and boundaries);
//   - for comparison, the first time points analysed one by one as single stacks within the same embryo
//     (analyseStack with the detection), which re-prepares the sampling at every time point.
// Wall and CPU time of this process (all threads): on a shared machine CPU time is the steadier figure.
// Run: npx tsx bench/timelapse.bench.ts [frames, default 200]   (prints; no assertions)
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openStack } from '../app/batch/deps';
import { readAhead } from '../core/image';
import { analyseMovie, analyseStack, axisSampleTimes, detectEmbryo, projectOverTime } from '../core/pipeline';
import { projectStack } from '../core/image';
import { fitSampledProfiles, sampleProfiles, samplingWithin } from '../core/profile';
import { DEFAULT_SETTINGS } from '../core/settings';
import { movieFrame, planSyntheticMovie } from '../core/synth';
import { writeOmeTiff } from '../core/tiff';

const frames = Number(process.argv[2] ?? 200);
const SINGLE_STACK_FRAMES = Math.min(frames, 20);
const STEP_FRAMES = Math.min(frames, 50);
const dir = mkdtempSync(join(tmpdir(), 'eggline-movie-bench-'));
const path = join(dir, 'movie.ome.tif');

/** Wall and CPU milliseconds of `run`. */
async function timed<T>(run: () => Promise<T>): Promise<{ value: T; wallMs: number; cpuMs: number }> {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = await run();
  const c = process.cpuUsage(c0);
  return { value, wallMs: performance.now() - t0, cpuMs: (c.user + c.system) / 1000 };
}

const median = (v: number[]): number => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];
const ms = (v: number): string => `${v.toFixed(1)} ms`;

try {
  const written = await timed(async () => {
    const movie = planSyntheticMovie({
      embryo: { widthPx: 1024, heightPx: 1024, pixelSizeUm: 0.6, sizeZ: 1, angleDeg: 33 },
      degradationPerS: 1 / 1200, frameIntervalS: 10800 / frames, frames, framesBeforeOnset: 1,
    }, 3);
    const planes = [];
    for (let f = 0; f < frames; f++) planes.push(...movieFrame(movie, f).stack.planes.map((data) => ({ width: 1024, height: 1024, data })));
    writeFileSync(path, writeOmeTiff(planes, { sizeZ: 1, sizeC: 2, sizeT: frames, dimensionOrder: 'XYZCT', channelNames: ['gradient', 'boundary'], physicalSizeXUm: 0.6, timeIncrementS: 10800 / frames }));
  });
  console.log(`wrote ${frames} frames × 2 channels × 1024² uint16 (uncompressed, ${(frames * 4).toFixed(0)} MiB) in ${(written.wallMs / 1000).toFixed(1)} s`);
  const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };
  const { info, source } = await openStack(path, 'movie.ome.tif');

  // The read floor of each time point, as the projection reads it (z outer, channel inner, one plane ahead).
  const floorWall: number[] = [];
  const floorCpu: number[] = [];
  for (let t = 0; t < frames; t++) {
    const order: { z: number; c: number }[] = [];
    for (let z = 0; z < info.sizeZ; z++) for (let c = 0; c < info.sizeC; c++) order.push({ z, c });
    const r = await timed(() => readAhead(order.length, (i) => source.readPlane(order[i].z, order[i].c, t), () => undefined));
    floorWall.push(r.wallMs);
    floorCpu.push(r.cpuMs);
  }

  const once = await timed(async () => detectEmbryo(await projectOverTime(info, source, settings, axisSampleTimes(info.sizeT, 8)), settings));
  const detection = once.value;
  const movie = await timed(() => analyseMovie(info, source, settings, { fileLabel: 'movie.ome.tif', timeIndices: Array.from({ length: frames }, (_, t) => t) }));
  const failed = movie.value.results.filter((r) => r.status !== 'ok').length;
  // The movie path's steps one by one (as analyseMovie runs them after the embryo is found), CPU time of each.
  const stepCpu = { read: 0, project: 0, background: 0, bins: 0, fits: 0 };
  const prepare = samplingWithin(detection);
  const buffers = Array.from({ length: info.sizeC }, () => new Float32Array(info.sizeX * info.sizeY));
  // The first preparation makes what depends on the mask alone (once per movie, not per time point).
  prepare(await projectStack(info, source, settings, null, buffers), settings);
  const cpuMs = (): number => { const c = process.cpuUsage(); return (c.user + c.system) / 1000; };
  for (let t = 0; t < STEP_FRAMES; t++) {
    const at = { ...settings, timeIndex: t };
    let c0 = cpuMs();
    await readAhead(info.sizeC, (c) => source.readPlane(0, c, t), () => undefined);
    let c1 = cpuMs(); stepCpu.read += c1 - c0; c0 = c1;
    const projected = await projectStack(info, source, at, null, buffers);
    c1 = cpuMs(); stepCpu.project += c1 - c0; c0 = c1;
    const prepared = prepare(projected, at);
    c1 = cpuMs(); stepCpu.background += c1 - c0; c0 = c1;
    const sampled = sampleProfiles(prepared, detection.axis, at);
    c1 = cpuMs(); stepCpu.bins += c1 - c0; c0 = c1;
    fitSampledProfiles(sampled, prepared, at, []);
    c1 = cpuMs(); stepCpu.fits += c1 - c0;
  }
  const single = await timed(async () => {
    for (let t = 0; t < SINGLE_STACK_FRAMES; t++) await analyseStack(info, source, { ...settings, timeIndex: t }, { fileLabel: 'movie', detection });
  });
  await source.close();

  const perWall = (movie.wallMs - once.wallMs) / frames;
  const perCpu = (movie.cpuMs - once.cpuMs) / frames;
  const mean = (v: number[]): number => v.reduce((a, b) => a + b, 0) / v.length;
  console.log(`read floor per time point (median of ${frames}): ${ms(median(floorWall))} wall, ${ms(median(floorCpu))} CPU (mean ${ms(mean(floorWall))} wall, ${ms(mean(floorCpu))} CPU; the movie's figures below are means)`);
  console.log(`embryo and axis found once on 8 sampled time points: ${ms(once.wallMs)} wall, ${ms(once.cpuMs)} CPU`);
  console.log(`whole movie (analyseMovie, as the batch runs it): ${(movie.wallMs / 1000).toFixed(2)} s wall, ${(movie.cpuMs / 1000).toFixed(2)} s CPU${failed ? ` — ${failed} time points failed` : ''}`);
  console.log(`  per time point after the embryo is found: ${ms(perWall)} wall, ${ms(perCpu)} CPU = ${(perWall / median(floorWall)).toFixed(1)}× the read floor in wall time, ${(perCpu / median(floorCpu)).toFixed(1)}× in CPU time (aim ≤ 1.5×; ${(perCpu / mean(floorCpu)).toFixed(1)}× the mean floor's CPU time)`);
  const step = (v: number): string => ms(v / STEP_FRAMES);
  console.log(`  its steps one by one, mean CPU per time point (first ${STEP_FRAMES}): planes read alone ${step(stepCpu.read)}; projection (read again + conversion) ${step(stepCpu.project)}; background medians + sampled values ${step(stepCpu.background)}; binning ${step(stepCpu.bins)}; fits and boundaries ${step(stepCpu.fits)}`);
  console.log(`first ${SINGLE_STACK_FRAMES} time points as single stacks in the same embryo (sampling prepared at each): ${ms(single.wallMs / SINGLE_STACK_FRAMES)} wall, ${ms(single.cpuMs / SINGLE_STACK_FRAMES)} CPU per time point`);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
