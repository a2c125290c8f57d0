import { describe, expect, it } from 'vitest';
import type { ApAxis } from '../model';
import { binIndices, binProfile, groupByBin, groupedProfile } from './bin';
import { regionMean, outsideBackground } from './background';
import { filledBins } from './measure';
import { edgeSideFilter } from './samplers';
import { DEFAULT_SETTINGS } from '../settings';

const axis: ApAxis = { anterior: { x: 0, y: 0 }, posterior: { x: 4, y: 0 }, source: 'hand' };

describe('binIndices / binProfile', () => {
  it('bins pixels by x/EL with exact mean, sample SD and n', () => {
    // Source: hand computation; x/EL = 0, .25, .5, .75 → bins [0, 0, 1, 1] of 2; means 1.5 and 4; SDs √0.5 and √2.
    const xs = Float32Array.from([0, 1, 2, 3]);
    const ys = Float32Array.from([0, 0, 0, 0]);
    const bins = binIndices(xs, ys, axis, 2, 'all');
    expect(Array.from(bins)).toEqual([0, 0, 1, 1]);
    const p = binProfile(Float32Array.from([1, 2, 3, 5]), bins, 2, 'g', 8);
    expect(Array.from(p.xEl)).toEqual([0.25, 0.75]);
    expect(Array.from(p.xUm)).toEqual([2, 6]);
    expect(Array.from(p.mean)).toEqual([1.5, 4]);
    expect(p.sd[0]).toBeCloseTo(Math.SQRT1_2, 12);
    expect(p.sd[1]).toBeCloseTo(Math.SQRT2, 12);
    expect(Array.from(p.n)).toEqual([2, 2]);
  });

  it('excludes points beyond the poles, on the wrong side or outside the strip; x/EL = 1 goes to the last bin', () => {
    const xs = Float32Array.from([-1, 4, 2, 2, 2, 5]);
    const ys = Float32Array.from([0, 0, -1, 1, -3, 0]);
    expect(Array.from(binIndices(xs, ys, axis, 4, 'all'))).toEqual([-1, 3, 2, 2, 2, -1]);
    expect(Array.from(binIndices(xs, ys, axis, 4, 'left'))).toEqual([-1, -1, 2, -1, 2, -1]); // y < 0 is left of +x
    expect(Array.from(binIndices(xs, ys, axis, 4, 'right'))).toEqual([-1, -1, -1, 2, -1, -1]);
    expect(Array.from(binIndices(xs, ys, axis, 4, 'all', 2))).toEqual([-1, 3, 2, 2, -1, -1]);
  });

  it('leaves empty bins NaN with n 0, and filledBins drops them; µm NaN without an egg length', () => {
    const p = binProfile(Float32Array.from([7]), Int32Array.from([2]), 3, 'g', null);
    expect(Array.from(p.n)).toEqual([0, 0, 1]);
    expect(Number.isNaN(p.mean[0]) && Number.isNaN(p.xUm[2])).toBe(true);
    expect(p.sd[2]).toBe(0);
    const f = filledBins(p);
    expect(Array.from(f.mean)).toEqual([7]);
    expect(Array.from(f.xEl)).toEqual([2.5 / 3]);
  });
});

/** Reference binning: one pass over the pixels in order adding each to its bin, then one for the squared deviations. */
function scatterProfile(values: Float32Array, bins: Int32Array, binCount: number): { mean: number[]; sd: number[]; n: number[] } {
  // Source: from memory, the two-pass sample mean and SD (n − 1) of a statistics text.
  const sum = new Float64Array(binCount);
  const n = new Float64Array(binCount);
  for (let k = 0; k < bins.length; k++) if (bins[k] >= 0) { sum[bins[k]] += values[k]; n[bins[k]]++; }
  const mean = Array.from(sum, (s, b) => (n[b] > 0 ? s / n[b] : NaN));
  const ss = new Float64Array(binCount);
  for (let k = 0; k < bins.length; k++) if (bins[k] >= 0) { const d = values[k] - mean[bins[k]]; ss[bins[k]] += d * d; }
  return { mean, sd: Array.from(ss, (v, b) => (n[b] > 1 ? Math.sqrt(v / (n[b] - 1)) : n[b] === 1 ? 0 : NaN)), n: Array.from(n) };
}

