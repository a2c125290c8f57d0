import { describe, expect, it } from 'vitest';
import { createRng } from '../stats';
import type { Plane } from '../model';
import { autoBinFactor, bandReach, binMean, checkSegmentOptions, fractionalBox, segmentEmbryo, smooth121, smoothUpsampled, upsampleMask } from './segment';
import { fastGaussianSmooth } from './box-blur';
import { distanceInside, distanceOutside } from './distance';
import { makeSyntheticEmbryo } from '../synth';

describe('binMean', () => {
  it('averages f×f blocks, partial blocks at the edge over the pixels they hold', () => {
    // Source: hand computation on [[1,2,3,4,5],[6,7,8,9,10]] with f = 2: (1+2+6+7)/4, (3+4+8+9)/4, (5+10)/2.
    const p = { width: 5, height: 2, data: Float32Array.from([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]) };
    const b = binMean(p, 2);
    expect([b.width, b.height]).toEqual([3, 1]);
    expect(Array.from(b.data)).toEqual([4, 6, 7.5]);
  });
});

describe('autoBinFactor', () => {
  it('brings the long side to at most 384 px, keeping at least 64 px across', () => {
    // Source: the rule as documented in SegmentOptions.binFactor (hand computation).
    expect(autoBinFactor(384, 300)).toBe(1);
    expect(autoBinFactor(512, 384)).toBe(2);
    expect(autoBinFactor(820, 820)).toBe(3);
    expect(autoBinFactor(1024, 1024)).toBe(3);
    expect(autoBinFactor(770, 100)).toBe(1);
    expect(autoBinFactor(2000, 130)).toBe(2);
    expect(autoBinFactor(770, 5)).toBe(1);
  });
});

describe('upsampleMask', () => {
  it('puts a step half-way between the block centres', () => {
    // Source: hand computation; block centres at f·j + (f − 1)/2, bilinear value kept where ≥ 0.5.
    const small = { width: 2, height: 1, data: Uint8Array.from([1, 0]) };
    expect(Array.from(upsampleMask(small, 2, 4, 2).data)).toEqual([1, 1, 0, 0, 1, 1, 0, 0]);
    expect(Array.from(upsampleMask(small, 3, 6, 1).data)).toEqual([1, 1, 1, 0, 0, 0]);
  });
});

describe('the upsampled mask over the band\'s reach', () => {
  it('holds every band pixel, and gives inside it the values of the whole-image upsampling (random blobs; demo data)', () => {
    // Source: smoothUpsampled over the whole image (the definition); bandReach's claim checked pixel by pixel.
    const rng = createRng(21);
    let bands = 0;
    for (let trial = 0; trial < 60; trial++) {
      const sw = 3 + Math.floor(rng.uniform() * 20);
      const sh = 3 + Math.floor(rng.uniform() * 20);
      const f = 2 + Math.floor(rng.uniform() * 3);
      // A random blob: a disc or a half-plane (touching the border), or noise.
      const kind = trial % 3;
      const cx = rng.uniform() * sw; const cy = rng.uniform() * sh; const rad = 1 + rng.uniform() * sw / 2;
      const small = { width: sw, height: sh, data: Uint8Array.from({ length: sw * sh }, (_, i) => {
        const x = i % sw; const y = Math.floor(i / sw);
        return kind === 0 ? +((x - cx) ** 2 + (y - cy) ** 2 <= rad * rad) : kind === 1 ? +(x < cx) : +(rng.uniform() < 0.3);
      }) };
      const width = sw * f - Math.floor(rng.uniform() * f);
      const height = sh * f - Math.floor(rng.uniform() * f);
      const sd = smooth121(small);
      const whole = smoothUpsampled(sd, sw, sh, f, { x0: 0, y0: 0, x1: width, y1: height });
      const frac = fractionalBox(sd, sw, sh);
      const reach = frac ? bandReach(frac, f, width, height, 0) : { x0: 0, y0: 0, x1: width, y1: height };
      const part = smoothUpsampled(sd, sw, sh, f, reach);
      for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) {
        const v = whole[y * width + x];
        const inReach = x >= reach.x0 && x < reach.x1 && y >= reach.y0 && y < reach.y1;
        if (v > 0 && v < 1) { bands++; expect(inReach, `trial ${trial} (${x}, ${y})`).toBe(true); }
        if (inReach) expect(part[(y - reach.y0) * (reach.x1 - reach.x0) + x - reach.x0]).toBe(v);
      }
    }
    expect(bands).toBeGreaterThan(1000);
  });
});

