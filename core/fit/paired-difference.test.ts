// The paired difference λ_dorsal − λ_ventral: known answers and the coverage of its 95% interval on synthetic
// two-sided profiles whose errors are correlated between the sides (demo data: known A, λ, B; seeded noise; no images).
import { describe, expect, it } from 'vitest';
import { createRng, tQuantile } from '../stats';
import { fitExponentialDecay } from './exponential';
import { decayLengthDifference } from './paired-difference';

const EGG_UM = 500, BINS = 100, RANGE: [number, number] = [0.1, 0.6];
const xEl = Float64Array.from({ length: BINS }, (_, i) => (i + 0.5) / BINS);
const xUm = xEl.map((v) => v * EGG_UM);
const LAMBDA_D_UM = 100, LAMBDA_V_UM = 80;
const truthOf = (lambdaUm: number): Float64Array => xUm.map((x) => 1000 * Math.exp(-x / lambdaUm) + 50);
const truthD = truthOf(LAMBDA_D_UM), truthV = truthOf(LAMBDA_V_UM);
const TRUE_DIFF_EL = (LAMBDA_D_UM - LAMBDA_V_UM) / EGG_UM;

/** The fit's own points' weights (the fit keeps the points inside the range, in order). */
function usedWeights(weights: Float64Array | undefined): Float64Array | null {
  if (!weights) return null;
  return Float64Array.from(weights.filter((_, i) => xEl[i] >= RANGE[0] && xEl[i] <= RANGE[1]));
}

function fitSide(y: Float64Array, weights?: Float64Array) {
  return { fit: fitExponentialDecay(xUm, y, { eggLengthUm: EGG_UM, fitRangeEl: RANGE, xEl, ...(weights ? { weights } : {}) }), weights: usedWeights(weights) };
}

/** Two AR(1) error series along the bins (lag-1 correlation rho) whose innovations have correlation r: their
 *  correlation at lag l is r·ρ^l. */
function pairedErrors(rng: ReturnType<typeof createRng>, rho: number, r: number): [Float64Array, Float64Array] {
  const d = new Float64Array(BINS), v = new Float64Array(BINS);
  const s = Math.sqrt(1 - rho * rho);
  for (let i = 0; i < BINS; i++) {
    const z1 = rng.normal(), z2 = r * z1 + Math.sqrt(1 - r * r) * rng.normal();
    d[i] = i === 0 ? z1 : rho * d[i - 1] + s * z1;
    v[i] = i === 0 ? z2 : rho * v[i - 1] + s * z2;
  }
  return [d, v];
}

describe('decayLengthDifference, known answers', () => {
  const rng = createRng(7);
  const [ed, ev] = pairedErrors(rng, 0, 0);
  const yd = truthD.map((m, i) => m + 20 * ed[i]);
  const yv = truthV.map((m, i) => m + 20 * ev[i]);

  it('two identical sides differ by 0, with the correlation at its bound 0.95: SE = √(2·V·(1 − 0.95))', () => {
    // Source: Var(a − b) = Var a + Var b − 2·Cov(a, b) (from memory: any statistics text); here Var a = Var b = V
    // and Cov = 0.95·V, the largest correlation the method allows.
    const side = fitSide(yd);
    const diff = decayLengthDifference(side, side, EGG_UM);
    expect(diff).not.toBeNull();
    expect(diff!.lambdaEl).toBe(0);
    expect(diff!.sideCorrelation).toBeCloseTo(0.95, 12);
    const v = diff!.seSource === 'model' ? side.fit.lambdaSeModelUm ** 2 : side.fit.lambdaSeSerialUm ** 2;
    expect(diff!.seUm).toBeCloseTo(Math.sqrt(2 * v * 0.05), 6);
  });

  it('rebuilds each side\'s own SEs from its result: independent sides give nearly √(SE_d² + SE_v²)', () => {
    // Source: the definitions — with independent noise the estimated correlation is near 0 and the difference's
    // model-based SE is that of two independent estimates.
    const d = fitSide(yd), v = fitSide(yv);
    const diff = decayLengthDifference(d, v, EGG_UM)!;
    expect(diff.lambdaUm).toBeCloseTo(d.fit.lambdaUm - v.fit.lambdaUm, 9);
    expect(diff.lambdaEl).toBeCloseTo(diff.lambdaUm / EGG_UM, 12);
    expect(Math.abs(diff.sideCorrelation)).toBeLessThan(0.35);
    const independent = Math.hypot(d.fit.lambdaSeModelUm, v.fit.lambdaSeModelUm) / EGG_UM;
    const covTerm = diff.seModelEl ** 2 - independent ** 2;
    // The only difference from the independent SE is the covariance term, whose size follows the correlation.
    expect(Math.abs(covTerm)).toBeLessThanOrEqual(2 * Math.abs(diff.sideCorrelation) * (d.fit.lambdaSeModelUm / EGG_UM) * (v.fit.lambdaSeModelUm / EGG_UM) * 1.2);
    // Source: the t interval, estimate ± t(0.975, dof)·SE (from memory: any statistics text).
    expect(diff.ciHighEl - diff.lambdaEl).toBeCloseTo(tQuantile(0.975, diff.dof) * diff.seEl, 12);
    expect(diff.dof).toBeLessThanOrEqual(47);
  });

  it('µm values are NaN when the egg length in µm is unknown; EL values stay', () => {
    // Source: the project's rule that NaN means "not measurable" (DEVELOPERS.md).
    const diff = decayLengthDifference(fitSide(yd), fitSide(yv), null)!;
    expect(Number.isNaN(diff.lambdaUm) && Number.isNaN(diff.seUm) && Number.isNaN(diff.ciLowUm)).toBe(true);
    expect(Number.isFinite(diff.lambdaEl) && Number.isFinite(diff.seEl)).toBe(true);
  });
});

