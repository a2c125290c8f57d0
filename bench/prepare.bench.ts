// Micro-benchmark of sampling preparation and its parts on one 1024×1024×24z×2ch demo-data embryo (built in memory,
// projected and detected once), plus the detection steps that share its primitives.
// Run: npx tsx bench/prepare.bench.ts   (prints warm median ms per call, wall and CPU; no assertions)
import { DEFAULT_SETTINGS } from '../core/settings';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo, warmTiming } from '../core/synth';
import { distanceInside, estimateBackgroundLevel, medianInPlace, projectStack, squareDilate } from '../core/image';
import { detectEmbryo, endMeans, principalAxis } from '../core/geometry';
import { estimateBackgrounds } from '../core/profile/background';
import { farFromMask, outsideBackgroundFar } from '../core/profile/background';
import { prepareSampling } from '../core/profile/prepare';

/** Warm median wall and CPU ms of one call (a longer budget than the default: these calls are slower). */
const time = (run: () => unknown): { wallMs: number; cpuMs: number } => warmTiming(run, 600);

const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };
const embryo = makeSyntheticEmbryo({ widthPx: 1024, heightPx: 1024, pixelSizeUm: 0.6, sizeZ: 24, zStepUm: 1, angleDeg: 33 }, 1);
const projected = await projectStack(syntheticStackInfo(embryo), syntheticPlaneSource(embryo), settings);
const detection = detectEmbryo(projected, settings);
const mask = detection.mask;
const marginPx = Math.max(5, 10 / (projected.pixelSizeUm ?? 1));
const far = farFromMask(mask, marginPx);
const outside = projected.channels[0].data.filter((_, i) => far[i] === 1);
let area = 0;
for (let i = 0; i < mask.data.length; i++) area += mask.data[i];

const cases: [string, () => unknown][] = [
  ['prepareSampling', () => prepareSampling(projected, detection, settings)],
  ['  distanceInside', () => distanceInside(mask)],
  ['  estimateBackgrounds (2 ch)', () => estimateBackgrounds(projected.channels, projected.channelNames, mask, settings.background, marginPx)],
  ['    squareDilate (margin)', () => squareDilate(mask, marginPx)],
  ['    farFromMask', () => farFromMask(mask, marginPx)],
  ['    outsideBackgroundFar (1 ch)', () => outsideBackgroundFar(projected.channels[0], far)],
  ['    medianInPlace (outside px)', () => medianInPlace(outside.slice())],
  ['    copy of the outside px', () => outside.slice()],
  ['  band + pixel set (prepare − dist − bg)', () => null],
  ['prepareSampling, axis strip (whole mask)', () => prepareSampling(projected, detection, { ...settings, profile: { ...settings.profile, mode: 'axis' } })],
  ['estimateBackgroundLevel (1 ch)', () => estimateBackgroundLevel(projected.channels[0].data)],
  ['endMeans', () => endMeans(projected.channels[0], mask, detection.axis.anterior, detection.axis.posterior)],
  ['principalAxis', () => principalAxis(mask)],
];
console.log(`demo data 1024×1024, ${area} mask px, ${outside.length} outside px (margin ${marginPx.toFixed(1)} px)`);
console.log(`${'step'.padEnd(42)}${'wall ms'.padStart(9)}${'cpu ms'.padStart(9)}`);
const results = new Map<string, { wallMs: number; cpuMs: number }>();
for (const [name, run] of cases) results.set(name, time(run));
const whole = results.get('prepareSampling') as { wallMs: number };
const parts = ['  distanceInside', '  estimateBackgrounds (2 ch)'].map((k) => (results.get(k) as { wallMs: number }).wallMs);
results.set('  band + pixel set (prepare − dist − bg)', { wallMs: whole.wallMs - parts[0] - parts[1], cpuMs: NaN });
for (const [name] of cases) {
  const r = results.get(name) as { wallMs: number; cpuMs: number };
  console.log(`${name.padEnd(42)}${r.wallMs.toFixed(2).padStart(9)}${(Number.isNaN(r.cpuMs) ? '' : r.cpuMs.toFixed(2)).padStart(9)}`);
}
