import { describe, expect, it } from 'vitest';
import type { Detection, ProjectedStack } from '../model';
import { DEFAULT_SETTINGS } from '../settings';
import type { AnalysisSettings } from '../settings';
import { createRng } from '../stats';
import { maskOutline } from '../geometry';
import { prepareSampling } from './prepare';
import { boundaryWindowOf, measureEmbryo } from './measure';
import { sampleBandOutline } from './band-outline';

// Demo data: a 200×80 rectangle "embryo" (x 20..219, y 20..99) in a 240×120 frame, background 100 ± 2;
// channel 1 = 50 + 1000·exp(−x/λ) with λ = 40 px along x, channel 2 = 500 for x/EL < 0.3 else 0.
const W = 240;
const H = 120;
function scene(pixelSizeUm: number | null): { projected: ProjectedStack; detection: Detection } {
  const rng = createRng(4);
  const mask = new Uint8Array(W * H);
  const g = new Float32Array(W * H);
  const b = new Float32Array(W * H);
  for (let y = 0; y < H; y++) for (let x = 0; x < W; x++) {
    const i = y * W + x;
    const inside = x >= 20 && x < 220 && y >= 20 && y < 100;
    mask[i] = inside ? 1 : 0;
    const xPx = x - 19.5;
    g[i] = 100 + 2 * rng.normal() + (inside ? 50 + 1000 * Math.exp(-xPx / 40) : 0);
    b[i] = 100 + 2 * rng.normal() + (inside && xPx / 200 < 0.3 ? 500 : 0);
  }
  const m = { width: W, height: H, data: mask };
  return {
    projected: { channels: [{ width: W, height: H, data: g }, { width: W, height: H, data: b }], channelNames: ['grad', 'bnd'], pixelSizeUm, pixelSizeSource: pixelSizeUm ? 'ome' : 'unknown', projection: 'mean', sliceIndex: null, warnings: [] },
    detection: { mask: m, outline: maskOutline(m), axis: { anterior: { x: 19.5, y: 59.5 }, posterior: { x: 219.5, y: 59.5 }, source: 'auto' }, eggLengthUm: 200, eggWidthUm: 80, warnings: [] },
  };
}
const settings = (over: Partial<AnalysisSettings> = {}, profile: Partial<AnalysisSettings['profile']> = {}): AnalysisSettings => ({
  ...DEFAULT_SETTINGS, boundaryChannels: [2], binCount: undefined, ...over, profile: { ...DEFAULT_SETTINGS.profile, edgeDepthUm: 5, binCount: 50, ...profile },
} as AnalysisSettings);

