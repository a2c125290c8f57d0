// Benchmark of the time analysis (demo data): a synthetic movie of 2-channel 1024×1024 frames written as an
// uncompressed OME-TIFF, then per time point the decode-only floor (every plane of that time point, read ahead as the
// projection reads) against the whole analysis of that time point within the movie's embryo, found once.
// Run: npx tsx bench/timelapse.bench.ts [frames, default 50]   (prints milliseconds and ratios; no assertions)
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openStack } from '../app/batch/deps';
import { readAhead } from '../core/image';
import { analyseStack, detectEmbryo, projectOverTime, axisSampleTimes } from '../core/pipeline';
import { DEFAULT_SETTINGS } from '../core/settings';
import { movieFrame, planSyntheticMovie } from '../core/synth';
import { writeOmeTiff } from '../core/tiff';

const frames = Number(process.argv[2] ?? 50);
const dir = mkdtempSync(join(tmpdir(), 'eggline-movie-bench-'));
const path = join(dir, 'movie.ome.tif');
let t = performance.now();
const movie = planSyntheticMovie({
  embryo: { widthPx: 1024, heightPx: 1024, pixelSizeUm: 0.6, sizeZ: 1, angleDeg: 33 },
  degradationPerS: 1 / 1200, frameIntervalS: 10800 / frames, frames, framesBeforeOnset: 1,
}, 3);
const planes = [];
for (let f = 0; f < frames; f++) planes.push(...movieFrame(movie, f).stack.planes.map((data) => ({ width: 1024, height: 1024, data })));
writeFileSync(path, writeOmeTiff(planes, { sizeZ: 1, sizeC: 2, sizeT: frames, dimensionOrder: 'XYZCT', channelNames: ['gradient', 'boundary'], physicalSizeXUm: 0.6, timeIncrementS: 10800 / frames }));
planes.length = 0;
console.log(`wrote ${frames} frames × 2 channels × 1024² (uncompressed) in ${(performance.now() - t).toFixed(0)} ms`);

const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };
const { info, source } = await openStack(path, 'movie.ome.tif');
t = performance.now();
const detection = detectEmbryo(await projectOverTime(info, source, settings, axisSampleTimes(info.sizeT, 8)), settings);
console.log(`embryo and axis once, on 8 sampled time points: ${(performance.now() - t).toFixed(0)} ms`);

// Wall and CPU time of this process: the machine may be shared, and CPU time is then the steadier measure.
const cpuMs = (u: NodeJS.CpuUsage): number => (u.user + u.system) / 1000;
const decode: number[] = [], whole: number[] = [], decodeCpu: number[] = [], wholeCpu: number[] = [];
for (let f = 0; f < frames; f++) {
  t = performance.now();
  let c = process.cpuUsage();
  const order = [0, 1].map((ch) => ({ z: 0, c: ch }));
  await readAhead(order.length, (i) => source.readPlane(order[i].z, order[i].c, f), () => undefined);
  decode.push(performance.now() - t);
  decodeCpu.push(cpuMs(process.cpuUsage(c)));
  t = performance.now();
  c = process.cpuUsage();
  await analyseStack(info, source, { ...settings, timeIndex: f }, { fileLabel: 'movie', detection });
  whole.push(performance.now() - t);
  wholeCpu.push(cpuMs(process.cpuUsage(c)));
}
await source.close();
rmSync(dir, { recursive: true, force: true });
const median = (v: number[]): number => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];
// The first frames are slower while V8 compiles the analysis; the median is the steady cost.
console.log(`per time point, median of ${frames}: decode ${median(decode).toFixed(1)} ms (cpu ${median(decodeCpu).toFixed(1)}), whole analysis ${median(whole).toFixed(1)} ms (cpu ${median(wholeCpu).toFixed(1)}), ratio ${(median(whole) / median(decode)).toFixed(2)}× (cpu ${(median(wholeCpu) / median(decodeCpu)).toFixed(2)}×)`);
console.log(`whole movie: decode ${(decode.reduce((a, b) => a + b, 0) / 1000).toFixed(1)} s, analysis ${(whole.reduce((a, b) => a + b, 0) / 1000).toFixed(1)} s`);
