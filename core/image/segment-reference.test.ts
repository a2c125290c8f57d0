// segmentEmbryo's faster passes against a plain reference: the straightforward full-image version of each step
// (every channel filtered and scaled as a plane of its own, the edge rule on every pixel with a full maximum
// filter). Masks must agree pixel for pixel.
import { describe, expect, it } from 'vitest';
import type { Mask, Plane } from '../model';
import { createRng } from '../stats';
import { makeSyntheticEmbryo } from '../synth';
import { estimateBackgroundLevel } from './background-level';
import { fastGaussianSmooth } from './box-blur';
import { largestComponent } from './components';
import { fillHoles } from './fill-holes';
import { maxFilter } from './max-filter';
import { open, squareDilate, squareErode } from './morphology';
import { binMean, checkSegmentOptions, combinedSnr, downsample2, segmentEmbryo, type SegmentOptions } from './segment';
import { rowMaxima } from './max-filter';
import { otsuThreshold } from './threshold';

/** Reference: one channel smoothed, minus its background level, divided by its noise SD, as a Float32 plane. */
function refChannelSnr(channel: Plane, sigmaPx: number): Plane {
  const s = fastGaussianSmooth(channel, sigmaPx).data;
  const bg = estimateBackgroundLevel(s);
  const out = new Float32Array(s.length);
  for (let i = 0; i < s.length; i++) out[i] = (s[i] - bg.level) / bg.noiseSd;
  return { width: channel.width, height: channel.height, data: out };
}

/** Reference: the maximum over channels of refChannelSnr (NaN never wins). */
function refCombinedSnr(channels: readonly Plane[], sigmaPx: number): Plane {
  const { width, height } = channels[0];
  const out = new Float32Array(width * height).fill(-Infinity);
  for (const ch of channels) {
    const z = refChannelSnr(ch, sigmaPx).data;
    for (let i = 0; i < z.length; i++) if (z[i] > out[i]) out[i] = z[i];
  }
  return { width, height, data: out };
}

/** Reference coarse mask: Otsu on log SNR, kept within 4..30 noise SDs, largest region, holes filled. */
function refCoarse(channels: readonly Plane[], sigmaPx: number, factor: 1 | 2): Mask {
  const scaled = factor === 1 ? channels : channels.map(downsample2);
  const snr = refCombinedSnr(scaled, factor === 1 ? sigmaPx : sigmaPx / 2);
  const logs = Float32Array.from(snr.data, (v) => Math.log(Math.max(1, v)));
  const t = Math.min(30, Math.max(4, Math.exp(otsuThreshold(logs))));
  const small = fillHoles(largestComponent({ width: snr.width, height: snr.height, data: Uint8Array.from(snr.data, (v) => (v > t ? 1 : 0)) }));
  if (factor === 1) return small;
  const { width, height } = channels[0];
  const data = new Uint8Array(width * height);
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) data[y * width + x] = small.data[(y >> 1) * small.width + (x >> 1)];
  return { width, height, data };
}

/** Reference segmentation at full resolution: the edge rule evaluated on every pixel with a full maximum filter. */
function refSegment(channels: readonly Plane[], options: SegmentOptions): Mask {
  const o = checkSegmentOptions(options);
  const { width, height } = channels[0];
  const coarse = refCoarse(channels, o.coarseSigmaPx, o.coarseDownsample ?? (width * height > 500_000 ? 2 : 1));
  const near = squareDilate(coarse, 2 * o.coarseSigmaPx).data;
  const deep = squareErode(coarse, Math.max(2 * o.localRadiusPx, 3 * o.coarseSigmaPx)).data;
  const keep = new Uint8Array(width * height);
  for (const ch of channels) {
    const fine = refChannelSnr(ch, o.fineSigmaPx);
    const local = maxFilter(fine, o.localRadiusPx).data;
    for (let i = 0; i < keep.length; i++) if (fine.data[i] >= Math.max(3, o.edgeFraction * local[i])) keep[i] = 1;
  }
  const data = new Uint8Array(width * height);
  for (let i = 0; i < data.length; i++) data[i] = deep[i] || (near[i] && keep[i]) ? 1 : 0;
  return fillHoles(largestComponent(open(fillHoles(largestComponent({ width, height, data })), 1.5)));
}