describe('measureEmbryo', () => {
  it('recovers λ, the boundary, the background and landmark positions (demo data)', () => {
    const { projected, detection } = scene(2);
    const s = settings();
    const prepared = prepareSampling(projected, detection, s);
    const m = measureEmbryo(prepared, detection.axis, s, [{ name: 'mark', point: { x: 69.5, y: 30 } }]);
    expect(m.gradientChannel).toBe('grad');
    expect(m.eggLengthUm).toBe(400);
    expect(m.backgrounds.map((b) => Math.round(b.value))).toEqual([100, 100]);
    expect(Math.abs(m.gradientFit!.lambdaUm / 80 - 1)).toBeLessThan(0.02); // 40 px × 2 µm/px
    const logistic = m.boundaries.find((b) => b.method === 'logistic')!;
    expect(Math.abs(logistic.positionEl! - 0.3)).toBeLessThan(0.01);
    expect(m.landmarks[0].xEl).toBeCloseTo(0.25, 12);
    expect(m.landmarks[0].offAxisUm).toBeCloseTo(59, 12); // 29.5 px up (left of +x) × 2 µm
    expect(m.warnings).toEqual([]);
  });

  it('searches boundaries only inside the boundary window (demo data)', () => {
    const { projected, detection } = scene(2);
    // The stripe ends at 0.3 x/EL: a window of 0.4–1 holds no edge, 0.2–0.5 finds it as before.
    const inside = settings({ boundarySearchEl: [0.2, 0.5] });
    const m = measureEmbryo(prepareSampling(projected, detection, inside), detection.axis, inside, []);
    expect(Math.abs(m.boundaries.find((b) => b.method === 'logistic')!.positionEl! - 0.3)).toBeLessThan(0.01);
    const beyond = settings({ boundarySearchEl: [0.4, 1] });
    const half = measureEmbryo(prepareSampling(projected, detection, beyond), detection.axis, beyond, []).boundaries.find((b) => b.method === 'half-max')!;
    expect(half.positionEl === null || half.positionEl >= 0.4).toBe(true);
  });

  it('a channel\'s own window overrides the shared one, by number or by name (demo data)', () => {
    const { projected, detection } = scene(2);
    const halfMax = (s: AnalysisSettings) => measureEmbryo(prepareSampling(projected, detection, s), detection.axis, s, []).boundaries.find((b) => b.method === 'half-max')!;
    // Shared window 0.4–1 misses the edge at 0.3; the channel's own 0.2–0.5 (by number, then by name) finds it.
    for (const channel of [2, 'bnd']) {
      const own = settings({ boundarySearchEl: [0.4, 1], boundaryWindows: [{ channel, rangeEl: [0.2, 0.5] }] });
      expect(Math.abs(halfMax(own).positionEl! - 0.3)).toBeLessThan(0.01);
    }
    // A window for another channel leaves this one on the shared window.
    const other = settings({ boundarySearchEl: [0.4, 1], boundaryWindows: [{ channel: 1, rangeEl: [0.2, 0.5] }] });
    const half = halfMax(other);
    expect(half.positionEl === null || half.positionEl >= 0.4).toBe(true);
    expect(boundaryWindowOf(1, ['grad', 'bnd'], other)).toEqual([0.4, 1]);
    expect(boundaryWindowOf(0, ['grad', 'bnd'], other)).toEqual([0.2, 0.5]);
  });

  it('warns when a pole lies outside the embryo, with the distance and the egg length it gives (demo data)', () => {
    const { projected, detection } = scene(2);
    const s = settings();
    const prepared = prepareSampling(projected, detection, s);
    // The posterior pole dragged to x = 249.5, 30.5 px from the last mask pixel centre (x = 219): 61 µm outside; the
    // axis from x 19.5 to 249.5 is 230 px = 460 µm.
    const off = { ...detection.axis, posterior: { x: 249.5, y: 59.5 }, source: 'hand' as const };
    const m = measureEmbryo(prepared, off, s, []);
    expect(m.warnings).toEqual(['the posterior pole lies 61 µm outside the embryo outline, so the egg length (460 µm, pole to pole) is too long; move the pole onto the embryo\'s end']);
    // Within the slack (2 px + 2% of the axis) the pole counts as on the embryo.
    const near = { ...detection.axis, posterior: { x: 222.5, y: 59.5 }, source: 'hand' as const };
    expect(measureEmbryo(prepared, near, s, []).warnings).toEqual([]);
  });

  it('samples only the chosen side and the axis strip', () => {
    const { projected, detection } = scene(1);
    const n = (s: AnalysisSettings) => measureEmbryo(prepareSampling(projected, detection, s), detection.axis, s, []).gradientProfile!.n.reduce((a, v) => a + v, 0);
    const both = n(settings({}, { edgeSide: 'both' }));
    const dorsal = n(settings({}, { edgeSide: 'dorsal' }));
    // Source: hand count: rows 20..24 (depth ≤ 5 px) × 200 columns, plus the 5 columns at each pole for rows 25..59.
    expect(dorsal).toBe(200 * 5 + 2 * 5 * 35);
    expect(both).toBe(2 * dorsal);
    expect(n(settings({}, { mode: 'axis', axisWidthUm: 10 }))).toBe(200 * 10); // rows 55..64 (|y − 59.5| ≤ 5)
  });

  it('warns instead of failing for missing channels, a failed fit and an unknown pixel size', () => {
    const { projected, detection } = scene(null);
    const s = settings({ gradientChannel: 'grad', boundaryChannels: [3], fitRangeEl: [0.5, 0.52] });
    const m = measureEmbryo(prepareSampling(projected, detection, s), detection.axis, s, []);
    expect(m.gradientFit).toBeNull();
    expect(m.warnings.some((w) => w.startsWith('exponential fit of grad failed'))).toBe(true);
    expect(m.warnings).toContain('the file has no channel 3 (boundary); it was skipped');
    expect(m.warnings).toContain('pixel size unknown: edge depth, strip width and background margin are taken as pixels');
    expect(m.eggLengthUm).toBeNull();
    const missing = measureEmbryo(prepareSampling(projected, detection, s), detection.axis, { ...s, gradientChannel: 7 }, []);
    expect(missing.gradientProfile).toBeNull();
    expect(missing.warnings).toContain('the file has no channel 7 (gradient); it was skipped');
  });

  it('reports λ in EL but NaN µm when the pixel size is unknown', () => {
    const { projected, detection } = scene(null);
    const s = settings();
    const m = measureEmbryo(prepareSampling(projected, detection, s), detection.axis, s, []);
    expect(Math.abs(m.gradientFit!.lambdaEl / 0.2 - 1)).toBeLessThan(0.02);
    expect(Number.isNaN(m.gradientFit!.lambdaUm)).toBe(true);
  });
});

describe('sampleBandOutline', () => {
  it('draws the axis strip as a rectangle and the edge band as contours', () => {
    const { projected, detection } = scene(1);
    const axisStrip = settings({}, { mode: 'axis', axisWidthUm: 10 });
    const strip = sampleBandOutline(prepareSampling(projected, detection, axisStrip), detection.axis, axisStrip);
    expect(strip).toEqual([[{ x: 19.5, y: 54.5 }, { x: 219.5, y: 54.5 }, { x: 219.5, y: 64.5 }, { x: 19.5, y: 64.5 }]]);
    const band = sampleBandOutline(prepareSampling(projected, detection, settings()), detection.axis, settings());
    expect(band).toHaveLength(2); // outer and inner ring
    const dorsalBand = settings({}, { edgeSide: 'dorsal' });
    const dorsal = sampleBandOutline(prepareSampling(projected, detection, dorsalBand), detection.axis, dorsalBand);
    expect(dorsal).toHaveLength(1);
  });
});