interface Scenario { readonly rho: number; readonly r: number; readonly cv: boolean }

/** Coverage of the difference's 95% interval, and of the interval that treats the sides as independent. */
async function coverage({ rho, r, cv }: Scenario, seed: number, trials: number): Promise<{ paired: number; independent: number; widthRatio: number }> {
  const rng = createRng(seed);
  let paired = 0, independent = 0, ratio = 0;
  for (let t = 0; t < trials; t++) {
    // Let the test runner's messages through now and then (a long synchronous loop starves its worker's RPC).
    if (t % 50 === 49) await new Promise((resolve) => setTimeout(resolve, 0));
    const [ed, ev] = pairedErrors(rng, rho, r);
    const sd = (m: number): number => (cv ? 0.06 * m : 20);
    const yd = truthD.map((m, i) => m + sd(m) * ed[i]);
    const yv = truthV.map((m, i) => m + sd(m) * ev[i]);
    const w = (truth: Float64Array) => (cv ? truth.map((m) => 1 / sd(m) ** 2) : undefined);
    const d = fitSide(yd, w(truthD)), v = fitSide(yv, w(truthV));
    const diff = decayLengthDifference(d, v, EGG_UM);
    if (diff === null) continue;
    if (diff.ciLowEl <= TRUE_DIFF_EL && TRUE_DIFF_EL <= diff.ciHighEl) paired++;
    const seInd = Math.hypot(d.fit.lambdaSeEl, v.fit.lambdaSeEl);
    const half = (diff.ciHighEl - diff.lambdaEl) / diff.seEl * seInd;
    if (Math.abs(diff.lambdaEl - TRUE_DIFF_EL) <= half) independent++;
    ratio += diff.seEl / seInd;
  }
  return { paired: paired / trials, independent: independent / trials, widthRatio: ratio / trials };
}

describe('coverage of the 95% interval of λ_dorsal − λ_ventral (demo data, 1000 seeded embryos each)', () => {
  // Source: project requirement — coverage ≥ 93% for a nominal 95% interval; a binomial count over 1000 trials has
  // an SD of 0.7 percentage points at 95%.
  it.each([
    ['errors correlated 0.8 between the sides, independent along x', { rho: 0, r: 0.8, cv: false }, 11],
    ['correlated 0.6 between the sides, AR(1) ρ = 0.4 along x', { rho: 0.4, r: 0.6, cv: false }, 12],
    ['anti-correlated −0.5 between the sides, ρ = 0.3, 6% CV per bin weighted', { rho: 0.3, r: -0.5, cv: true }, 13],
  ])('%s', async (_name, scenario, seed) => {
    const s = scenario as Scenario;
    const { paired, independent, widthRatio } = await coverage(s, seed, 1000);
    expect(paired).toBeGreaterThanOrEqual(0.93);
    expect(paired).toBeLessThanOrEqual(0.99);
    // Treating the sides as independent is too wide when they are positively correlated and too narrow when
    // negatively: the pairing narrows the interval for r > 0 and widens it for r < 0.
    if (s.r > 0) expect(widthRatio).toBeLessThan(0.8);
    else { expect(widthRatio).toBeGreaterThan(1.1); expect(independent).toBeLessThan(paired); }
  });
});
