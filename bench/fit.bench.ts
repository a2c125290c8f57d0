// Micro-benchmark of the fits used in live re-measurement: findBoundaries ('logistic', 'half-max') and
// fitExponentialDecay on the profiles of a 1024×1024 synthetic embryo (demo data), plus clean and noisy logistic
// steps of 100 bins. Run: npx tsx bench/fit.bench.ts   (prints milliseconds per call; no assertions)
import { DEFAULT_SETTINGS } from '../core/settings';
import type { Profile } from '../core/model';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../core/synth';
import { projectStack } from '../core/image';
import { detectEmbryo } from '../core/geometry';
import { filledBins, measureEmbryo, prepareSampling } from '../core/profile';
import { createRng } from '../core/stats';
import { findBoundaries, fitExponentialDecay, fitLogisticBoundary } from '../core/fit';

/**
 * Milliseconds per call of `f` after a warm-up: the median wall time of single calls, and the mean CPU time of
 * this process per call (all its threads, so background GC and buffer freeing count too; it is not slowed by
 * other jobs waiting for the cores the way wall time is).
 */
function msPerCall(f: () => unknown, rounds = 100): { wallMs: number; cpuMs: number } {
  for (let i = 0; i < 20; i++) f();
  const times: number[] = [];
  const cpu = process.cpuUsage();
  for (let i = 0; i < rounds; i++) {
    const s = performance.now();
    f();
    times.push(performance.now() - s);
  }
  const used = process.cpuUsage(cpu);
  times.sort((a, b) => a - b);
  return { wallMs: times[Math.floor(rounds / 2)], cpuMs: (used.user + used.system) / 1000 / rounds };
}

function report(label: string, ms: { wallMs: number; cpuMs: number }): void {
  console.log(`${label.padEnd(44)} wall median ${ms.wallMs.toFixed(3).padStart(8)} ms/call   cpu ${ms.cpuMs.toFixed(3).padStart(8)} ms/call`);
}

/** Profiles of the synthetic embryo measured in each sampling mode. */
async function embryoProfiles(): Promise<{ mode: string; gradient: Profile; boundary: Profile; eggLengthUm: number }[]> {
  const embryo = makeSyntheticEmbryo({ widthPx: 1024, heightPx: 1024, pixelSizeUm: 0.6, sizeZ: 2, angleDeg: 33 }, 1);
  const base = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };
  const projected = await projectStack(syntheticStackInfo(embryo), syntheticPlaneSource(embryo), base);
  const detection = detectEmbryo(projected, base);
  return (['edge', 'axis'] as const).map((mode) => {
    const settings = { ...base, profile: { ...base.profile, mode } };
    const m = measureEmbryo(prepareSampling(projected, detection, settings), detection.axis, settings, []);
    return { mode, gradient: filledBins(m.gradientProfile!), boundary: filledBins(m.boundaryProfiles[0]), eggLengthUm: m.eggLengthUm! };
  });
}

const xEl = Float64Array.from({ length: 100 }, (_, i) => (i + 0.5) / 100);
const clean = xEl.map((x) => 20 + 100 / (1 + Math.exp((x - 0.35) / 0.03)));
const rng = createRng(7);
const noisy = clean.map((v) => v + 5 * rng.normal());
report('fitLogisticBoundary, clean 100 bins', msPerCall(() => fitLogisticBoundary(xEl, clean)));
report('fitLogisticBoundary, noisy 100 bins', msPerCall(() => fitLogisticBoundary(xEl, noisy)));
const sharp = xEl.map((x) => (x < 0.5 ? 100 : 10));
report('fitLogisticBoundary, sharp step 100 bins', msPerCall(() => fitLogisticBoundary(xEl, sharp)));
for (const p of await embryoProfiles()) {
  const fitRangeEl = DEFAULT_SETTINGS.fitRangeEl;
  report(`embryo ${p.mode}: findBoundaries logistic+half-max`,
    msPerCall(() => findBoundaries(p.boundary, ['logistic', 'half-max'], 0.5, p.eggLengthUm)));
  report(`embryo ${p.mode}: fitExponentialDecay`,
    msPerCall(() => fitExponentialDecay(p.gradient.xUm, p.gradient.mean, { eggLengthUm: p.eggLengthUm, fitRangeEl, xEl: p.gradient.xEl })));
}
