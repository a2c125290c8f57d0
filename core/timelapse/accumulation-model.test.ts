import { describe, expect, it } from 'vitest';
import { createRng } from '../stats';
import { fitAccumulationModel, sddAccumulationTimeS } from './accumulation-model';

const EL = 500;
const grid = Float64Array.from({ length: 41 }, (_, i) => i / 40);
const xUm = grid.map((v) => v * EL);

describe('sddAccumulationTimeS', () => {
  it('is 1/(2k) at the source and grows by 1/(2k) per λ', () => {
    // Source: τ(x) = (1 + x/λ)/(2k) (Berezhkovskii, Sample & Shvartsman 2010 — from memory, re-derived in the module).
    expect(sddAccumulationTimeS(0, 100, 1 / 600)).toBeCloseTo(300, 10);
    expect(sddAccumulationTimeS(100, 100, 1 / 600)).toBeCloseTo(600, 10);
  });
});

describe('fitAccumulationModel', () => {
  it('recovers τ₀, k, λ_τ and D from exact model values and reads them as agreeing', () => {
    // Demo data: exact τ(x) of the model with k = 1/600 s⁻¹ and λ = 100 µm, plus tiny seeded noise.
    const rng = createRng(3);
    const tau = xUm.map((x) => sddAccumulationTimeS(x, 100, 1 / 600) + 0.5 * rng.normal());
    const se = tau.map(() => 0.5);
    const fit = fitAccumulationModel(xUm, grid, tau, se, { eggLengthUm: EL, steady: { lambdaUm: 100, lambdaSeUm: 1 } });
    expect(fit.n).toBe(13); // x/EL 0.1, 0.125, …, 0.4
    expect(fit.tau0S.value).toBeCloseTo(300, 0);
    expect(fit.kPerS.value * 600).toBeCloseTo(1, 2);
    expect(fit.lambdaTauUm.value).toBeCloseTo(100, 0);
    expect(fit.lambdaTauEl.value).toBeCloseTo(0.2, 2);
    // D = kλ² = 10⁴/600 µm²/s.
    expect(fit.dUm2PerS.value / (1e4 / 600)).toBeCloseTo(1, 2);
    expect(fit.dUm2PerS.ciLow).toBeLessThan(1e4 / 600);
    expect(fit.dUm2PerS.ciHigh).toBeGreaterThan(1e4 / 600);
    expect(fit.kPerS.ciLow).toBeLessThan(1 / 600);
    expect(fit.kPerS.ciHigh).toBeGreaterThan(1 / 600);
    expect(fit.agreement).toBe('agree');
    expect(fit.reading).toMatch(/^λ_τ = 0\.20 EL .* agree within the 95% interval/);
  });

  it('reads a λ_τ half again as long as λ as differing, and says which way', () => {
    const tau = xUm.map((x) => sddAccumulationTimeS(x, 150, 1 / 600));
    const tauNoisy = tau.map((v, i) => v + (i % 2 ? 1 : -1));
    const fit = fitAccumulationModel(xUm, grid, tauNoisy, tau.map(() => 1), { eggLengthUm: EL, steady: { lambdaUm: 100, lambdaSeUm: 2 } });
    expect(fit.agreement).toBe('differ');
    expect(fit.reading).toMatch(/λ_τ is 5\d% longer/);
  });

  it('leaves λ_τ unresolved when τ does not rise with x', () => {
    const rng = createRng(9);
    const tau = xUm.map(() => 300 + 20 * rng.normal());
    const fit = fitAccumulationModel(xUm, grid, tau, tau.map(() => NaN), { eggLengthUm: EL, steady: null });
    expect(fit.agreement).toBe('unresolved');
    expect(Number.isNaN(fit.lambdaTauUm.ciLow)).toBe(true);
    expect(fit.reading).toMatch(/not resolved/);
  });

  it('rejects too few positions with a one-line message', () => {
    expect(() => fitAccumulationModel(xUm, grid, xUm.map(() => NaN), xUm, { eggLengthUm: EL, steady: null })).toThrow(
      'fitAccumulationModel: only 0 positions with a measured τ in [0.1, 0.4] x/EL; need at least 3');
  });
});
