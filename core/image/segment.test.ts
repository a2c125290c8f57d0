import { describe, expect, it } from 'vitest';
import { createRng } from '../stats';
import type { Plane } from '../model';
import { gaussianSmooth } from './gaussian';
import { checkSegmentOptions, segmentEmbryo } from './segment';
import { estimateBackgroundLevel } from './background-level';
import { resolveChannel } from './channel-ref';

// Demo data: an ellipse (centre 80,50; semi-axes 60 × 25 px) on a 160×100 frame, background 100 ± 5 (read noise).
const W = 160;
const H = 100;
const insideEllipse = (x: number, y: number): boolean => ((x - 80) / 60) ** 2 + ((y - 50) / 25) ** 2 <= 1;

function channel(signal: (x: number) => number, seed: number): Plane {
  const clean = new Float32Array(W * H);
  for (let y = 0; y < H; y++) for (let x = 0; x < W; x++) clean[y * W + x] = insideEllipse(x, y) ? signal(x) : 0;
  const blurred = gaussianSmooth({ width: W, height: H, data: clean }, 1).data;
  const rng = createRng(seed);
  return { width: W, height: H, data: Float32Array.from(blurred, (v) => 100 + v + 5 * rng.normal()) };
}

function overlap(mask: Uint8Array): { iou: number } {
  let inter = 0;
  let union = 0;
  for (let i = 0; i < mask.length; i++) {
    const t = insideEllipse(i % W, Math.floor(i / W));
    if (t && mask[i]) inter++;
    if (t || mask[i]) union++;
  }
  return { iou: inter / union };
}

describe('segmentEmbryo', () => {
  it('finds the whole embryo when the gradient channel is dim posteriorly (background + small autofluorescence)', () => {
    // Anterior (x = 20) at 3000 above background, posterior at 12 (2.4 noise SDs) of autofluorescence.
    const gradient = channel((x) => 12 + 3000 * Math.exp(-(x - 20) / 12), 1);
    const mask = segmentEmbryo([gradient]);
    expect(overlap(mask.data).iou).toBeGreaterThan(0.95);
    expect(mask.data[50 * W + 137]).toBe(1); // 3 px inside the posterior pole
    expect(mask.data[50 * W + 144]).toBe(0); // 4 px beyond it
    expect(mask.data[50 * W + 23]).toBe(1);
    expect(mask.data[50 * W + 16]).toBe(0); // the bright anterior does not spill outwards
  });

  it('gives nearly the same mask with the coarse stage on 2×2-averaged images', () => {
    const gradient = channel((x) => 12 + 3000 * Math.exp(-(x - 20) / 12), 1);
    const full = segmentEmbryo([gradient], { coarseDownsample: 1 }).data;
    const half = segmentEmbryo([gradient], { coarseDownsample: 2 }).data;
    expect(overlap(half).iou).toBeGreaterThan(0.95);
    let differ = 0;
    for (let i = 0; i < full.length; i++) differ += full[i] !== half[i] ? 1 : 0;
    expect(differ).toBeLessThan(0.01 * full.length);
  });

  it('averages 2×2 blocks when downsampling', async () => {
    const { downsample2 } = await import('./segment');
    // Source: hand computation on a 3×2 plane [[1,2,3],[5,6,7]]: blocks (1,2,5,6) → 3.5 and (3,3,7,7) → 5.
    expect(Array.from(downsample2({ width: 3, height: 2, data: Float32Array.from([1, 2, 3, 5, 6, 7]) }).data)).toEqual([3.5, 5]);
  });

  it('is not cut by an expression boundary inside a second channel', () => {
    const gradient = channel((x) => 15 + 800 * Math.exp(-(x - 20) / 30), 2);
    const boundary = channel((x) => 15 + (x < 70 ? 2000 : 0), 3);
    expect(overlap(segmentEmbryo([gradient, boundary]).data).iou).toBeGreaterThan(0.95);
  });

  it('checks its options with exact messages', () => {
    expect(() => checkSegmentOptions({ fineSigmaPx: 0 })).toThrow('fineSigmaPx must be a positive number, got 0');
    expect(() => checkSegmentOptions({ edgeFraction: 1 })).toThrow('edgeFraction must be between 0 and 1, got 1');
    expect(() => segmentEmbryo([])).toThrow('segmentEmbryo needs at least one channel');
    expect(() => checkSegmentOptions({ coarseDownsample: 3 as never })).toThrow('coarseDownsample must be 1, 2 or null, got 3');
  });
});

describe('estimateBackgroundLevel', () => {
  it('recovers level and noise of the background peak beside a bright object', () => {
    // Demo data: 80% normal(100, 5), 20% at 500 ± 5; seeded.
    const rng = createRng(9);
    const v = Float32Array.from({ length: 50_000 }, (_, i) => (i % 5 === 0 ? 500 : 100) + 5 * rng.normal());
    const bg = estimateBackgroundLevel(v);
    expect(Math.abs(bg.level - 100)).toBeLessThan(1);
    expect(Math.abs(bg.noiseSd - 5)).toBeLessThan(0.5);
  });
});

describe('resolveChannel', () => {
  it('resolves 1-based numbers and names, null when absent', () => {
    const names = ['gradient', 'Boundary'];
    expect(resolveChannel(2, names)).toBe(1);
    expect(resolveChannel('boundary', names)).toBe(1);
    expect(resolveChannel('1', names)).toBe(0);
    expect(resolveChannel(3, names)).toBeNull();
    expect(resolveChannel('marker', names)).toBeNull();
  });
});