describe('groupByBin / groupedProfile', () => {
  it('groups pixels by bin in ascending order, leaving out unbinned ones (hand count)', () => {
    // Source: hand count: bins [2, −1, 0, 2, 0] of 3 → bin 0: pixels 2, 4; bin 1: none; bin 2: pixels 0, 3.
    const g = groupByBin(Int32Array.from([2, -1, 0, 2, 0]), 3);
    expect(Array.from(g.order)).toEqual([2, 4, 0, 3]);
    expect(Array.from(g.start)).toEqual([0, 2, 2, 4]);
  });

  it('gives bit for bit the profile of one pass over the pixels in order, on seeded data with empty and unbinned pixels', () => {
    // Demo data: seeded values with a wide range (so the order of the additions shows in the last bits).
    let seed = 12345;
    const rnd = (): number => { seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0; return seed / 4294967296; };
    for (const count of [1, 7, 5000]) {
      const binCount = 37;
      const bins = Int32Array.from({ length: count }, () => (rnd() < 0.2 ? -1 : Math.floor(rnd() * (binCount - 3))));
      const values = Float32Array.from({ length: count }, () => (rnd() - 0.2) * 10 ** Math.floor(rnd() * 6));
      const ref = scatterProfile(values, bins, binCount);
      const p = groupedProfile(values, groupByBin(bins, binCount), 'g', 100);
      expect(Array.from(p.mean)).toEqual(ref.mean);
      expect(Array.from(p.sd)).toEqual(ref.sd);
      expect(Array.from(p.n)).toEqual(ref.n);
      expect(binProfile(values, bins, binCount, 'g', 100)).toEqual(p);
    }
  });
});

describe('edgeSideFilter', () => {
  it('maps edge side and dorsal side to the left/right of A→P', () => {
    // Source: the definitions (dorsalSide names the side of A→P that is dorsal; edgeSide the one sampled).
    const s = (edgeSide: 'dorsal' | 'ventral' | 'both', dorsalSide: 'left' | 'right') =>
      edgeSideFilter({ ...DEFAULT_SETTINGS, profile: { ...DEFAULT_SETTINGS.profile, edgeSide, dorsalSide } });
    expect([s('dorsal', 'left'), s('ventral', 'left'), s('dorsal', 'right'), s('ventral', 'right'), s('both', 'left')])
      .toEqual(['left', 'right', 'right', 'left', 'all']);
  });
});

