import { describe, expect, it } from 'vitest';
import type { ApAxis, Detection, ProjectedStack } from '../../model';
import { DEFAULT_SETTINGS, SETTINGS, settingSpec, type AnalysisSettings } from '../../settings';
import { maskContours, maskOutline } from '../../geometry';
import { binIndices } from '../bin';
import { prepareSampling } from '../prepare';
import { measureEmbryo } from '../measure';
import { sampleBandOutline } from '../band-outline';
import { AXIS_STRIP, EDGE_BAND, PROFILE_SAMPLERS, rowsWhere, samplerFor, straightViewHalfWidthPx, type ProfileSampler } from '.';

// Demo data: a 40×20 rectangle "embryo" (x 10..49, y 10..29) in a 60×40 frame, no noise, background 0 outside;
// channel 1 = 100 + x inside, channel 2 = 7 inside. The axis runs along y = 19.5 from x = 9.5 to 49.5 (40 px).
const W = 60;
const H = 40;
function scene(): { projected: ProjectedStack; detection: Detection; axis: ApAxis } {
  const mask = new Uint8Array(W * H);
  const a = new Float32Array(W * H);
  const b = new Float32Array(W * H);
  for (let y = 10; y < 30; y++) for (let x = 10; x < 50; x++) { mask[y * W + x] = 1; a[y * W + x] = 100 + x; b[y * W + x] = 7; }
  const m = { width: W, height: H, data: mask };
  const axis: ApAxis = { anterior: { x: 9.5, y: 19.5 }, posterior: { x: 49.5, y: 19.5 }, source: 'auto' };
  return {
    projected: { channels: [{ width: W, height: H, data: a }, { width: W, height: H, data: b }], channelNames: ['a', 'b'], pixelSizeUm: 1, pixelSizeSource: 'ome', projection: 'mean', sliceIndex: null, warnings: [] },
    detection: { mask: m, outline: maskOutline(m), axis, eggLengthUm: 40, eggWidthUm: 20, warnings: [] },
    axis,
  };
}
const withProfile = (profile: Partial<AnalysisSettings['profile']>, over: Partial<AnalysisSettings> = {}): AnalysisSettings => ({
  ...DEFAULT_SETTINGS, boundaryChannels: [2], background: { mode: 'none', regionPx: null }, ...over,
  profile: { ...DEFAULT_SETTINGS.profile, binCount: 10, ...profile },
});
const total = (n: Float64Array): number => n.reduce((s, v) => s + v, 0);

describe('the samplers and the settings table', () => {
  it('offer the modes the table allows, and only settings the table has', () => {
    // Source: core/settings/schema.ts (the one table of settings).
    expect(PROFILE_SAMPLERS.map((s) => s.mode)).toEqual(settingSpec('profile.mode').choices);
    for (const s of PROFILE_SAMPLERS) for (const key of s.settingKeys) expect(SETTINGS.some((row) => row.key === key)).toBe(true);
  });

  it('refuses an unknown mode with one line naming the modes there are', () => {
    expect(samplerFor('edge')).toBe(EDGE_BAND);
    expect(samplerFor('axis')).toBe(AXIS_STRIP);
    expect(() => samplerFor('ring')).toThrow('profile.mode must be "edge" or "axis" (got "ring")');
    expect(() => prepareSampling(scene().projected, scene().detection, withProfile({ mode: 'ring' as never }))).toThrow('profile.mode must be "edge" or "axis" (got "ring")');
  });

  it('describe a run in words from a run record (missing values as ?)', () => {
    const p: Record<string, unknown> = { edgeSide: 'dorsal', edgeDepthUm: 8, axisWidthUm: 30 };
    expect(EDGE_BAND.describe((k) => p[k])).toBe('edge band, dorsal side(s), 8 µm deep');
    expect(AXIS_STRIP.describe((k) => p[k])).toBe('strip along the axis, 30 µm wide');
    expect(AXIS_STRIP.describe(() => undefined)).toBe('strip along the axis, ? µm wide');
  });
});

describe('edge band sampler', () => {
  it('prepares the band of the given depth and bins it on the chosen side (hand count)', () => {
    const { projected, detection, axis } = scene();
    const s = withProfile({ edgeDepthUm: 2, edgeSide: 'dorsal', dorsalSide: 'left' });
    const prepared = prepareSampling(projected, detection, s);
    // Source: hand count: depth − 0.5 ≤ 2 keeps the outer 2 rings of the 40×20 rectangle: 800 − 36·16 = 224 pixels.
    expect(total(Float64Array.from(prepared.region.mask.data))).toBe(224);
    expect(prepared.region.pixels.xs.length).toBe(224);
    // Left of A→P (+x) is y < 19.5: rows 10, 11 (80 px) plus 2 columns at each end over rows 12..19 (32 px).
    const m = measureEmbryo(prepared, axis, s, []);
    expect(total(m.gradientProfile!.n)).toBe(80 + 32);
    expect(total(m.boundaryProfiles[0].n)).toBe(112);
    expect(sampleBandOutline(prepared, axis, s)).toHaveLength(1);
    expect(sampleBandOutline(prepareSampling(projected, detection, withProfile({ edgeDepthUm: 2 })), axis, s)).toHaveLength(1);
  });

  it('keeps the straightened rows of its side: the centre row counts as left', () => {
    // Source: the definition of stripRows (row 0 farthest left of A→P, 5 rows, centre row 2).
    const rows = (edgeSide: 'dorsal' | 'ventral' | 'both', dorsalSide: 'left' | 'right') =>
      Array.from(EDGE_BAND.stripRows(5, 1, withProfile({ edgeSide, dorsalSide })));
    expect(rows('both', 'left')).toEqual([1, 1, 1, 1, 1]);
    expect(rows('dorsal', 'left')).toEqual([1, 1, 1, 0, 0]);
    expect(rows('ventral', 'left')).toEqual([0, 0, 0, 1, 1]);
    expect(rows('dorsal', 'right')).toEqual([0, 0, 0, 1, 1]);
    expect(rows('ventral', 'right')).toEqual([1, 1, 1, 0, 0]);
  });
});

