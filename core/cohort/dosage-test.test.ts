import { describe, expect, it } from 'vitest';
import { analyseCohort } from './analyse';
import { makeDemoCohort } from './demo-cohort';
import { ratioWithCi, slopeRatio, twoGradientShiftEl } from './dosage-test';
import type { DosageFit } from '../model';
import { parseSampleSheet } from './sample-sheet';

function series(dosages: number[], count: number, seed: number) {
  const demo = makeDemoCohort({ conditions: dosages.map((d) => ({ name: `f${d}`, dosage: d, count })), seed });
  return analyseCohort(demo.results, parseSampleSheet(demo.sheetCsv, 'samples.csv'));
}

describe('dosage test (threshold model Δx = λ·ln f)', () => {
  it('sign rule: f > 1 moves boundaries posterior (Δx > 0), f < 1 anterior (Δx < 0)', () => {
    // Source: threshold model x_b = λ·ln(A·f/T) (from memory); demo data
    const a = series([0.5, 1, 2], 6, 11);
    for (const s of a.shifts) {
      const sign = Math.sign(Math.log(s.dosage as number));
      expect(Math.sign(s.predictedShiftEl as number)).toBe(sign);
      expect(Math.sign(s.observedShiftEl)).toBe(sign);
    }
    expect(a.shifts.length).toBe(2 * 3); // 2 boundaries + 1 landmark, 2 non-reference conditions
  });
  it('runs over dosages 0.5–6 without trouble and the observed/predicted ratio covers 1', () => {
    // Source: dosage range 0.5–6 is one the field has used (from memory); demo data
    const a = series([0.5, 1, 1.5, 2, 3, 4, 6], 8, 5);
    expect(a.shifts.length).toBe(6 * 3);
    for (const s of a.shifts) {
      for (const v of [s.observedShiftEl, s.ciLow, s.ciHigh, s.predictedShiftEl, s.ratio, s.ratioCiLow, s.ratioCiHigh]) expect(Number.isFinite(v)).toBe(true);
      if (Math.abs(s.lnF as number) > 0.6) {
        expect(s.ratioCiLow as number).toBeLessThan(1);
        expect(s.ratioCiHigh as number).toBeGreaterThan(1);
      }
    }
  });
  it('regression of position on ln f recovers slope = λ within its CI (synthetic series, known λ, fixed threshold)', () => {
    // Source: demo data built with λ = 0.2 EL and x_b = λ·ln(A·f/T) plus seeded noise
    for (const seed of [1, 2, 3]) {
      const a = series([0.5, 1, 2, 4], 10, seed);
      const fit = a.dosageFits.find((f) => f.quantity === 'boundary:target:logistic');
      expect(fit).toBeDefined();
      expect(fit!.ciLow).toBeLessThan(0.2);
      expect(fit!.ciHigh).toBeGreaterThan(0.2);
      expect(fit!.n).toBe(40);
      expect(fit!.predictedSlopeEl!).toBeCloseTo(0.2, 1);
      // intercept = λ·ln(A/T) = 0.2·ln(1000/105) ≈ 0.4508 x/EL
      expect(fit!.interceptEl).toBeCloseTo(0.2 * Math.log(1000 / 105), 1);
    }
  });
  it('the predicted interval is λ’s interval scaled by ln f (ends swap for f < 1)', () => {
    // Source: demo data; propagation with ln f exact (hand rule)
    const a = series([0.5, 1], 5, 9);
    const lam = a.referenceLambda!;
    const s = a.shifts[0];
    expect(s.predictedShiftEl).toBeCloseTo(lam.lambdaEl * Math.log(0.5), 12);
    expect(s.predictedCiLow).toBeCloseTo(lam.ciHighEl * Math.log(0.5), 12);
    expect(s.predictedCiHigh).toBeCloseTo(lam.ciLowEl * Math.log(0.5), 12);
  });
  it('two opposing gradients: Δx = ln f / (1/λA + 1/λP)', () => {
    // Source: hand-computed: ln 2 / (1/0.2 + 1/0.2) = ln 2 / 10
    expect(twoGradientShiftEl(Math.log(2), 0.2, 0.2)).toBeCloseTo(Math.log(2) / 10, 14);
    const demo = makeDemoCohort({ conditions: [{ name: 'r', dosage: 1, count: 4 }, { name: 'd', dosage: 2, count: 4 }], seed: 4 });
    const a = analyseCohort(demo.results, parseSampleSheet(demo.sheetCsv, 's.csv'), { lambdaPosteriorEl: 0.3 });
    const lam = a.referenceLambda!.lambdaEl;
    expect(a.shifts[0].predictedTwoGradientEl).toBeCloseTo(Math.log(2) / (1 / lam + 1 / 0.3), 12);
  });
  it('gives Fieller\'s interval and g beside the delta method\'s', () => {
    // Source: test/stats-reference/fieller_reference.py (numpy roots of Fieller's quadratic; demo data).
    const r = ratioWithCi(0.17, 0.0075, 10, 0.19, 0.005, 12);
    expect(r.ratioFiellerLow).toBeCloseTo(0.7951893747895242, 8);
    expect(r.ratioFiellerHigh).toBeCloseTo(1.0004579073597557, 8);
    expect(r.fiellerG).toBeCloseTo(0.003438090542683957, 9);
    // g ≥ 1: the prediction is not distinguishable from 0 and Fieller's set is unbounded.
    const wide = ratioWithCi(0.3, 0.05, 10, 0.05, 0.04, 10);
    expect([wide.ratioFiellerLow, wide.ratioFiellerHigh]).toEqual([null, null]);
    expect(wide.fiellerG).toBeGreaterThan(1);
  });
  it('ratio interval by the delta method on a hand case; none when the prediction is 0', () => {
    // Source: hand-computed: O = 0.1 ± 0.02, P = 0.2 ± 0.01 → r = 0.5, se = sqrt(0.1² + 0.025²); t(0.975, 4) = 2.776445 (from memory)
    const r = ratioWithCi(0.1, 0.02, 4, 0.2, 0.01, 10);
    const se = Math.sqrt(0.1 ** 2 + 0.025 ** 2);
    expect(r.ratio).toBeCloseTo(0.5, 14);
    expect(r.ratioCiLow!).toBeCloseTo(0.5 - 2.776445 * se, 5);
    expect(r.ratioCiHigh!).toBeCloseTo(0.5 + 2.776445 * se, 5);
    expect(ratioWithCi(0.1, 0.02, 4, 0, 0.01, 10)).toEqual({ ratio: null, ratioCiLow: null, ratioCiHigh: null, ratioFiellerLow: null, ratioFiellerHigh: null, fiellerG: null, pRatio: null });
  });
  it('slopeRatio: λ_eff / λ_ref with both uncertainties (known answer)', () => {
    // Source: hand-computed: 0.19 / 0.2 = 0.95; SE = √((0.01/0.2)² + (0.19·0.005/0.2²)²) = 0.0553535;
    // dof = min(12 − 2, 6 − 1) = 5, t(0.975, 5) = 2.570582 (t table, from memory) → half-width 0.1422918.
    const fit: DosageFit = {
      quantity: 'q', method: 'embryos-hc3', slopeEl: 0.19, slopeSeEl: 0.01, ciLow: 0, ciHigh: 0, interceptEl: 0, r2: 1, n: 12,
      conditions: 2, dof: 10, pSlope: 0, lackOfFit: null, embryosHc3: null, randomIntercept: null, measured: null,
      predictedSlopeEl: 0.2, predictedTwoGradientSlopeEl: null, localLambdaEl: null, localLambdaSeEl: null,
    };
    const lam = { condition: 'ref', n: 6, lambdaEl: 0.2, seEl: 0.005, ciLowEl: 0, ciHighEl: 0, dof: 5 };
    const r = slopeRatio(fit, lam);
    expect(r.ratio).toBeCloseTo(0.95, 12);
    expect(r.ratioCiHigh! - 0.95).toBeCloseTo(0.1422918, 5);
    expect(0.95 - r.ratioCiLow!).toBeCloseTo(0.1422918, 5);
    // Source: t test of ratio = 1: t = −0.05/0.0553535 = −0.9033 on 5 dof, two-sided p = 0.4078 (scipy.stats.t.sf).
    expect(r.pRatio!).toBeCloseTo(0.4078, 3);
    expect(slopeRatio(fit, null)).toEqual({ ratio: null, ratioCiLow: null, ratioCiHigh: null, ratioFiellerLow: null, ratioFiellerHigh: null, fiellerG: null, pRatio: null });
  });
});
