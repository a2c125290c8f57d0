import { describe, expect, it } from 'vitest';
import type { EmbryoResult, Profile } from '../model';
import { makeDemoCohort } from './demo-cohort';
import { centralSlope, conditionProfile, gridEl, interpolateOnGrid, normaliseProfile } from './profiles';

const f64 = (v: number[]): Float64Array => Float64Array.from(v);

describe('profile helpers', () => {
  it('grid from 0 to 1 inclusive', () => {
    // Source: hand-computed
    expect([...gridEl(0.25)]).toEqual([0, 0.25, 0.5, 0.75, 1]);
    expect(gridEl(0.01).length).toBe(101);
  });
  it('linear interpolation with NaN outside the data (no extrapolation) and NaN inputs skipped', () => {
    // Source: hand-computed
    const out = interpolateOnGrid(f64([0.1, 0.3, 0.5, 0.7]), f64([10, 20, NaN, 40]), f64([0, 0.1, 0.2, 0.4, 0.6, 0.7, 0.8]));
    expect([...out]).toEqual([NaN, 10, 15, 25, 35, 40, NaN]);
  });
  it('normalisation: none, ÷ amplitude, min-max; null when impossible', () => {
    // Source: hand-computed
    expect([...normaliseProfile(f64([2, 4, 6]), 'none', null)!]).toEqual([2, 4, 6]);
    expect([...normaliseProfile(f64([2, 4, 6]), 'amplitude', 4)!]).toEqual([0.5, 1, 1.5]);
    expect([...normaliseProfile(f64([2, 4, 6]), 'minmax', null)!]).toEqual([0, 0.5, 1]);
    expect(normaliseProfile(f64([2, 4]), 'amplitude', null)).toBeNull();
    expect(normaliseProfile(f64([3, 3]), 'minmax', null)).toBeNull();
  });
  it('central slope over ±k grid steps; NaN at the ends', () => {
    // Source: hand-computed: y = x² on x = 0..4 (step 1), k = 1 → slope 2x
    const s = centralSlope(f64([0, 1, 2, 3, 4]), f64([0, 1, 4, 9, 16]), 1);
    expect([...s]).toEqual([NaN, 2, 4, 6, NaN]);
  });
});

function linearEmbryo(file: string, offset: number): EmbryoResult {
  // C(x) = 100 + offset − 50·x on bins 0.005..0.995: slope −50 per EL everywhere
  const xEl = Float64Array.from({ length: 100 }, (_, i) => (i + 0.5) / 100);
  const mean = xEl.map((x) => 100 + offset - 50 * x);
  const profile: Profile = { channel: 'g', xEl, xUm: xEl.map((x) => 400 * x), mean, sd: mean.map(() => 0), n: mean.map(() => 1) };
  const base = makeDemoCohort({ conditions: [{ name: 'c', dosage: 1, count: 1 }] }).results[0];
  return { ...base, file, eggLengthUm: 400, gradientProfile: profile };
}