describe('background', () => {
  it('averages a rectangle clipped to the image', () => {
    // Source: hand computation on a 3×2 plane [[1,2,3],[4,5,6]].
    const plane = { width: 3, height: 2, data: Float32Array.from([1, 2, 3, 4, 5, 6]) };
    expect(regionMean(plane, { x: 1, y: 0, width: 5, height: 5 })).toBe(4);
    expect(Number.isNaN(regionMean(plane, { x: 5, y: 5, width: 2, height: 2 }))).toBe(true);
  });

  it('takes the median of pixels beyond the margin around the mask', () => {
    // Demo data: 12×12 plane, value = 1000 on a 2×2 mask at the centre, 10 + (i mod 3) elsewhere.
    const w = 12;
    const data = Float32Array.from({ length: w * w }, (_, i) => 10 + (i % 3));
    const m = new Uint8Array(w * w);
    for (const i of [5 * w + 5, 5 * w + 6, 6 * w + 5, 6 * w + 6]) { data[i] = 1000; m[i] = 1; }
    const bg = outsideBackground({ width: w, height: w, data }, { width: w, height: w, data: m }, 2);
    expect(bg).toEqual({ value: 11, warning: null });
  });

  it('gives the same value from the decoded 8/16-bit samples (rawPlanes) as from their floats, and the floats when raw does not fit', async () => {
    const { estimateBackgrounds, farPixels } = await import('./background');
    // Demo data: seeded 40×30 planes, a noisy background with bright pixels and ties around an elliptic mask; odd and
    // even counts of far pixels come from the two margins.
    let s = 7;
    const rnd = () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s / 4294967296; };
    const w = 40, h = 30;
    const mask = { width: w, height: h, data: Uint8Array.from({ length: w * h }, (_, i) => +(((i % w) - 20) ** 2 / 100 + (Math.floor(i / w) - 15) ** 2 / 36 < 1)) };
    const u16 = Uint16Array.from({ length: w * h }, () => (rnd() < 0.1 ? 60_000 : 100 + Math.floor(rnd() * 9)));
    const u8 = Uint8Array.from(u16, (v) => v & 0xff);
    const raws = [{ width: w, height: h, data: u16 }, { width: w, height: h, data: u8 }];
    const planes = raws.map((r) => ({ width: w, height: h, data: Float32Array.from(r.data) }));
    const settings = { mode: 'outside' as const, regionPx: null };
    for (const margin of [2, 3]) {
      const far = farPixels(mask, margin);
      const fromFloats = estimateBackgrounds(planes, ['a', 'b'], mask, settings, margin, far);
      expect(estimateBackgrounds(planes, ['a', 'b'], mask, settings, margin, far, raws)).toEqual(fromFloats);
      expect(estimateBackgrounds(planes, ['a', 'b'], mask, settings, margin)).toEqual(fromFloats);
    }
    // A raw plane of another length or type is not counted: the floats decide.
    const shifted = planes.map((p) => ({ ...p, data: p.data.map((v) => v + 0.5) }));
    const far = farPixels(mask, 2);
    const wrong = [{ width: w, height: h, data: u16.subarray(1) }, { width: w, height: h, data: Float32Array.from(u8) }];
    expect(estimateBackgrounds(shifted, ['a', 'b'], mask, settings, 2, far, wrong)).toEqual(estimateBackgrounds(shifted, ['a', 'b'], mask, settings, 2, far));
  });
});

describe('estimateBackgrounds and setting checks', () => {
  it('subtracts a region mean, nothing, or warns for a missing region', async () => {
    const { estimateBackgrounds } = await import('./background');
    const plane = { width: 3, height: 2, data: Float32Array.from([1, 2, 3, 4, 5, 6]) };
    const mask = { width: 3, height: 2, data: new Uint8Array(6) };
    const region = estimateBackgrounds([plane], ['a'], mask, { mode: 'region', regionPx: { x: 0, y: 0, width: 2, height: 1 } }, 1);
    expect(region).toEqual({ backgrounds: [{ channel: 'a', method: 'region', value: 1.5 }], warnings: [] });
    expect(estimateBackgrounds([plane], ['a'], mask, { mode: 'none', regionPx: null }, 1).backgrounds[0]).toEqual({ channel: 'a', method: 'none', value: 0 });
    expect(estimateBackgrounds([plane], ['a'], mask, { mode: 'region', regionPx: null }, 1).warnings).toEqual(['background region is missing or lies outside the image; no background was subtracted']);
  });

  it('rejects bad sampling settings with the settings table\'s rules and words', async () => {
    const { checkSamplingSettings } = await import('./check-settings');
    const { settingSpec } = await import('../settings');
    const withProfile = (p: object) => ({ ...DEFAULT_SETTINGS, profile: { ...DEFAULT_SETTINGS.profile, ...p } });
    expect(() => checkSamplingSettings(withProfile({ binCount: 0 }))).toThrow(`profile.binCount must be ${settingSpec('profile.binCount').rule} (got 0)`);
    expect(() => checkSamplingSettings(withProfile({ binCount: 0 }))).toThrow('profile.binCount must be a whole number from 10 to 2000 (got 0)');
    expect(() => checkSamplingSettings(withProfile({ edgeDepthUm: -1 }))).toThrow('profile.edgeDepthUm must be a positive number of µm (got -1)');
    expect(() => checkSamplingSettings(withProfile({ axisWidthUm: NaN }))).toThrow('profile.axisWidthUm must be a positive number of µm (got NaN)');
    expect(() => checkSamplingSettings({ ...DEFAULT_SETTINGS, background: { mode: 'far', regionPx: null } } as never))
      .toThrow('background.mode must be "outside", "region" or "none" (got "far")');
    expect(() => checkSamplingSettings(DEFAULT_SETTINGS)).not.toThrow();
  });
});