describe('axis strip sampler', () => {
  it('bins the pixels within half the width of the axis, and outlines that rectangle (hand count)', () => {
    const { projected, detection, axis } = scene();
    const s = withProfile({ mode: 'axis', axisWidthUm: 6 });
    const prepared = prepareSampling(projected, detection, s);
    expect(prepared.region.pixels.xs.length).toBe(800); // the whole mask
    // Source: hand count: |y − 19.5| ≤ 3 keeps rows 17..22 (6 rows) × 40 columns; 4 columns per bin of 10.
    const m = measureEmbryo(prepared, axis, s, []);
    expect(total(m.gradientProfile!.n)).toBe(240);
    expect(Array.from(m.gradientProfile!.n)).toEqual(new Array(10).fill(24));
    expect(Array.from(m.gradientProfile!.mean)).toEqual([111.5, 115.5, 119.5, 123.5, 127.5, 131.5, 135.5, 139.5, 143.5, 147.5]);
    expect(sampleBandOutline(prepared, axis, s)).toEqual([[{ x: 9.5, y: 16.5 }, { x: 49.5, y: 16.5 }, { x: 49.5, y: 22.5 }, { x: 9.5, y: 22.5 }]]);
  });

  it('keeps the straightened rows within half its width', () => {
    // Source: hand computation: 7 rows 2 µm apart, centre row 3; width 8 µm keeps |d| ≤ 2 rows.
    expect(Array.from(AXIS_STRIP.stripRows(7, 2, withProfile({ mode: 'axis', axisWidthUm: 8 })))).toEqual([0, 1, 1, 1, 1, 1, 0]);
    expect(Array.from(rowsWhere(4, (d) => d < 0))).toEqual([1, 1, 0, 0]); // centre 1.5: d = −1.5, −0.5, 0.5, 1.5
  });
});

describe('the straightened view', () => {
  it('is 0.6 egg widths wide on each side of the axis', () => {
    // Source: hand computation of the rule (0.6 × egg width ÷ pixel size).
    expect(straightViewHalfWidthPx(200, 2)).toBeCloseTo(60, 12);
    expect(straightViewHalfWidthPx(50, null)).toBeCloseTo(30, 12); // px when the pixel size is unknown
  });
});

// A third profile mode, defined and registered in this test only: every pixel of the mask, both sides, no width. It
// shows that a mode is one object implementing ProfileSampler: nothing else in the pipeline changes.
const WHOLE_MASK: ProfileSampler = {
  mode: 'whole',
  label: 'whole embryo',
  settingKeys: [],
  describe: () => 'every pixel of the embryo',
  prepare: (base) => ({ mask: base.mask, pixels: base.gather(base.mask.data) }),
  bins: (prepared, axis, settings) => binIndices(prepared.region.pixels.xs, prepared.region.pixels.ys, axis, settings.profile.binCount, 'all'),
  outline: (prepared) => maskContours(prepared.region.mask),
  stripRows: (rowCount) => rowsWhere(rowCount, () => true),
};

describe('a toy third sampler registered in a test', () => {
  it('runs through preparation, measurement, outline and straightened rows', () => {
    const { projected, detection, axis } = scene();
    const s = withProfile({ mode: 'whole' as never });
    const prepared = prepareSampling(projected, detection, s, [...PROFILE_SAMPLERS, WHOLE_MASK]);
    expect(prepared.sampler).toBe(WHOLE_MASK);
    const m = measureEmbryo(prepared, axis, s, [{ name: 'mid', point: { x: 29.5, y: 19.5 } }]);
    // Source: hand count: 800 mask pixels, 80 per bin (4 columns × 20 rows); channel 1 = 100 + x, so bin means step 4.
    expect(Array.from(m.gradientProfile!.n)).toEqual(new Array(10).fill(80));
    expect(m.gradientProfile!.mean[0]).toBe(111.5);
    expect(m.boundaryProfiles[0].mean.every((v) => v === 7)).toBe(true);
    expect(m.landmarks[0].xEl).toBeCloseTo(0.5, 12);
    expect(sampleBandOutline(prepared, axis, s)).toHaveLength(1);
    expect(Array.from(prepared.sampler.stripRows(3, 1, s))).toEqual([1, 1, 1]);
    // Without it in the list, the mode is refused as before.
    expect(() => prepareSampling(projected, detection, s)).toThrow('profile.mode must be "edge" or "axis" (got "whole")');
  });
});
