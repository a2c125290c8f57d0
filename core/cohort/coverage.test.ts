import { describe, expect, it } from 'vitest';
import { createRng } from '../stats';
import { analyseCohort } from './analyse';
import { makeDemoCohort } from './demo-cohort';
import { parseSampleSheet } from './sample-sheet';
import { welchDifference } from './welch';

// Coverage checks: a 95% interval should contain the true value in about 95% of seeded repeats.
// Bands allow for binomial scatter (SD ≈ 1.5% at 200 repeats) — common practice for coverage tests.
describe('interval coverage (seeded)', () => {
  it('Welch CI covers the true difference about 95% of the time (unequal n and variances)', () => {
    // Source: demo data: normal samples, means 0 and 1, SDs 1 and 3, n = 4 and 9
    const rng = createRng(99);
    let hits = 0;
    for (let r = 0; r < 2000; r++) {
      const a = Array.from({ length: 4 }, () => rng.normal());
      const b = Array.from({ length: 9 }, () => 1 + 3 * rng.normal());
      const d = welchDifference(a, b);
      if (d.ciLow <= 1 && d.ciHigh >= 1) hits++;
    }
    expect(hits / 2000).toBeGreaterThan(0.93);
    expect(hits / 2000).toBeLessThan(0.975);
  });
  it('slope of position on ln f covers λ = 0.2, and the ratio CI covers 1, in about 95% of demo series', () => {
    // Source: demo data built with λ = 0.2 EL and a fixed threshold (x_b = λ·ln(A·f/T)) plus seeded noise
    let slopeHits = 0;
    let ratioHits = 0;
    let ratios = 0;
    const repeats = 200;
    for (let seed = 1; seed <= repeats; seed++) {
      const demo = makeDemoCohort({ conditions: [0.5, 1, 2, 4].map((d) => ({ name: `f${d}`, dosage: d, count: 6 })), seed });
      const a = analyseCohort(demo.results, parseSampleSheet(demo.sheetCsv, 's.csv'));
      const fit = a.dosageFits[0];
      if (fit.ciLow <= 0.2 && fit.ciHigh >= 0.2) slopeHits++;
      for (const s of a.shifts.filter((x) => x.quantity === fit.quantity)) {
        ratios++;
        if ((s.ratioCiLow as number) <= 1 && (s.ratioCiHigh as number) >= 1) ratioHits++;
      }
    }
    expect(slopeHits / repeats).toBeGreaterThan(0.9);
    expect(ratioHits / ratios).toBeGreaterThan(0.9);
    expect(ratioHits / ratios).toBeLessThan(0.995);
  });
});
