// Micro-benchmark of the core image primitives on a demo-data plane (1024×1024 and binned to 342×342).
// Run: npx tsx bench/primitives.bench.ts   (prints warm median ms per call and ns/px, wall and CPU; no assertions)
import type { Mask, Plane } from '../core/model';
import { makeSyntheticEmbryo, warmTiming } from '../core/synth';
import { toFloatPlane } from '../core/image/plane-convert';
import { fastGaussianSmooth } from '../core/image/box-blur';
import { maxFilter } from '../core/image/max-filter';
import { dilate, erode, open, squareDilate, squareErode } from '../core/image/morphology';
import { fillHoles } from '../core/image/fill-holes';
import { largestComponent } from '../core/image/components';
import { estimateBackgroundLevel } from '../core/image/background-level';
import { distanceInside, distanceOutside } from '../core/image/distance';
import { otsuThreshold } from '../core/image/threshold';
import { binMean, segmentEmbryo } from '../core/image/segment';

const time = warmTiming;

/** Print one table of primitives for a plane and the embryo mask segmented from its stack. */
function benchPlane(label: string, plane: Plane, mask: Mask): void {
  const n = plane.width * plane.height;
  const cases: [string, () => unknown][] = [
    ['fastGaussianSmooth σ=1.5', () => fastGaussianSmooth(plane, 1.5)],
    ['fastGaussianSmooth σ=4', () => fastGaussianSmooth(plane, 4)],
    ['maxFilter r=5', () => maxFilter(plane, 5)],
    ['maxFilter r=1', () => maxFilter(plane, 1)],
    ['squareDilate r=8', () => squareDilate(mask, 8)],
    ['squareErode r=12', () => squareErode(mask, 12)],
    ['open 1.5', () => open(mask, 1.5)],
    ['dilate 3', () => dilate(mask, 3)],
    ['erode 3', () => erode(mask, 3)],
    ['fillHoles', () => fillHoles(mask)],
    ['largestComponent', () => largestComponent(mask)],
    ['estimateBackgroundLevel', () => estimateBackgroundLevel(plane.data)],
    ['otsuThreshold', () => otsuThreshold(plane.data)],
    ['distanceInside', () => distanceInside(mask)],
    ['distanceOutside', () => distanceOutside(mask)],
  ];
  console.log(`\n${label} (${plane.width}×${plane.height}, ${mask.data.reduce((s, v) => s + v, 0)} foreground px)`);
  console.log(`${'primitive'.padEnd(26)}${'wall ms'.padStart(9)}${'cpu ms'.padStart(9)}${'ns/px'.padStart(9)}`);
  for (const [name, run] of cases) {
    const { wallMs, cpuMs } = time(run);
    console.log(`${name.padEnd(26)}${wallMs.toFixed(2).padStart(9)}${cpuMs.toFixed(2).padStart(9)}${((wallMs * 1e6) / n).toFixed(1).padStart(9)}`);
  }
}

const embryo = makeSyntheticEmbryo({ widthPx: 1024, heightPx: 1024, pixelSizeUm: 0.6, sizeZ: 2, angleDeg: 33 }, 1);
const { sizeZ, planes } = embryo.stack;
const channels = [0, 1].map((c) => toFloatPlane({ width: 1024, height: 1024, data: planes[c * sizeZ] }));
const binned = channels.map((c) => binMean(c, 3));
benchPlane('demo data, channel 2, z = 0', channels[1], segmentEmbryo(channels));
benchPlane('same plane binned 3×3', binned[1], segmentEmbryo(binned));
