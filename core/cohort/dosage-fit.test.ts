import { describe, expect, it } from 'vitest';
import type { EmbryoResult } from '../model';
import { createRng, linearRegression } from '../stats';
import { analyseCohort } from './analyse';
import { makeDemoCohort } from './demo-cohort';
import { parseSampleSheet } from './sample-sheet';

// Demo data: λ = 0.2 EL, a fixed-threshold boundary (x_b = λ·ln(A·f/T)), four dosages with six embryos each.
const demo = makeDemoCohort({ conditions: [0.5, 1, 2, 4].map((d) => ({ name: `f${d}`, dosage: d, count: 6 })), seed: 3 });
const sheet = parseSampleSheet(demo.sheetCsv, 's.csv');

/** The same results with each amplitude scattered by a seeded 10% (a measured dosage needs a spread). */
function scatterAmplitudes(results: readonly EmbryoResult[]): EmbryoResult[] {
  const rng = createRng(5);
  return results.map((r) => ({ ...r, gradientFit: r.gradientFit && { ...r.gradientFit, amplitude: r.gradientFit.amplitude * (1 + 0.1 * rng.normal()) } }));
}

describe('dosage inference at the condition level', () => {
  it('fits the condition means with k − 2 degrees of freedom and reports the alternatives', () => {
    const a = analyseCohort(scatterAmplitudes(demo.results), sheet);
    const fit = a.dosageFits.find((f) => f.quantity === 'boundary:target:logistic')!;
    expect(fit.method).toBe('condition-means');
    expect([fit.conditions, fit.n, fit.dof]).toEqual([4, 24, 2]);
    // Source: the same line by ordinary least squares through the four condition means (core/stats, NIST-checked
    // straight-line code).
    const means = [0.5, 1, 2, 4].map((d) => {
      const v = a.observations.filter((o) => o.quantity === fit.quantity && o.unit === 'EL' && o.condition === `f${d}`).map((o) => o.value);
      return v.reduce((s, e) => s + e, 0) / v.length;
    });
    const ref = linearRegression([0.5, 1, 2, 4].map(Math.log), means);
    expect(fit.slopeEl).toBeCloseTo(ref.slope, 12);
    expect(fit.ciHigh).toBeCloseTo(ref.slopeCi[1], 12);
    expect(fit.ciLow).toBeLessThan(0.2);
    expect(fit.ciHigh).toBeGreaterThan(0.2);
    expect(fit.lackOfFit!.df1).toBe(2);
    expect(fit.lackOfFit!.df2).toBe(20);
    expect(fit.embryosHc3!.dof).toBe(22);
    expect(fit.randomIntercept!.tau2).toBeGreaterThanOrEqual(0);
    // Measured dosage: amplitude ratios near the nominal 0.5, 2, 4, and a York slope near λ.
    const ratios = Object.fromEntries(a.measuredDosages.map((m) => [m.condition, m.amplitudeRatio]));
    expect(ratios.f1).toBe(1);
    expect(ratios.f4).toBeGreaterThan(3.4);
    expect(ratios.f4).toBeLessThan(4.6);
    expect(fit.measured!.ciLow).toBeLessThan(0.2);
    expect(fit.measured!.ciHigh).toBeGreaterThan(0.2);
    // λ does not depend on dosage in the demo: its trend's interval holds 0.
    expect(a.lambdaTrend!.ciLow).toBeLessThan(0);
    expect(a.lambdaTrend!.ciHigh).toBeGreaterThan(0);
  });
  it('adjusts the shift tests by Holm over conditions and quantities', () => {
    const a = analyseCohort(demo.results, sheet);
    expect(a.shifts.length).toBe(3 * 3);
    const ps = a.shifts.map((s) => s.pRatio!);
    for (const s of a.shifts) expect(s.pRatioHolm!).toBeGreaterThanOrEqual(s.pRatio!);
    // Source: Holm 1979 — the smallest p-value is multiplied by the number of tests.
    const smallest = a.shifts[ps.indexOf(Math.min(...ps))];
    expect(smallest.pRatioHolm!).toBeCloseTo(Math.min(1, 9 * smallest.pRatio!), 12);
  });
  it('falls back to all embryos with HC3 errors when there are only two dosages', () => {
    const two = makeDemoCohort({ conditions: [{ name: 'r', dosage: 1, count: 5 }, { name: 'h', dosage: 2, count: 5 }], seed: 2 });
    const a = analyseCohort(two.results, parseSampleSheet(two.sheetCsv, 's.csv'));
    const fit = a.dosageFits[0];
    expect(fit.method).toBe('embryos-hc3');
    expect(fit.dof).toBe(8);
    expect(fit.slopeSeEl).toBe(fit.embryosHc3!.slopeSe);
    expect(fit.lackOfFit).toBeNull();
    expect(a.lambdaTrend).toBeNull();
  });
});
