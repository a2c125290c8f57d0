// Benchmark of one embryo through the pipeline: a 1024×1024×24z×2ch synthetic stack (demo data) built in memory,
// then projection, detection, sampling preparation and measurement timed separately.
// Run: npx tsx bench/pipeline.bench.ts   (prints milliseconds; no assertions)
import { DEFAULT_SETTINGS } from '../core/settings';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo, DEFAULT_SYNTH_PARAMS } from '../core/synth';
import { projectStack } from '../core/image';
import { detectEmbryo } from '../core/geometry';
import { measureEmbryo, prepareSampling } from '../core/profile';

let cpu = process.cpuUsage();
/** Wall and CPU milliseconds since t (CPU of this process since the previous call): the machine may be shared. */
const ms = (t: number): string => {
  const u = process.cpuUsage(cpu);
  cpu = process.cpuUsage();
  return `${(performance.now() - t).toFixed(0).padStart(5)} ms (cpu ${((u.user + u.system) / 1000).toFixed(0).padStart(5)})`;
};
const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };

let t = performance.now();
cpu = process.cpuUsage();
makeSyntheticEmbryo({ ...DEFAULT_SYNTH_PARAMS }, 7001);
console.log(`synth demo embryo 512×384×8z×2ch ${ms(t)}`);

t = performance.now();
cpu = process.cpuUsage();
const embryo = makeSyntheticEmbryo({ widthPx: 1024, heightPx: 1024, pixelSizeUm: 0.6, sizeZ: 24, zStepUm: 1, angleDeg: 33 }, 1);
console.log(`synth 1024×1024×24z×2ch         ${ms(t)}`);

for (let run = 0; run < 6; run++) {
  const t0 = performance.now();
  t = t0;
  cpu = process.cpuUsage();
  const projected = await projectStack(syntheticStackInfo(embryo), syntheticPlaneSource(embryo), settings);
  const project = ms(t);
  t = performance.now();
  const detection = detectEmbryo(projected, settings);
  const detect = ms(t);
  t = performance.now();
  const prepared = prepareSampling(projected, detection, settings);
  const prepare = ms(t);
  t = performance.now();
  measureEmbryo(prepared, detection.axis, settings, []);
  const measure = ms(t);
  console.log(`run ${run}: project ${project} | detect ${detect} | prepare ${prepare} | measure ${measure} | total ${(performance.now() - t0).toFixed(0)} ms`);
}