describe('conditionProfile (positional error σx = σC / |dC̄/dx|)', () => {
  it('two linear profiles offset by ±0.1: SD 0.1·√2, slope −50 /EL → σx = 0.1·√2/50 EL and ×400 µm', () => {
    // Source: hand-computed (Gregor et al. 2007 definition of σx)
    const r = conditionProfile([linearEmbryo('a', 0.1), linearEmbryo('b', -0.1)], { name: 'c', dosage: 1, factor: 1 },
      { normalisation: 'none', gridStepEl: 0.01, slopeHalfWidthEl: 0.02 });
    const p = r.profile!;
    const i = 50; // x = 0.5
    expect(p.xEl[i]).toBeCloseTo(0.5, 12);
    expect(p.mean[i]).toBeCloseTo(75, 9);
    expect(p.sd[i]).toBeCloseTo(0.1 * Math.SQRT2, 9);
    expect(p.slopePerEl[i]).toBeCloseTo(-50, 9);
    expect(p.sigmaXEl[i]).toBeCloseTo((0.1 * Math.SQRT2) / 50, 9);
    expect(p.sigmaXUm[i]).toBeCloseTo(((0.1 * Math.SQRT2) / 50) * 400, 7);
    expect(p.n[i]).toBe(2);
    expect(p.mean[0]).toBeNaN(); // x = 0 lies before the first bin centre: not extrapolated
  });
  it('is first-order error propagation: embryos shifted along x by δ give σx = SD of δ', () => {
    // Source: the delta method (first-order error propagation: Var g(X) ≈ g′(μ)² Var X), Casella & Berger,
    // Statistical Inference, 2nd ed., §5.5.4 (from memory). A profile shifted by δ reads C(x − δ) ≈ C(x) − C′(x)·δ,
    // so σC = |C′|·SD(δ) and σx = σC/|C′| = SD(δ); for a linear profile the first-order term is exact.
    // Demo data: C(x) = 100 − 50·(x − δ) with δ = ±0.01 EL, i.e. offsets ±0.5; SD(δ) = 0.01·√2 (n − 1).
    const r = conditionProfile([linearEmbryo('a', 50 * 0.01), linearEmbryo('b', -50 * 0.01)], { name: 'c', dosage: 1, factor: 1 },
      { normalisation: 'none', gridStepEl: 0.01, slopeHalfWidthEl: 0.02 });
    expect(r.profile!.sigmaXEl[50]).toBeCloseTo(0.01 * Math.SQRT2, 12);
  });
  it('σx is undefined where the slope is not resolved (change within 2 SE of zero)', () => {
    // Source: hand-computed: offsets ±1 → SD √2, n = 2; change over ±0.02 EL = 2 < 2·√(1 + 1) = 2.83
    const r = conditionProfile([linearEmbryo('a', 1), linearEmbryo('b', -1)], { name: 'c', dosage: 1, factor: 1 },
      { normalisation: 'none', gridStepEl: 0.01, slopeHalfWidthEl: 0.02 });
    expect(r.profile!.slopePerEl[50]).toBeCloseTo(-50, 9);
    expect(r.profile!.sigmaXEl[50]).toBeNaN();
  });
  it('amplitude normalisation leaves out embryos without a fit, with a warning naming the file', () => {
    // Source: demo data
    const e = { ...linearEmbryo('nofit.tif', 0), gradientFit: null };
    const r = conditionProfile([e, linearEmbryo('b', 0)], { name: 'c', dosage: 1, factor: 1 },
      { normalisation: 'amplitude', gridStepEl: 0.01, slopeHalfWidthEl: 0.02 });
    expect(r.warnings).toEqual(['nofit.tif: no amplitude-normalised gradient profile; left out of the mean profile']);
    expect(r.profile!.embryoCount).toBe(1);
  });
  it('scale-offset alignment removes amplitude and background differences before σC', () => {
    // Source: hand-computed — C_i(x) = a_i·(100 − 50x) + b_i are exact scale/offset copies of one profile.
    const scaled = (file: string, a: number, b: number) => {
      const e = linearEmbryo(file, 0);
      const p = e.gradientProfile!;
      return { ...e, gradientProfile: { ...p, mean: p.mean.map((v) => a * v + b) } };
    };
    const embryos = [scaled('a', 1, 0), scaled('b', 1.3, 5), scaled('c', 0.8, -4)];
    const none = conditionProfile(embryos, { name: 'c', dosage: 1, factor: 1 }, { normalisation: 'none', gridStepEl: 0.01, slopeHalfWidthEl: 0.02 }).profile!;
    const aligned = conditionProfile(embryos, { name: 'c', dosage: 1, factor: 1 }, { normalisation: 'scale-offset', gridStepEl: 0.01, slopeHalfWidthEl: 0.02 }).profile!;
    expect(none.sd[50]).toBeGreaterThan(5);
    expect(aligned.normalisation).toBe('scale-offset');
    expect(aligned.sd[50]).toBeLessThan(1e-9);
  });
  it('subtracts the measurement noise of the bin means and gives σx a chi-square interval', () => {
    // Source: hand-computed — pixel SD 2 over n = 4 pixels: noise variance of a bin mean 4/4 = 1; offsets ±1 give an
    // SD across embryos of √2, so σC = √(2 − 1) = 1 and σx = 1/50. χ²(1) quantiles 0.000982 and 5.024 (chi-square
    // table, from memory) give ×0.446 to ×31.9.
    const noisy = (file: string, offset: number) => {
      const e = linearEmbryo(file, offset);
      const p = e.gradientProfile!;
      return { ...e, gradientProfile: { ...p, sd: p.sd.map(() => 2), n: p.n.map(() => 4) } };
    };
    const p = conditionProfile([noisy('a', 1), noisy('b', -1)], { name: 'c', dosage: 1, factor: 1 },
      { normalisation: 'none', gridStepEl: 0.01, slopeHalfWidthEl: 0.1 }).profile!;
    expect(p.sd[50]).toBeCloseTo(Math.SQRT2, 9);
    expect(p.sdNoise[50]).toBeCloseTo(1, 9);
    expect(p.sdBetween[50]).toBeCloseTo(1, 9);
    expect(p.sigmaXEl[50]).toBeCloseTo(1 / 50, 9);
    expect(p.sigmaXCiLowEl[50] / p.sigmaXEl[50]).toBeCloseTo(0.446, 3);
    expect(p.sigmaXCiHighEl[50] / p.sigmaXEl[50]).toBeCloseTo(31.9, 0);
  });
});
