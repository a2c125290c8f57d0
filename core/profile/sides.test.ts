// Each side of the edge band measured on its own (--edge-side each): hand counts on a drawn rectangle, and an embryo
// from the project's generator painted with a different λ on each side (demo data).
import { describe, expect, it } from 'vitest';
import type { Detection, ProjectedStack } from '../model';
import { analyseStack } from '../pipeline';
import { DEFAULT_SETTINGS, type AnalysisSettings } from '../settings';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../synth';
import { maskOutline } from '../geometry';
import { prepareSampling } from './prepare';
import { fitProfile, fitProfileWeighted, measureEmbryo } from './measure';
import { sampleBandOutline } from './band-outline';
import { sideWithDepthTerm, withDepthTerm } from './sides';
import type { DecayLengthDifference, ExponentialFit } from '../model';

// Demo data: a 200×80 rectangle "embryo" (x 20..219, y 20..99) in a 240×120 frame; channel 1 = 50 + 1000·exp(−x/λ)
// with λ = 40 px above the axis (y < 59.5, left of A→P = +x in image coordinates) and 25 px below, no noise.
const W = 240, H = 120;
function scene(): { projected: ProjectedStack; detection: Detection } {
  const mask = new Uint8Array(W * H);
  const g = new Float32Array(W * H);
  for (let y = 0; y < H; y++) for (let x = 0; x < W; x++) {
    const i = y * W + x;
    const inside = x >= 20 && x < 220 && y >= 20 && y < 100;
    mask[i] = inside ? 1 : 0;
    g[i] = inside ? 50 + 1000 * Math.exp(-(x - 19.5) / (y < 59.5 ? 40 : 25)) : 0;
  }
  const m = { width: W, height: H, data: mask };
  return {
    projected: { channels: [{ width: W, height: H, data: g }], channelNames: ['grad'], pixelSizeUm: 1, pixelSizeSource: 'ome', projection: 'mean', sliceIndex: null, warnings: [] },
    detection: { mask: m, outline: maskOutline(m), axis: { anterior: { x: 19.5, y: 59.5 }, posterior: { x: 219.5, y: 59.5 }, source: 'auto' }, eggLengthUm: 200, eggWidthUm: 80, warnings: [] },
  };
}
const settings = (profile: Partial<AnalysisSettings['profile']>): AnalysisSettings => ({
  ...DEFAULT_SETTINGS, background: { mode: 'none', regionPx: null }, boundaryChannels: [],
  profile: { ...DEFAULT_SETTINGS.profile, edgeDepthUm: 5, binCount: 50, ...profile },
});

describe('the edge band with each side measured on its own', () => {
  const { projected, detection } = scene();
  const measure = (s: AnalysisSettings) => measureEmbryo(prepareSampling(projected, detection, s), detection.axis, s, []);

  it('pools both sides for the main profile, exactly as --edge-side both, and adds each side', () => {
    const each = measure(settings({ edgeSide: 'each' }));
    const both = measure(settings({ edgeSide: 'both' }));
    expect(each.gradientProfile).toEqual(both.gradientProfile);
    expect(each.gradientFit).toEqual(both.gradientFit);
    expect(both.sides).toBeUndefined();
    const count = (p: { n: Float64Array }) => p.n.reduce((a, v) => a + v, 0);
    // Source: hand count: rows 20..24 (depth ≤ 5 px) × 200 columns, plus the 5 columns at each pole for rows 25..59.
    expect(count(each.sides!.dorsalProfile)).toBe(200 * 5 + 2 * 5 * 35);
    expect(count(each.sides!.ventralProfile)).toBe(200 * 5 + 2 * 5 * 35);
    expect(each.sides!.dorsalProfile).toEqual(measure(settings({ edgeSide: 'dorsal' })).gradientProfile);
    expect(each.sides!.ventralProfile).toEqual(measure(settings({ edgeSide: 'ventral' })).gradientProfile);
  });

  it('fits each side (noise-free: λ exact) and gives the difference; dorsal on the other side swaps them', () => {
    // Source: demo data built from λ = 40 px left of A→P and 25 px right of it, over an egg length of 200 px.
    // The pole columns of the band mix both sides' values near x = 0, outside the fit range 0.1–0.6 EL.
    const left = measure(settings({ edgeSide: 'each', dorsalSide: 'left' })).sides!;
    expect(left.dorsalFit!.lambdaUm).toBeCloseTo(40, 3);
    expect(left.ventralFit!.lambdaUm).toBeCloseTo(25, 3);
    expect(left.difference!.lambdaUm).toBeCloseTo(15, 3);
    expect(left.difference!.lambdaEl).toBeCloseTo(15 / 200, 5);
    const right = measure(settings({ edgeSide: 'each', dorsalSide: 'right' })).sides!;
    expect(right.difference!.lambdaUm).toBeCloseTo(-15, 3);
    // Source: demo data: λ does not change with depth here, so the outer half of the band gives the same difference
    // and the depth term is 0 (the interval is the model's).
    expect(left.difference!.depthTermEl).toBeCloseTo(0, 6);
    expect(left.dorsalFit!.depthTermEl).toBeCloseTo(0, 6);
    expect(left.ventralFit!.depthTermEl).toBeCloseTo(0, 6);
  });

  it('outlines the two sides\' bands separately', () => {
    const s = settings({ edgeSide: 'each' });
    const rings = sampleBandOutline(prepareSampling(projected, detection, s), detection.axis, s);
    expect(rings).toHaveLength(2); // one closed band per side (the pooled band has an outer and an inner ring)
  });
});

