// Coverage of each embryo's 95% interval of λ on independent synthetic embryos at the demo's 1.5 µm/px (demo data),
// analysed with the default settings. scripts/lambda-coverage.ts runs the same study with more embryos and other
// band depths.
import { describe, expect, it } from 'vitest';
import { coverageLine, lambdaCoverageStudy, summariseCoverage } from './lambda-coverage-study';

const EMBRYOS = 50;

describe('λ intervals on synthetic embryos at 1.5 µm/px (demo data)', () => {
  it(`hold the true λ for ≥ 90% of ${EMBRYOS} embryos, with a mean error small against the SE`, async () => {
    const rows = await lambdaCoverageStudy(EMBRYOS, 50_000);
    const s = summariseCoverage(rows, 100);
    console.log(coverageLine('default settings (20 µm band)', s));
    expect(rows.every((r) => Number.isFinite(r.lambdaUm))).toBe(true);
    // Source: project requirement (≥ 90% for a nominal 95% interval on the project's own synthetic embryos).
    expect(s.covered / s.n).toBeGreaterThanOrEqual(0.9);
    // The mean error must be small against one embryo's SE: a bias of 0.4 SE lowers a 95% interval's coverage to
    // about 93% (normal approximation: Φ(1.96 − 0.4) − Φ(−1.96 − 0.4); from memory). The 12 µm band of earlier
    // versions had a bias of 0.3–0.85 SE.
    expect(Math.abs(s.biasUm)).toBeLessThan(0.4 * s.meanSeUm);
    // Source: statistics text (a standardised error has RMS 1 when the SE is right; 0.8–1.25 allows for 50 draws).
    expect(s.rmsZ).toBeGreaterThan(0.8);
    expect(s.rmsZ).toBeLessThan(1.25);
  }, 300_000);
});