/** The channels of a synthetic embryo's mean projection, as float planes (demo data). */
function embryoChannels(widthPx: number, heightPx: number, seed: number): Plane[] {
  const e = makeSyntheticEmbryo({ widthPx, heightPx, sizeZ: 3, pixelSizeUm: 560 / widthPx }, seed);
  const { sizeX, sizeY, sizeZ, sizeC, planes } = e.stack;
  return Array.from({ length: sizeC }, (_, c) => {
    const data = new Float32Array(sizeX * sizeY);
    for (let z = 0; z < sizeZ; z++) { const p = planes[c * sizeZ + z]; for (let i = 0; i < data.length; i++) data[i] += p[i] / sizeZ; }
    return { width: sizeX, height: sizeY, data };
  });
}

function differing(a: Uint8Array, b: Uint8Array): number {
  let n = 0;
  for (let i = 0; i < a.length; i++) n += a[i] !== b[i] ? 1 : 0;
  return n;
}

describe('segmentEmbryo against the plain full-image reference', () => {
  const cases: [string, number, number, number, SegmentOptions][] = [
    ['defaults', 300, 220, 5, {}],
    ['coarse stage on 2×2 blocks', 260, 200, 6, { coarseDownsample: 2 }],
    ['other radii and edge fraction', 240, 240, 7, { coarseSigmaPx: 3, fineSigmaPx: 2, localRadiusPx: 4, edgeFraction: 0.4 }],
    ['odd radius rounding', 280, 180, 8, { localRadiusPx: 2.5, fineSigmaPx: 1 }],
  ];
  for (const [label, w, h, seed, options] of cases) {
    it(`gives the same mask, pixel for pixel (${label}; demo data)`, () => {
      const channels = embryoChannels(w, h, seed);
      const want = refSegment(channels, options);
      const got = segmentEmbryo(channels, { ...options, binFactor: 1 });
      expect(want.data.reduce((a, v) => a + v, 0)).toBeGreaterThan(1000);
      expect(differing(got.data, want.data)).toBe(0);
    });
  }

  it('combinedSnr gives the reference values bit for bit, NaN pixels included (demo data)', () => {
    const rng = createRng(3);
    const a = { width: 37, height: 23, data: Float32Array.from({ length: 37 * 23 }, () => 100 + 20 * rng.normal()) };
    const b = { width: 37, height: 23, data: Float32Array.from({ length: 37 * 23 }, (_, i) => (i % 97 === 5 ? NaN : 50 + 300 * rng.uniform())) };
    for (const channels of [[a], [a, b], [b, a]]) {
      expect(Array.from(combinedSnr(channels, 1.7).data)).toEqual(Array.from(refCombinedSnr(channels, 1.7).data));
    }
  });
});

/** Reference: f×f block means through a float64 plane of sums, each row added into its blocks in turn. */
function refBinMean(plane: Plane, f: number): Plane {
  const { width, height, data } = plane;
  const w = Math.ceil(width / f);
  const h = Math.ceil(height / f);
  const sum = new Float64Array(w * h);
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) sum[Math.floor(y / f) * w + Math.floor(x / f)] += data[y * width + x];
  const out = new Float32Array(w * h);
  for (let by = 0; by < h; by++) {
    for (let bx = 0; bx < w; bx++) out[by * w + bx] = sum[by * w + bx] / (Math.min(f, height - by * f) * Math.min(f, width - bx * f));
  }
  return { width: w, height: h, data: out };
}

describe('binMean and the reusable buffers against plain versions', () => {
  it('binMean gives the reference block means bit for bit (f = 1..4, odd and even sizes; random data)', () => {
    const rng = createRng(9);
    for (const [w, h] of [[7, 5], [8, 6], [33, 17], [1, 3]]) {
      const p = { width: w, height: h, data: Float32Array.from({ length: w * h }, () => 1000 * rng.normal()) };
      for (const f of [1, 2, 3, 4]) expect(Array.from(binMean(p, f).data), `${w}×${h} f=${f}`).toEqual(Array.from(refBinMean(p, f).data));
    }
  });

  it('smoothing and row maxima written into a larger reused buffer equal fresh results (random data)', () => {
    const rng = createRng(10);
    const buffer = new Float32Array(40 * 30).fill(7);
    for (const [w, h] of [[31, 22], [12, 9]]) {
      const p = { width: w, height: h, data: Float32Array.from({ length: w * h }, () => rng.normal()) };
      expect(Array.from(fastGaussianSmooth(p, 1.5, buffer).data)).toEqual(Array.from(fastGaussianSmooth(p, 1.5).data));
      expect(Array.from(fastGaussianSmooth(p, 0.3, buffer).data)).toEqual(Array.from(fastGaussianSmooth(p, 0.3).data));
      expect(Array.from(rowMaxima(p, 3, buffer))).toEqual(Array.from(rowMaxima(p, 3)));
    }
  });
});