describe('an embryo painted with a different λ on each side (the project\'s generator, demo data)', () => {
  it('recovers both decay lengths and their difference within their 95% intervals', async () => {
    // Source: demo data built with λ = 100 µm left of A→P (dorsal by default) and 70 µm right of it.
    const e = makeSyntheticEmbryo({ sizeZ: 4, lambdaUm: 100, rightLambdaUm: 70, angleDeg: 25 }, 5);
    const s: AnalysisSettings = { ...DEFAULT_SETTINGS, profile: { ...DEFAULT_SETTINGS.profile, edgeSide: 'each' } };
    const r = await analyseStack(syntheticStackInfo(e), syntheticPlaneSource(e), s, { fileLabel: 'sides.ome.tif' });
    expect(r.status).toBe('ok');
    const { dorsalFit, ventralFit, difference } = r.sides!;
    expect(dorsalFit!.lambdaCiLowUm).toBeLessThanOrEqual(100);
    expect(dorsalFit!.lambdaCiHighUm).toBeGreaterThanOrEqual(100);
    expect(ventralFit!.lambdaCiLowUm).toBeLessThanOrEqual(70);
    expect(ventralFit!.lambdaCiHighUm).toBeGreaterThanOrEqual(70);
    expect(difference!.ciLowUm).toBeLessThanOrEqual(30);
    expect(difference!.ciHighUm).toBeGreaterThanOrEqual(30);
    expect(difference!.ciLowUm).toBeGreaterThan(0); // and the difference is resolved
  });
});

describe('the depth term of the difference', () => {
  // Source: hand calculation (demo data): Δ = 0.05 EL with SE 0.03 and t = 2 (interval 0.05 ± 0.06); the outer half
  // gives 0.13, so T = |0.05 − 0.13|/2 = 0.04, SE' = √(0.03² + 0.04²) = 0.05 and the interval 0.05 ± 2·0.05.
  const d = { lambdaUm: 25, lambdaEl: 0.05, seUm: 15, seEl: 0.03, ciLowUm: -5, ciHighUm: 55, ciLowEl: -0.01, ciHighEl: 0.11, seModelEl: 0.03, seSerialEl: 0.02, seSource: 'model', sideCorrelation: 0.1, dof: 20 } as DecayLengthDifference;
  it('adds half the change with the outer half of the band in quadrature and keeps the t quantile', () => {
    const r = withDepthTerm(d, { ...d, lambdaUm: 65, lambdaEl: 0.13 });
    expect(r.depthTermEl).toBeCloseTo(0.04, 12);
    expect(r.seEl).toBeCloseTo(0.05, 12);
    expect(r.seUm).toBeCloseTo(25, 9); // µm: T = |25 − 65|/2 = 20, √(15² + 20²) = 25
    expect([r.ciLowEl, r.ciHighEl]).toEqual([expect.closeTo(-0.05, 12), expect.closeTo(0.15, 12)]);
    expect([r.ciLowUm, r.ciHighUm]).toEqual([expect.closeTo(-25, 9), expect.closeTo(75, 9)]);
    expect([r.lambdaEl, r.seModelEl, r.seSource, r.dof]).toEqual([0.05, 0.03, 'model', 20]);
  });
  it('leaves the difference as it is when the outer half could not be fitted', () => {
    expect(withDepthTerm(d, null)).toBe(d);
  });
});

