import { describe, expect, it } from 'vitest';
import type { ProjectedStack } from '../model';
import { DEFAULT_SETTINGS } from '../settings';
import { makeSyntheticEmbryo } from '../synth';
import { detectEmbryo, maskArea } from './detect';
import { createRng } from '../stats';

/** Mean projection of a synthetic stack (demo data), done directly. */
function projected(seed: number, angleDeg: number): { p: ProjectedStack; truth: ReturnType<typeof makeSyntheticEmbryo>['truth'] } {
  const e = makeSyntheticEmbryo({ angleDeg, sizeZ: 2, widthPx: 420, heightPx: 400 }, seed);
  const { sizeX, sizeY, sizeZ, planes } = e.stack;
  const channels = [0, 1].map((c) => {
    const d = new Float32Array(sizeX * sizeY);
    for (let z = 0; z < sizeZ; z++) planes[c * sizeZ + z].forEach((v, i) => { d[i] += v / sizeZ; });
    return { width: sizeX, height: sizeY, data: d };
  });
  return { p: { channels, channelNames: ['gradient', 'boundary'], pixelSizeUm: e.pixelSizeUm, pixelSizeSource: 'ome', projection: 'mean', sliceIndex: null, warnings: [] }, truth: e.truth };
}

describe('detectEmbryo', () => {
  it.each([17, 135, 250])('finds the poles of an embryo rotated by %i° (demo data)', (angle) => {
    const { p, truth } = projected(angle, angle);
    const d = detectEmbryo(p, DEFAULT_SETTINGS);
    const el = truth.eggLengthUm / p.pixelSizeUm!;
    expect(Math.hypot(d.axis.anterior.x - truth.anterior.x, d.axis.anterior.y - truth.anterior.y) / el).toBeLessThan(0.01);
    expect(Math.hypot(d.axis.posterior.x - truth.posterior.x, d.axis.posterior.y - truth.posterior.y) / el).toBeLessThan(0.01);
    expect(Math.abs(d.eggLengthUm / truth.eggLengthUm - 1)).toBeLessThan(0.01);
    expect(Math.abs(d.eggWidthUm / truth.eggWidthUm - 1)).toBeLessThan(0.03);
    expect(d.warnings).toEqual([]);
  });

  it('swaps the poles for anterior "low" and warns when the gradient channel is missing', () => {
    const { p, truth } = projected(3, 60);
    const low = detectEmbryo(p, { ...DEFAULT_SETTINGS, anterior: 'low' });
    expect(Math.hypot(low.axis.posterior.x - truth.anterior.x, low.axis.posterior.y - truth.anterior.y)).toBeLessThan(5);
    const uncalibrated = detectEmbryo({ ...p, pixelSizeUm: null }, DEFAULT_SETTINGS);
    expect([uncalibrated.eggLengthUm, uncalibrated.eggWidthUm]).toEqual([uncalibrated.eggLengthPx, uncalibrated.eggWidthPx]);
    const missing = detectEmbryo(p, { ...DEFAULT_SETTINGS, gradientChannel: 'marker' });
    expect(missing.warnings).toContain('the file has no channel "marker" (gradient); the anterior end was chosen arbitrarily');
  });

  it('throws a one-line message on a blank image', () => {
    const blank: ProjectedStack = { channels: [{ width: 50, height: 40, data: new Float32Array(2000).fill(100) }], channelNames: ['C1'], pixelSizeUm: 1, pixelSizeSource: 'ome', projection: 'mean', sliceIndex: null, warnings: [] };
    expect(() => detectEmbryo(blank, DEFAULT_SETTINGS)).toThrow('no embryo found: no region stands out from the background');
  });
});

describe('maskArea', () => {
  it('equals the byte-by-byte sum for any length, offset and byte values (seeded random data)', () => {
    // Source: the definition (a plain loop over the bytes), on 0/1 masks and on bytes up to 255 in long runs, so the
    // 16-bit lanes reach their largest totals; views at every byte offset 0–3.
    const rng = createRng(8);
    const buffer = new Uint8Array(4 * 2048 + 16);
    for (const fill of ['binary', 'full'] as const) {
      for (let i = 0; i < buffer.length; i++) buffer[i] = fill === 'binary' ? +(rng.uniform() < 0.5) : 255 - Math.floor(rng.uniform() * 3);
      for (const offset of [0, 1, 2, 3]) {
        for (const length of [0, 1, 3, 4, 5, 1023, 1024, 1025, 4 * 2048 + 7]) {
          const view = buffer.subarray(offset, offset + length);
          let plain = 0;
          for (const v of view) plain += v;
          expect(maskArea(view), `${fill} offset ${offset} length ${length}`).toBe(plain);
        }
      }
    }
  });
});
