// Micro-benchmark of live re-measurement: measureEmbryo on a 1024×1024 synthetic embryo (demo data).
// Run: npx tsx bench/measure.bench.ts   (prints milliseconds; no assertions)
import { DEFAULT_SETTINGS } from '../core/settings';
import type { AnalysisSettings } from '../core/settings';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../core/synth';
import { projectStack } from '../core/image';
import { detectEmbryo } from '../core/geometry';
import { prepareSampling } from '../core/profile/prepare';
import { measureEmbryo } from '../core/profile/measure';
import { binProfile } from '../core/profile/bin';

const embryo = makeSyntheticEmbryo({ widthPx: 1024, heightPx: 1024, pixelSizeUm: 0.6, sizeZ: 2, angleDeg: 33 }, 1);
const base = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };
const t0 = performance.now();
const projected = await projectStack(syntheticStackInfo(embryo), syntheticPlaneSource(embryo), base);
const t1 = performance.now();
const detection = detectEmbryo(projected, base);
const t2 = performance.now();

function timeMeasure(label: string, settings: AnalysisSettings): void {
  const t3 = performance.now();
  const prepared = prepareSampling(projected, detection, settings);
  const prepareMs = performance.now() - t3;
  const times: number[] = [];
  for (let i = 0; i < 30; i++) {
    // Nudge the axis each time, as dragging a handle does.
    const axis = { ...detection.axis, anterior: { x: detection.axis.anterior.x + (i % 5) * 0.7, y: detection.axis.anterior.y }, source: 'hand' as const };
    const s = performance.now();
    measureEmbryo(prepared, axis, settings, [{ name: 'furrow', point: embryo.truth.furrowPoint }]);
    times.push(performance.now() - s);
  }
  times.sort((a, b) => a - b);
  // Sampling alone (binning both channels), without the exponential and boundary fits.
  const set = prepared.region.pixels;
  const sampling: number[] = [];
  for (let i = 0; i < 30; i++) {
    const s = performance.now();
    const bins = prepared.sampler.bins(prepared, detection.axis, settings);
    for (const v of set.values) binProfile(v, bins, settings.profile.binCount, 'c', 500);
    sampling.push(performance.now() - s);
  }
  sampling.sort((a, b) => a - b);
  const band = set.xs.length;
  console.log(`${label.padEnd(22)} prepare ${prepareMs.toFixed(1).padStart(7)} ms   measure median ${times[15].toFixed(2).padStart(6)} ms   max ${times[29].toFixed(2).padStart(6)} ms   sampling only ${sampling[15].toFixed(2).padStart(5)} ms   (${band} pixels)`);
}

console.log(`1024×1024, 2 channels: project ${(t1 - t0).toFixed(0)} ms, detect ${(t2 - t1).toFixed(0)} ms`);
timeMeasure('edge, both sides', base);
timeMeasure('edge, dorsal', { ...base, profile: { ...base.profile, edgeSide: 'dorsal' } });
timeMeasure('axis strip', { ...base, profile: { ...base.profile, mode: 'axis' } });