describe('the depth term of each side\'s own λ', () => {
  // Source: hand calculation (demo data): λ = 100 µm = 0.2 EL (egg 500 µm) with SE 3 µm and t = 2 (interval 94–106);
  // the outer half gives 108 µm, so T = |100 − 108|/2 = 4 µm = 0.008 EL, SE' = √(3² + 4²) = 5 µm and the interval
  // 100 ± 2·5.
  const fit = { lambdaUm: 100, lambdaEl: 0.2, lambdaSeUm: 3, lambdaSeEl: 0.006, lambdaCiLowUm: 94, lambdaCiHighUm: 106, lambdaSeModelUm: 3, lambdaSeSerialUm: 2, lambdaSeSource: 'model' } as ExponentialFit;
  it('adds half the change with the outer half of the band in quadrature and keeps the t quantile', () => {
    const r = sideWithDepthTerm(fit, { ...fit, lambdaUm: 108, lambdaEl: 0.216 });
    expect(r.depthTermEl).toBeCloseTo(0.008, 12);
    expect(r.lambdaSeUm).toBeCloseTo(5, 12);
    expect(r.lambdaSeEl).toBeCloseTo(0.01, 12);
    expect([r.lambdaCiLowUm, r.lambdaCiHighUm]).toEqual([expect.closeTo(90, 9), expect.closeTo(110, 9)]);
    expect([r.lambdaUm, r.lambdaSeModelUm, r.lambdaSeSerialUm, r.lambdaSeSource]).toEqual([100, 3, 2, 'model']);
  });
  it('widens only the SE in EL when the pixel size is unknown, and leaves the fit when the outer half failed', () => {
    const noPx = { ...fit, lambdaUm: NaN, lambdaSeUm: NaN, lambdaCiLowUm: NaN, lambdaCiHighUm: NaN };
    const r = sideWithDepthTerm(noPx, { ...noPx, lambdaEl: 0.216 });
    expect(r.lambdaSeEl).toBeCloseTo(0.01, 12);
    expect(r.lambdaSeUm).toBeNaN();
    expect(sideWithDepthTerm(fit, null)).toBe(fit);
  });
});

describe('the weights a side\'s fit carries', () => {
  it('are n/SD² of the filled bins inside the fit range, in the fit\'s point order, and the fit is fitProfile\'s', () => {
    // Demo data: 12 bins over 0–1 EL of 100·exp(−x/0.3) + 5 with a small wiggle, SD 2 and n = 4 except bin 3 (empty,
    // n = 0), bin 5 (SD 4) and bin 7 (n = 16). Source: hand calculation of n/SD²: 4/4 = 1, 4/16 = 0.25, 16/4 = 4.
    const xEl = Float64Array.from({ length: 12 }, (_, i) => (i + 0.5) / 12);
    const sd = new Float64Array(12).fill(2); sd[5] = 4;
    const n = new Float64Array(12).fill(4); n[3] = 0; n[7] = 16;
    const mean = Float64Array.from(xEl, (x, i) => (n[i] === 0 ? NaN : 100 * Math.exp(-x / 0.3) + 5 + 0.3 * Math.sin(7 * i)));
    const profile = { channel: 'g', xEl, xUm: xEl.map((x) => x * 500), mean, sd, n };
    const warnings: string[] = [];
    const carried = fitProfileWeighted(profile, 500, 1, [0.1, 0.7], warnings)!;
    // Bins 1–7 have centres ((i + 0.5)/12) within 0.1–0.7; bin 3 is empty.
    expect(Array.from(carried.fit.xEl)).toEqual([1, 2, 4, 5, 6, 7].map((i) => xEl[i]));
    expect(Array.from(carried.weights!)).toEqual([1, 1, 1, 0.25, 1, 4]);
    expect(carried.fit).toEqual(fitProfile(profile, 500, 1, [0.1, 0.7], []));
    expect(warnings).toEqual([]);
  });
});
