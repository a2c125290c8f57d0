// Benchmark of one embryo through the pipeline: a 1024×1024×24z×2ch synthetic stack (demo data) built in memory,
// then projection, detection, sampling preparation and measurement timed separately.
// Run: npx tsx core/pipeline/pipeline.bench.ts   (prints milliseconds; no assertions)
import { DEFAULT_SETTINGS } from '../settings';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo, DEFAULT_SYNTH_PARAMS } from '../synth';
import { projectStack } from '../image';
import { detectEmbryo } from '../geometry';
import { measureEmbryo, prepareSampling } from '../profile';

const ms = (t: number): string => `${(performance.now() - t).toFixed(0).padStart(6)} ms`;
const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };

let t = performance.now();
makeSyntheticEmbryo({ ...DEFAULT_SYNTH_PARAMS }, 7001);
console.log(`synth demo embryo 512×384×8z×2ch ${ms(t)}`);

t = performance.now();
const embryo = makeSyntheticEmbryo({ widthPx: 1024, heightPx: 1024, pixelSizeUm: 0.6, sizeZ: 24, zStepUm: 1, angleDeg: 33 }, 1);
console.log(`synth 1024×1024×24z×2ch         ${ms(t)}`);

for (let run = 0; run < 3; run++) {
  const t0 = performance.now();
  t = t0;
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
  console.log(`run ${run}: project ${project} | detect ${detect} | prepare ${prepare} | measure ${measure} | total ${ms(t0)}`);
}