describe('segmentEmbryo on large images (binned)', () => {
  // Demo data: an ellipse (centre 600,250; semi-axes 450 × 170 px) on a 1200×500 frame (600 000 px, so binned by 4),
  // background 100 ± 5, a gradient from 3000 above background anteriorly to 12 posteriorly.
  const W = 1200;
  const H = 500;
  const inside = (x: number, y: number): boolean => ((x - 600) / 450) ** 2 + ((y - 250) / 170) ** 2 <= 1;
  function channel(): Plane {
    const clean = new Float32Array(W * H);
    for (let y = 0; y < H; y++) for (let x = 0; x < W; x++) clean[y * W + x] = inside(x, y) ? 12 + 3000 * Math.exp(-(x - 150) / 90) : 0;
    const blurred = fastGaussianSmooth({ width: W, height: H, data: clean }, 1.5).data;
    const rng = createRng(11);
    return { width: W, height: H, data: Float32Array.from(blurred, (v) => 100 + v + 5 * rng.normal()) };
  }

  it('matches the ellipse and places both poles within 3 px', () => {
    const mask = segmentEmbryo([channel()]).data;
    let inter = 0;
    let union = 0;
    for (let i = 0; i < mask.length; i++) {
      const t = inside(i % W, Math.floor(i / W));
      if (t && mask[i]) inter++;
      if (t || mask[i]) union++;
    }
    expect(inter / union).toBeGreaterThan(0.98);
    // Poles at x = 150 and 1050 on row 250.
    let left = W;
    let right = -1;
    for (let x = 0; x < W; x++) if (mask[250 * W + x]) { left = Math.min(left, x); right = Math.max(right, x); }
    expect(Math.abs(left - 150)).toBeLessThanOrEqual(3);
    expect(Math.abs(right - 1050)).toBeLessThanOrEqual(3);
  });

  it('checks binFactor with an exact message', () => {
    expect(() => checkSegmentOptions({ binFactor: 1.5 })).toThrow('binFactor must be a positive integer or null, got 1.5');
  });
});

describe('segmentEmbryo binned against full resolution on mid-size frames', () => {
  // Demo data: synthetic embryos of the demo's frame size and a larger one (both binned by 2), mean projection.
  for (const [w, h, seed] of [[512, 384, 41], [700, 520, 43]] as const) {
    it(`moves the outline by at most a pixel (${w}×${h})`, () => {
      const e = makeSyntheticEmbryo({ widthPx: w, heightPx: h, sizeZ: 3, pixelSizeUm: 560 / w }, seed);
      const { sizeX, sizeY, sizeZ, sizeC, planes } = e.stack;
      const channels = Array.from({ length: sizeC }, (_, c) => {
        const data = new Float32Array(sizeX * sizeY);
        for (let z = 0; z < sizeZ; z++) { const p = planes[c * sizeZ + z]; for (let i = 0; i < data.length; i++) data[i] += p[i] / sizeZ; }
        return { width: sizeX, height: sizeY, data };
      });
      const full = segmentEmbryo(channels, { binFactor: 1 });
      const binned = segmentEmbryo(channels);
      const din = distanceInside(full);
      const dout = distanceOutside(full);
      let area = 0; let differ = 0; let worst = 0;
      for (let i = 0; i < full.data.length; i++) {
        area += full.data[i];
        if (full.data[i] === binned.data[i]) continue;
        differ++;
        worst = Math.max(worst, full.data[i] ? din[i] : dout[i]);
      }
      console.log(`${w}×${h}: ${differ} of ${area} mask pixels differ, farthest ${worst.toFixed(2)} px from the full-resolution edge`);
      expect(differ).toBeLessThan(0.002 * area);
      expect(worst).toBeLessThanOrEqual(1);
    });
  }
});
