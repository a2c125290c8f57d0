// Micro-benchmark of the live update on a 1024×1024 demo embryo: what one axis-handle move costs
// (core measureEmbryo on the prepared pixels + the straightened strip). Run: npx tsx bench/live-update.bench.ts
import { measureEmbryo } from '../core/pipeline';
import { DEFAULT_SETTINGS } from '../core/settings';
import { measureLive, prepareLive } from '../renderer/live';
import { SMALL_EMBRYO, syntheticStack } from '../renderer/live/syntheticStack';

const stack = syntheticStack({ ...SMALL_EMBRYO, widthPx: 1024, heightPx: 1024, pixelSizeUm: 0.6, semiMajorPx: 440, semiMinorPx: 170, seed: 5 });
const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };
const t0 = performance.now();
const prep = prepareLive(stack, settings);
const prepMs = performance.now() - t0;
const axis = stack.detection.axis;
/** Median, p90 and max (ms) of `run` over 40 drag steps; each step moves the posterior handle a little. */
function timeSteps(run: (moved: typeof axis) => unknown): string {
  const times: number[] = [];
  for (let i = 0; i < 40; i += 1) {
    const moved = { ...axis, posterior: { x: axis.posterior.x - i, y: axis.posterior.y + i / 2 }, source: 'hand' as const };
    const t = performance.now();
    run(moved);
    times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  const q = (p: number) => times[Math.min(times.length - 1, Math.floor(p * times.length))].toFixed(1);
  return `median ${q(0.5)} ms, p90 ${q(0.9)} ms, max ${q(1)} ms`;
}
const landmarks = [{ name: 'L1', point: { x: 500, y: 480 } }];
console.log(`live update on a 1024×1024 demo embryo, 2 channels (40 drag steps; times vary with machine load)`);
console.log(`  prepare (once per file/settings): ${prepMs.toFixed(0)} ms`);
console.log(`  whole live update per edit:        ${timeSteps((a) => measureLive(prep, a, settings, landmarks, [0.1, 0.6]))}`);
console.log(`  of which core measureEmbryo:       ${timeSteps((a) => measureEmbryo(prep.sampling, a, settings, landmarks))}`);
console.log(`  measureEmbryo without boundaries:  ${timeSteps((a) => measureEmbryo(prep.sampling, a, { ...settings, boundaryChannels: [] }, landmarks))}`);
